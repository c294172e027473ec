/** Demo drawing KF-1001 pump housing: 80 × 60 × 30, bore, dowels, cover bolt pattern, slot. */
import { viewOf, type Pt, type Sheet } from '../sheet';
import { isoMetric, type PartDrawing } from './definition';

export const housing: PartDrawing = {
	...isoMetric,
	number: 'KF-1001',
	title: 'Pump housing',
	partName: 'Housing, dosing pump head',
	material: 'EN AW-6082-T6 (AlSi1MgMn)',
	size: 'A3',
	scale: '2:1',
	noteLines: [
		'ISO 8015',
		'ISO 2768-mK',
		'BREAK SHARP EDGES 0.2 TO 0.4 × 45°',
		'ANODISE CLEAR AFTER MACHINING'
	],
	drawnBy: 'Tomas Reyes',
	draw: drawHousing
};

function drawHousing(s: Sheet) {
	const k = 2;
	const v = viewOf([140, 125], k); // front view, origin at the bore centre
	const [l, t] = v(-40, 30);
	const [r, b] = v(40, -30);
	s.rect(l, t, r - l, b - t);

	const bore = v(0, 0);
	s.circle(bore, 9 * k);
	s.centreMark(bore, 9 * k, 5);
	// Chamfer edge of the bore, seen end-on.
	s.circle(bore, 9.5 * k, 'thin');

	const bolts: Pt[] = [v(-32, 22), v(32, 22), v(32, -22), v(-32, -22)];
	for (const c of bolts) {
		s.circle(c, 3.3 * k);
		s.centreMark(c, 3.3 * k, 2);
	}
	const dowels: Pt[] = [v(-20, 20), v(20, -20)];
	for (const c of dowels) {
		s.circle(c, 3 * k);
		s.centreMark(c, 3 * k, 2);
	}
	// Slot 8 wide, 24 long, 6 deep, below the bore.
	const slot = s
		.path()
		.arc(v(8, -20), 4 * k, 90, -90)
		.arc(v(-8, -20), 4 * k, 270, 90, true)
		.close();
	s.stroke(slot, 'thick');
	s.line(v(-13, -20), v(13, -20), 'centre');
	s.line(v(-8, -15), v(-8, -25), 'centre');
	s.line(v(8, -15), v(8, -25), 'centre');

	// Cutting plane A–A through the bore, viewed from the left (placed right: first angle).
	const cutTop = v(0, 35.5);
	const cutBottom = v(0, -35.5);
	s.line(v(0, 30), v(0, -30), 'centre');
	s.line(cutTop, v(0, 31.5), 'border');
	s.line(cutBottom, v(0, -31.5), 'border');
	s.line(cutTop, [cutTop[0] + 8, cutTop[1]], 'thin');
	s.arrow([cutTop[0] + 8, cutTop[1]], cutTop);
	s.line(cutBottom, [cutBottom[0] + 8, cutBottom[1]], 'thin');
	s.arrow([cutBottom[0] + 8, cutBottom[1]], cutBottom);
	s.text('A', [cutTop[0] + 4, cutTop[1] - 4], { h: 5 });
	s.text('A', [cutBottom[0] + 4, cutBottom[1] + 4.5], { h: 5 });

	// Callouts on the front view.
	s.holeLeader(bore, 9 * k, 8, [254, 106], 'Ø18 H7', 'Bushing bore', 8);
	s.datum('B', [269, 109], [269, 99], 'Datum B: bushing bore');
	s.holeLeader(dowels[0], 3 * k, 125, [70, 46], '2X Ø6 H7 Ⓔ', 'Dowel holes');
	s.frame([70, 55.5], ['⌖', 'Ø0.05', 'A', 'B'], 'Dowel holes: position');
	s.holeLeader(bolts[1], 3.3 * k, 60, [216, 38], '4X Ø6.6', 'Cover bolt holes');
	s.frame([238, 46.5], ['⌖', 'Ø0.2 Ⓜ', 'A', 'B'], 'Cover bolt holes: position');

	// Size and location dimensions.
	s.dimension([l, b], [r, b], 'h', 214, '80', { label: 'Overall length' });
	s.dimension([l, t], [l, b], 'v', 38, '60', { label: 'Overall height' });
	s.dimension([l, b], v(0, -30), 'h', 200, '40', { label: 'Bore from left face', shift: -14 });
	s.dimension(v(-40, 0), [l, b], 'v', 50, '30', { label: 'Bore from bottom face' });
	s.dimension(bolts[3], bolts[2], 'h', 190, '64', {
		label: 'Bolt pattern',
		basic: true,
		shift: 20
	});
	s.dimension(bolts[1], bolts[2], 'v', 234, '44', {
		label: 'Bolt pattern',
		basic: true,
		shift: 12
	});
	s.dimension(v(-8, -20), v(8, -20), 'h', 180, '16', { label: 'Slot length', shift: -14 });
	// The dowel holes' positions are basic, about the bore's axis (datum B).
	s.dimension(dowels[0], dowels[1], 'h', 58, '40', {
		label: 'Dowel spacing',
		basic: true,
		shift: 22
	});
	s.dimension(dowels[0], dowels[1], 'v', 192, '40', {
		label: 'Dowel spacing',
		basic: true,
		shift: 8
	});

	// Section A–A: 30 deep, the front face (datum A) on the right.
	const sx = 290;
	const sv = (depth: number, height: number): Pt => [sx + (30 - depth) * k, 125 - height * k];
	const outline = s.path().rect(sx, t, 30 * k, 60 * k);
	const solid = s.path();
	solid.rect(...rectOf(sv(30, 30), sv(0, 9)));
	solid.rect(...rectOf(sv(30, -9), sv(0, -16)));
	solid.rect(...rectOf(sv(30, -16), sv(6, -24)));
	solid.rect(...rectOf(sv(30, -24), sv(0, -30)));
	s.hatch(solid, [sx, t, 30 * k, 60 * k], 2.2);
	s.stroke(outline, 'thick');
	s.line(sv(30, 9), sv(0, 9));
	s.line(sv(30, -9), sv(0, -9));
	s.poly([sv(0, -16), sv(6, -16), sv(6, -24), sv(0, -24)], 'thick', false);
	s.line(sv(33, 0), sv(-3, 0), 'centre');
	s.text('A–A', [sx + 30, t - 12], { h: 5 });
	s.dimension(sv(30, -30), sv(0, -30), 'h', 200, '30', { label: 'Depth' });
	s.dimension(sv(0, -24), sv(6, -24), 'h', 196, '6', { label: 'Slot depth' });
	// The slot's width where the cut shows it, given only as a reference dimension: no limits
	// (the general tolerance does not apply to a reference dimension).
	s.dimension(sv(0, -16), sv(0, -24), 'v', sx + 30 * k + 14, '(8)', {
		label: 'Slot width',
		kind: 'size'
	});
	s.datum('A', sv(0, 18), [sx + 30 * k + 12, 82], 'Datum A: front face');
}

function rectOf(a: Pt, b: Pt): [number, number, number, number] {
	return [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1])];
}
