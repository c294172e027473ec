import fc from 'fast-check';
import { degrees, PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import {
	canvasAreaLimit,
	canvasSideLimit,
	displayedSize,
	fitMargin,
	fitSheet,
	fitWidth,
	keepTopLeft,
	maxZoom,
	minZoom,
	pageRect,
	pageToScreen,
	panBy,
	pictureResolution,
	pixelsPerPoint,
	regionRender,
	screenToPage,
	userSpaceToPage,
	viewportPixelRatio,
	visibleBlit,
	visibleRegion,
	zoomAround,
	type View
} from '../../src/lib/board/view';

// ISO 216 (recalled): A0 is 841 × 1189 mm; 72 points to the inch, 25.4 mm to the inch.
const a0 = { width: (841 / 25.4) * 72, height: (1189 / 25.4) * 72 };
const viewport = { width: 1200, height: 800 };

const views = fc.record({
	zoom: fc.double({ min: minZoom, max: maxZoom, noNaN: true }),
	centre: fc.record({
		x: fc.double({ min: 0, max: 1, noNaN: true }),
		y: fc.double({ min: 0, max: 1, noNaN: true })
	})
});
const points = fc.record({
	x: fc.double({ min: -1, max: 2, noNaN: true }),
	y: fc.double({ min: -1, max: 2, noNaN: true })
});
const screenPoints = fc.record({
	x: fc.double({ min: 0, max: viewport.width, noNaN: true }),
	y: fc.double({ min: 0, max: viewport.height, noNaN: true })
});

describe('a viewport that changes size', () => {
	it('keeps what shows at the top-left where it is (a side panel widening)', () => {
		const view: View = { zoom: 1, centre: { x: 0.5, y: 0.5 } };
		const narrower = { width: viewport.width - 256, height: viewport.height };
		const next = keepTopLeft(view, a0, viewport, narrower);
		for (const at of [
			{ x: 0, y: 0 },
			{ x: 300, y: 500 }
		]) {
			const point = screenToPage(at, view, a0, viewport);
			const moved = pageToScreen(point, next, a0, narrower);
			expect(moved.x).toBeCloseTo(at.x, 9);
			expect(moved.y).toBeCloseTo(at.y, 9);
		}
	});
});

describe('page and screen', () => {
	it('puts the view centre in the middle of the viewport and the corners where the zoom says', () => {
		const view: View = { zoom: 1, centre: { x: 0.5, y: 0.5 } };
		expect(pageToScreen({ x: 0.5, y: 0.5 }, view, a0, viewport)).toEqual({ x: 600, y: 400 });
		// At 100 % a point is 96/72 CSS pixels (CSS 2.1: 1in = 96px = 72pt).
		const corner = pageToScreen({ x: 0, y: 0 }, view, a0, viewport);
		expect(corner.x).toBeCloseTo(600 - (a0.width / 2) * (96 / 72), 9);
		expect(corner.y).toBeCloseTo(400 - (a0.height / 2) * (96 / 72), 9);
	});

	it('screen to page undoes page to screen', () => {
		fc.assert(
			fc.property(views, points, (view, point) => {
				const back = screenToPage(pageToScreen(point, view, a0, viewport), view, a0, viewport);
				expect(back.x).toBeCloseTo(point.x, 9);
				expect(back.y).toBeCloseTo(point.y, 9);
			})
		);
	});

	it('zooming around a point keeps that point under the pointer', () => {
		fc.assert(
			fc.property(
				views,
				screenPoints,
				fc.double({ min: 0.2, max: 5, noNaN: true }),
				(view, anchor, factor) => {
					const held = screenToPage(anchor, view, a0, viewport);
					const next = zoomAround(view, factor, anchor, a0, viewport);
					// Only while the centre stays on the sheet (the view never leaves it).
					fc.pre(next.centre.x > 0 && next.centre.x < 1 && next.centre.y > 0 && next.centre.y < 1);
					const now = pageToScreen(held, next, a0, viewport);
					expect(now.x).toBeCloseTo(anchor.x, 6);
					expect(now.y).toBeCloseTo(anchor.y, 6);
				}
			)
		);
	});

	it('keeps the zoom between its limits and the centre on the sheet', () => {
		const view: View = { zoom: 7, centre: { x: 0.99, y: 0.01 } };
		expect(zoomAround(view, 10, { x: 0, y: 0 }, a0, viewport).zoom).toBe(maxZoom);
		expect(zoomAround(view, 1e-6, { x: 0, y: 0 }, a0, viewport).zoom).toBe(minZoom);
		const far = panBy(view, -1e6, 1e6, a0);
		expect(far.centre).toEqual({ x: 1, y: 0 });
	});

	it('dragging moves every point of the sheet by the drag', () => {
		fc.assert(
			fc.property(
				views,
				points,
				fc.double({ min: -50, max: 50, noNaN: true }),
				fc.double({ min: -50, max: 50, noNaN: true }),
				(view, point, dx, dy) => {
					const next = panBy(view, dx, dy, a0);
					fc.pre(next.centre.x > 0 && next.centre.x < 1 && next.centre.y > 0 && next.centre.y < 1);
					const before = pageToScreen(point, view, a0, viewport);
					const after = pageToScreen(point, next, a0, viewport);
					expect(after.x - before.x).toBeCloseTo(dx, 6);
					expect(after.y - before.y).toBeCloseTo(dy, 6);
				}
			)
		);
	});

	it('fits the whole sheet with a margin, and the width across', () => {
		const whole = fitSheet(a0, viewport);
		const rect = pageRect(whole, a0, viewport);
		expect(rect.height).toBeCloseTo(viewport.height - 2 * fitMargin, 9); // A0 is taller
		expect(rect.x).toBeGreaterThan(0);
		const across = fitWidth(a0, viewport);
		const wide = pageRect(across, a0, viewport);
		expect(wide.width).toBeCloseTo(viewport.width - 2 * fitMargin, 9);
		expect(wide.y).toBeCloseTo(0, 9); // top edge at the top
	});

	it('the visible region is the viewport in page fractions', () => {
		const view: View = { zoom: 8, centre: { x: 0.3, y: 0.6 } };
		const region = visibleRegion(view, a0, viewport);
		const scale = 8 * pixelsPerPoint;
		expect(region.x1 - region.x0).toBeCloseTo(viewport.width / (a0.width * scale), 12);
		expect((region.x0 + region.x1) / 2).toBeCloseTo(0.3, 12);
		expect((region.y0 + region.y1) / 2).toBeCloseTo(0.6, 12);
	});
});

describe('canvas sizes', () => {
	it('never asks for a canvas past the limit, even for A0 at 800 % on a 3× screen', () => {
		// A whole A0 at 800 %: about 25,000 × 36,000 CSS pixels, far past any canvas.
		const resolution = pictureResolution(a0, { width: 8000, height: 8000 }, 3);
		expect(a0.width * resolution * a0.height * resolution).toBeLessThanOrEqual(
			canvasAreaLimit * 1.000001
		);
		expect(a0.height * resolution).toBeLessThanOrEqual(canvasSideLimit);
		const ratio = viewportPixelRatio({ width: 5000, height: 3000 }, 3);
		expect(5000 * ratio * 3000 * ratio).toBeLessThanOrEqual(canvasAreaLimit * 1.000001);
		expect(viewportPixelRatio(viewport, 2)).toBe(2);
	});

	it('the sharp region draws the page where the view shows it, in device pixels', () => {
		fc.assert(
			fc.property(views, points, fc.constantFrom(1, 1.5, 2), (view, point, ratio) => {
				const region = regionRender(view, a0, viewport, ratio);
				expect(region.width).toBe(viewport.width * ratio);
				// pdf.js puts displayed-page point (u, v) at (u·scale + offsetX, v·scale + offsetY).
				const u = point.x * a0.width;
				const v = point.y * a0.height;
				const screen = pageToScreen(point, view, a0, viewport);
				expect(u * region.scale + region.offsetX).toBeCloseTo(screen.x * ratio, 6);
				expect(v * region.scale + region.offsetY).toBeCloseTo(screen.y * ratio, 6);
			})
		);
	});

	it('copies only the visible part of a picture', () => {
		expect(
			visibleBlit({ width: 100, height: 100 }, { x: -50, y: 0, width: 200, height: 200 }, viewport)
		).toEqual({
			sx: 25,
			sy: 0,
			sw: 75,
			sh: 100,
			dx: 0,
			dy: 0,
			dw: 150,
			dh: 200
		});
		expect(
			visibleBlit({ width: 10, height: 10 }, { x: 1300, y: 0, width: 10, height: 10 }, viewport)
		).toBeNull();
	});
});

describe('rotation and crop box', () => {
	// Checked against pdf.js itself: its viewport at scale 1 is the displayed page in points.
	it.each([0, 90, 180, 270])(
		'matches pdf.js for a page turned %i° with a crop box',
		async (rotate) => {
			const pdf = await PDFDocument.create();
			const page = pdf.addPage([600, 800]);
			page.setCropBox(50, 100, 500, 600);
			page.setRotation(degrees(rotate));
			const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
			const document = await getDocument({ data: await pdf.save(), isEvalSupported: false })
				.promise;
			const viewport = (await document.getPage(1)).getViewport({ scale: 1 });
			const box = [50, 100, 550, 700];
			expect(displayedSize(box, rotate)).toEqual({
				width: viewport.width,
				height: viewport.height
			});
			for (const point of [
				{ x: 50, y: 100 },
				{ x: 550, y: 700 },
				{ x: 120, y: 640 },
				{ x: 333, y: 222 }
			]) {
				const [u, v] = viewport.convertToViewportPoint(point.x, point.y) as number[];
				const mine = userSpaceToPage(point, box, rotate);
				expect(mine.x).toBeCloseTo(u / viewport.width, 9);
				expect(mine.y).toBeCloseTo(v / viewport.height, 9);
			}
			await document.destroy();
		}
	);

	it('a page turned 90° clockwise puts its top-left corner at the top-right', () => {
		// By hand: the crop box's top-left is (x0, y1) in user space.
		expect(userSpaceToPage({ x: 0, y: 100 }, [0, 0, 200, 100], 90)).toEqual({ x: 1, y: 0 });
		expect(userSpaceToPage({ x: 0, y: 100 }, [0, 0, 200, 100], -270)).toEqual({ x: 1, y: 0 });
		expect(displayedSize([0, 0, 200, 100], 90)).toEqual({ width: 100, height: 200 });
	});
});
