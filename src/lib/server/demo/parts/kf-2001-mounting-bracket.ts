/** Demo drawing KF-2001 mounting bracket (inch, third angle): L bracket with pivot tab, and its pin. */
import { viewOf, type Pt, type Sheet } from '../sheet';
import type { PartDrawing } from './definition';

export const mountingBracket: PartDrawing = {
	number: 'KF-2001',
	title: 'Mounting bracket',
	partName: 'Bracket, motor mount pivot',
	material: 'ALUMINUM 6061-T6',
	units: 'in',
	standard: 'asme-y14.5-2018',
	generalTolerance: {
		kind: 'decimal-places',
		byPlaces: { '2': '0.01', '3': '0.005' },
		angle: '0.5'
	},
	size: 'A3',
	scale: '2:1',
	projection: 'third',
	tolerancing: [
		'ASME Y14.5-2018',
		'UNLESS OTHERWISE SPECIFIED: INCHES',
		'.XX ± .01   .XXX ± .005   ANGLES ± 0.5°'
	],
	noteLines: [
		'DIMENSIONING AND TOLERANCING PER ASME Y14.5-2018',
		'PIVOT FIT: RUNNING',
		'PIVOT PIN IS A BOUGHT-OUT PART, SHOWN FOR THE FIT',
		'BREAK SHARP EDGES'
	],
	drawnBy: 'Tomas Reyes',
	draw: drawBracket
};

function drawBracket(s: Sheet) {
	const k = 2 * 25.4;
	const v = viewOf([70, 190], k); // front view, origin at the bottom-left corner
	const hole = 0.2508 / 2;
	s.poly([v(0, 0), v(3, 0), v(3, 2), v(2.75, 2), v(2.75, 0.25), v(0, 0.25)]);
	s.line(v(2.75, 1.25 + hole), v(3, 1.25 + hole), 'hidden');
	s.line(v(2.75, 1.25 - hole), v(3, 1.25 - hole), 'hidden');
	s.line(v(2.6, 1.25), v(3.15, 1.25), 'centre');

	// Right side view (third angle: placed on the right): the tab face, rounded top.
	const w = viewOf([280, 190], k);
	const side = s
		.path()
		.move(w(0, 1.25))
		.line(w(0, 0))
		.line(w(1.5, 0))
		.line(w(1.5, 1.25))
		.arc(w(0.75, 1.25), 0.75 * k, 0, 180, true);
	s.stroke(side, 'thick');
	const pivot = w(0.75, 1.25);
	s.circle(pivot, hole * k);
	s.centreMark(pivot, 0.75 * k, 3);

	s.holeLeader(pivot, hole * k, 50, [344, 76], 'Ø.250-.2515', 'Pivot hole');
	s.frame([344, 85.5], ['⊥', 'Ø.002', 'A'], 'Pivot hole: perpendicularity');
	const arcPoint = w(0.75 - 0.75 * Math.SQRT1_2, 1.25 + 0.75 * Math.SQRT1_2);
	s.leader(arcPoint, [270, 84], 'R.75', 'Tab end radius', 'dimension');
	s.dimension(w(0, 0), w(1.5, 0), 'h', 204, '1.50', { label: 'Tab width' });
	s.dimension(pivot, w(1.5, 0), 'v', 372, '1.250', { label: 'Pivot height' });

	s.dimension(v(2.75, 2), v(3, 2), 'h', 76, '.250 ±.005', { label: 'Tab thickness', kind: 'size' });
	// Datum A, the tab's outer face, to which the pivot hole is square.
	s.datum('A', v(3, 1.6), [v(3, 1.6)[0] + 14, v(3, 1.6)[1]], 'Datum A: tab face');
	const frameAt: Pt = [250, v(0, 0.8)[1]];
	const [frameLeft] = s.frame(frameAt, ['⏥', '.015'], 'Tab: flatness');
	s.line([frameLeft, frameAt[1]], v(3, 0.8), 'thin');
	s.arrow(v(3, 0.8), [frameLeft, frameAt[1]]);
	s.dimension(v(0, 0), v(3, 0), 'h', 204, '3.00', { label: 'Overall length' });
	s.dimension(v(2.75, 2), v(0, 0), 'v', 46, '2.00', { label: 'Overall height' });
	s.dimension(v(0, 0.25), v(0, 0), 'v', 58, '.25', { label: 'Base thickness', kind: 'size' });

	// The mating pivot pin, a bought-out part, drawn for the fit.
	const p = viewOf([60, 52], k);
	const r = 0.125;
	const ch = 0.02;
	s.poly([
		p(0, r - ch),
		p(ch, r),
		p(1 - ch, r),
		p(1, r - ch),
		p(1, -r + ch),
		p(1 - ch, -r),
		p(ch, -r),
		p(0, -r + ch)
	]);
	s.line(p(ch, r), p(ch, -r), 'thin');
	s.line(p(1 - ch, r), p(1 - ch, -r), 'thin');
	s.line(p(-0.08, 0), p(1.08, 0), 'centre');
	s.text('PIVOT PIN (BOUGHT OUT)', [p(0.5, 0)[0], 26], { h: 3.5, bold: true });
	s.leader(p(0.8, r), [146, 36], 'Ø.2500-.249', 'Pivot pin');
	s.dimension(p(0, -r), p(1, -r), 'h', 70, '1.00', { label: 'Pin length' });
}
