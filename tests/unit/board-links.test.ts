import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { keyAction, pinchStep, wheelFactor } from '../../src/lib/board/gestures';
import {
	markerAt,
	markerCentre,
	movedLocation,
	readingOrder,
	visibleMarkers,
	type Marker
} from '../../src/lib/board/markers';
import { parseViewLink, viewParams, writeViewLink } from '../../src/lib/board/view-params';
import { markerLocation } from '../../src/lib/schemas/location';

describe('the view in the URL', () => {
	it('reads every parameter', () => {
		const query = new URLSearchParams('sheet=2&zoom=800&centre=0.25,0.75&show=finding-12');
		expect(parseViewLink(query, 3)).toEqual({
			link: { sheet: 2, zoom: 8, centre: { x: 0.25, y: 0.75 }, show: 'finding-12' },
			problems: []
		});
		expect(Object.values(viewParams)).toEqual(['sheet', 'zoom', 'centre', 'show']);
	});

	it('leaves out and names what it does not understand', () => {
		const query = new URLSearchParams('sheet=9&zoom=huge&centre=2,0.5&show=<script>');
		const { link, problems } = parseViewLink(query, 2);
		expect(link).toEqual({});
		expect(problems).toHaveLength(4);
		expect(problems[0]).toContain('sheets 1 to 2');
		expect(parseViewLink(new URLSearchParams('zoom=0.5'), 1).problems[0]).toContain(
			'from 2 to 800'
		);
	});

	it('keeps other parameters and reads back what it wrote', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 1, max: 40 }),
				fc.double({ min: 0.02, max: 8, noNaN: true }),
				fc.double({ min: 0, max: 1, noNaN: true }),
				fc.double({ min: 0, max: 1, noNaN: true }),
				fc.stringMatching(/^[a-z]+-[0-9]{1,4}$/),
				(sheet, zoom, x, y, show) => {
					const query = writeViewLink(new URLSearchParams('tab=notes&zoom=3'), {
						sheet,
						zoom,
						centre: { x, y },
						show
					});
					expect(query.get('tab')).toBe('notes');
					const { link, problems } = parseViewLink(query, 40);
					expect(problems).toEqual([]);
					expect(link.sheet).toBe(sheet);
					expect(link.show).toBe(show);
					// Written to 0.1 % and 5 places: under half a pixel of A0 at 800 %.
					expect(Math.abs(link.zoom! - zoom)).toBeLessThanOrEqual(0.0005 + 1e-12);
					expect(Math.abs(link.centre!.x - x)).toBeLessThanOrEqual(0.000005 + 1e-12);
					expect(Math.abs(link.centre!.y - y)).toBeLessThanOrEqual(0.000005 + 1e-12);
				}
			)
		);
	});
});

const point = (id: string, x: number, y: number, sheet = 1): Marker => ({
	id,
	label: id,
	location: { sheet, x, y }
});

describe('markers', () => {
	const identity = (p: { x: number; y: number }) => ({ x: p.x * 1000, y: p.y * 1000 });

	it('a location is a sheet and fractions, an area both w and h within the sheet', () => {
		expect(markerLocation.safeParse({ sheet: 1, x: 0.2, y: 0.3 }).success).toBe(true);
		expect(markerLocation.safeParse({ sheet: 1, x: 0.2, y: 0.3, w: 0.1, h: 0.1 }).success).toBe(
			true
		);
		expect(markerLocation.safeParse({ sheet: 1, x: 0.2, y: 0.3, w: 0.1 }).success).toBe(false);
		expect(markerLocation.safeParse({ sheet: 1, x: 0.95, y: 0.3, w: 0.1, h: 0.1 }).success).toBe(
			false
		);
		expect(markerLocation.safeParse({ sheet: 0, x: 0.2, y: 0.3 }).success).toBe(false);
		expect(markerLocation.safeParse({ sheet: 1, x: 1.2, y: 0.3 }).success).toBe(false);
	});

	it('draws only the markers of the sheet that touch the view', () => {
		const markers = [point('a', 0.1, 0.1), point('b', 0.5, 0.5), point('c', 0.5, 0.5, 2)];
		const area: Marker = {
			id: 'd',
			label: 'd',
			location: { sheet: 1, x: 0, y: 0.4, w: 0.45, h: 0.2 }
		};
		const shown = visibleMarkers(
			[...markers, area],
			1,
			{ x0: 0.4, y0: 0.4, x1: 0.6, y1: 0.6 },
			{ x: 0.01, y: 0.01 }
		);
		expect(shown.map((m) => m.id)).toEqual(['b', 'd']);
	});

	it('finds the marker under the pointer, the last drawn first, and area outlines', () => {
		const markers = [point('a', 0.1, 0.1), point('b', 0.105, 0.1)];
		expect(markerAt(markers, { x: 104, y: 100 }, identity)?.id).toBe('b');
		expect(markerAt(markers, { x: 150, y: 150 }, identity)).toBeNull();
		const area: Marker = {
			id: 'z',
			label: 'z',
			location: { sheet: 1, x: 0.3, y: 0.3, w: 0.2, h: 0.1 }
		};
		expect(markerAt([area], { x: 400, y: 302 }, identity)?.id).toBe('z'); // on the top edge
		expect(markerAt([area], { x: 400, y: 350 }, identity)).toBeNull(); // inside, off the outline
		expect(markerCentre(area.location)).toEqual({ x: 0.4, y: 0.35 });
	});

	it('moves between markers in reading order and keeps a moved marker on its sheet', () => {
		const order = readingOrder([
			point('c', 0.9, 0.5),
			point('a', 0.5, 0.1),
			point('b', 0.1, 0.5),
			point('d', 0.1, 0.1, 2)
		]);
		expect(order.map((m) => m.id)).toEqual(['a', 'b', 'c', 'd']);
		expect(movedLocation({ sheet: 1, x: 0.5, y: 0.5, w: 0.2, h: 0.2 }, { x: 0.95, y: -1 })).toEqual(
			{
				sheet: 1,
				x: 0.8,
				y: 0,
				w: 0.2,
				h: 0.2
			}
		);
	});
});

describe('gestures', () => {
	it('pinching apart zooms in around the fingers and follows them', () => {
		const step = pinchStep(
			[
				{ x: 100, y: 100 },
				{ x: 200, y: 100 }
			],
			[
				{ x: 90, y: 110 },
				{ x: 290, y: 110 }
			]
		);
		expect(step.factor).toBeCloseTo(2, 12);
		expect(step).toMatchObject({ anchor: { x: 190, y: 110 }, dx: 40, dy: 10 });
	});

	it('a wheel turn towards the user zooms out, away zooms in, by the same amount', () => {
		expect(wheelFactor(100, 0, false)).toBeLessThan(1);
		expect(wheelFactor(-100, 0, false) * wheelFactor(100, 0, false)).toBeCloseTo(1, 12);
		expect(wheelFactor(3, 1, false)).toBeCloseTo(wheelFactor(48, 0, false), 12); // lines of 16 px
	});

	it('keys: + − 0, arrows, Page Up and Page Down', () => {
		expect(keyAction('+', 80)).toEqual({ kind: 'zoom', factor: 1.25 });
		expect(keyAction('-', 80)).toEqual({ kind: 'zoom', factor: 0.8 });
		expect(keyAction('0', 80)).toEqual({ kind: 'fit' });
		expect(keyAction('ArrowRight', 80)).toEqual({ kind: 'pan', dx: -80, dy: 0 });
		expect(keyAction('PageDown', 80)).toEqual({ kind: 'sheet', step: 1 });
		expect(keyAction('x', 80)).toBeNull();
	});
});
