import { PDFDocument } from 'pdf-lib';
import { cachedFontkit, drawingFontFiles, parsedFont } from './fonts';
import { Sheet, viewOf, type DemoCallout, type Pt } from './sheet';
import { drawBorder, drawNotes, drawTitleBlock } from './title-block';

export type { DemoCallout } from './sheet';

export type DemoDrawingNumber = 'KF-1001' | 'KF-1002' | 'KF-1003' | 'KF-2001';

export type GeneralTolerance =
	| {
			kind: 'iso2768';
			linear: 'f' | 'm' | 'c' | 'v';
			geometric?: 'H' | 'K' | 'L';
			envelope?: boolean;
	  }
	| { kind: 'decimal-places'; byPlaces: Record<string, string>; angle?: string };

export interface DemoDrawing {
	number: DemoDrawingNumber;
	title: string;
	partName: string;
	material: string;
	units: 'mm' | 'in';
	standard: 'iso-8015' | 'asme-y14.5-2018';
	generalTolerance: GeneralTolerance;
	notes: string;
	/** Page size in PDF points (one sheet each). */
	sheets: { width: number; height: number }[];
	/** Every callout drawn, with where it sits (see DemoCallout). */
	callouts: DemoCallout[];
}

interface Definition extends Omit<DemoDrawing, 'callouts' | 'notes' | 'sheets'> {
	size: 'A3' | 'A4';
	scale: string;
	projection: 'first' | 'third';
	tolerancing: string[];
	noteLines: string[];
	drawnBy: string;
	draw: (s: Sheet) => void;
}

const sizes = { A3: [420, 297], A4: [297, 210] } as const;
const MM = 72 / 25.4;

const isoGeneral: GeneralTolerance = { kind: 'iso2768', linear: 'm', geometric: 'K' };
const isoTolerancing = [
	'TOLERANCING ISO 8015',
	'GENERAL TOLERANCES ISO 2768-mK',
	'DIMENSIONS IN mm'
];

const definitions: Definition[] = [
	{
		number: 'KF-1001',
		title: 'Pump housing',
		partName: 'Housing, dosing pump head',
		material: 'EN AW-6082-T6 (AlSi1MgMn)',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		size: 'A3',
		scale: '2:1',
		projection: 'first',
		tolerancing: isoTolerancing,
		noteLines: [
			'ISO 8015',
			'ISO 2768-mK',
			'BREAK SHARP EDGES 0.2 TO 0.4 × 45°',
			'ANODISE CLEAR AFTER MACHINING'
		],
		drawnBy: 'Tomas Reyes',
		draw: drawHousing
	},
	{
		number: 'KF-1002',
		title: 'Drive shaft',
		partName: 'Shaft, pump drive',
		material: 'X8CrNiS18-9 (1.4305)',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		size: 'A3',
		scale: '2:1',
		projection: 'first',
		tolerancing: isoTolerancing,
		noteLines: [
			'ISO 8015',
			'ISO 2768-mK',
			'CHAMFER ENDS AND SHOULDERS 0.5 × 45°',
			'KEYWAY FOR PARALLEL KEY 3 × 3'
		],
		drawnBy: 'Tomas Reyes',
		draw: drawShaft
	},
	{
		number: 'KF-1003',
		title: 'Bushing',
		partName: 'Bushing, drive shaft journal',
		material: 'CuSn8P (CW453K)',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		size: 'A4',
		scale: '4:1',
		projection: 'first',
		tolerancing: isoTolerancing,
		noteLines: ['ISO 8015', 'ISO 2768-mK', 'CHAMFER 0.5 × 45° ALL EDGES'],
		drawnBy: 'Tomas Reyes',
		draw: drawBushing
	},
	{
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
	}
];

// ——— KF-1001 pump housing: 80 × 60 × 30, bore, dowels, cover bolt pattern, slot ———

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
	s.dimension(dowels[0], dowels[1], 'h', 58, '40', { label: 'Dowel spacing', shift: 22 });

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
	// The slot's width where the cut shows it: no limits of its own, ISO 2768-m applies.
	s.dimension(sv(0, -16), sv(0, -24), 'v', sx + 30 * k + 14, '8', {
		label: 'Slot width',
		kind: 'size'
	});
	s.datum('A', sv(0, 18), [sx + 30 * k + 12, 82], 'Datum A: front face');
}

function rectOf(a: Pt, b: Pt): [number, number, number, number] {
	return [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1])];
}

// ——— KF-1002 drive shaft: coupling end, collar, journal, pump end; keyway ———

function drawShaft(s: Sheet) {
	const k = 2;
	const v = viewOf([80, 128], k); // origin at the coupling end, on the axis
	const steps: [from: number, to: number, radius: number][] = [
		[0, 28, 5],
		[28, 33, 8],
		[33, 78, 6],
		[78, 90, 4]
	];
	const c = 0.5; // chamfer
	const top: Pt[] = [v(0, 5 - c), v(c, 5), v(4, 5), v(4, 3.2), v(20, 3.2), v(20, 5)];
	top.push(v(28, 5), v(28, 8 - c), v(28 + c, 8), v(33 - c, 8), v(33, 8 - c), v(33, 6));
	top.push(v(78 - c, 6), v(78, 6 - c), v(78, 4), v(90 - c, 4), v(90, 4 - c));
	const bottom = top.map(([x, y]): Pt => [x, 2 * 128 - y]);
	// The keyway is on top only: the lower silhouette stays at the full radius.
	bottom.splice(2, 4, v(20, -5));
	s.poly([...top, ...bottom.reverse()], 'thick', true);
	for (const [from, , radius] of steps) {
		if (from > 0) s.line(v(from, radius), v(from, -radius));
	}
	s.line(v(90, 4 - c), v(90, -4 + c));
	s.line(v(0, 5 - c), v(0, -5 + c));
	s.line(v(c, 5), v(c, -5), 'thin');
	s.line(v(90 - c, 4), v(90 - c, -4), 'thin');
	s.line(v(4, 3.2), v(4, 5), 'thick');
	s.line(v(-4, 0), v(94, 0), 'centre');

	// Removed section B–B through the keyway.
	const cut = v(12, 0);
	s.line([cut[0], cut[1] - 16], [cut[0], cut[1] - 11], 'border');
	s.line([cut[0], cut[1] + 11], [cut[0], cut[1] + 16], 'border');
	s.text('B', [cut[0] + 4, cut[1] - 20], { h: 5 });
	s.text('B', [cut[0] + 4, cut[1] + 20.5], { h: 5 });
	s.line([cut[0], cut[1] - 16], [cut[0] + 7, cut[1] - 16], 'thin');
	s.arrow([cut[0] + 7, cut[1] - 16], [cut[0], cut[1] - 16]);
	s.line([cut[0], cut[1] + 16], [cut[0] + 7, cut[1] + 16], 'thin');
	s.arrow([cut[0] + 7, cut[1] + 16], [cut[0], cut[1] + 16]);

	const kb = 4;
	const sc: Pt = [300, 110];
	const half = 1.5 * kb;
	const floor = sc[1] - 3.2 * kb;
	const rim = Math.sqrt((5 * kb) ** 2 - half ** 2);
	const angle = (Math.asin(half / (5 * kb)) * 180) / Math.PI;
	const section = s
		.path()
		.arc(sc, 5 * kb, 90 + angle, 360 + 90 - angle)
		.line([sc[0] + half, floor])
		.line([sc[0] - half, floor])
		.close();
	s.hatch(section, [sc[0] - 20, sc[1] - 20, 40, 40], 2);
	s.stroke(section, 'thick');
	s.line([sc[0] - 24, sc[1]], [sc[0] + 24, sc[1]], 'centre');
	s.line([sc[0], sc[1] - 24], [sc[0], sc[1] + 24], 'centre');
	s.text('B–B  (4:1)', [sc[0], sc[1] - 44], { h: 5 });
	s.dimension([sc[0] - half, sc[1] - rim], [sc[0] + half, sc[1] - rim], 'h', sc[1] - 30, '3 N9', {
		label: 'Keyway width',
		kind: 'size',
		shift: 12
	});
	s.dimension([sc[0] + half, floor], [sc[0], sc[1] + 5 * kb], 'v', sc[0] + 28, '8.2', {
		label: 'Keyway depth'
	});

	// Diameters by leader, with the frame under the journal's size.
	s.leader(v(14, -5), [100, 178], 'Ø10 h6 Ⓔ', 'Coupling end');
	s.leader(v(30.5, 8), [130, 88], 'Ø16', 'Collar', 'dimension');
	s.leader(v(56, 6), [176, 86], 'Ø12 g6', 'Journal');
	s.frame([176, 95.5], ['⏤', 'Ø0.02 Ⓜ'], 'Journal: straightness of the median line');
	s.leader(v(85, -4), [262, 152], 'Ø8', 'Pump end', 'dimension');

	// Lengths: chain below, overall further out; keyway above.
	const y1 = 196;
	s.dimension(v(0, -5), v(28, -8), 'h', y1, '28', { label: 'Coupling end length' });
	s.dimension(v(28, -8), v(33, -8), 'h', y1, '5', { label: 'Collar width' });
	s.dimension(v(33, -8), v(78, -6), 'h', y1, '45', { label: 'Journal length' });
	s.dimension(v(78, -6), v(90, -4), 'h', y1, '12', { label: 'Pump end length' });
	s.dimension(v(0, -5), v(90, -4), 'h', 212, '90', { label: 'Overall length' });
	s.dimension(v(0, 5), v(4, 5), 'h', 96, '4', { label: 'Keyway from end', shift: -9 });
	s.dimension(v(4, 5), v(20, 5), 'h', 96, '16', { label: 'Keyway length' });
}

// ——— KF-1003 bushing: Ø18 outside, Ø12 bore, 20 long ———

function drawBushing(s: Sheet) {
	const k = 4;
	const v = viewOf([72, 86], k); // section A–A, origin at the left face on the axis
	const c = 0.5;
	const wall = (sign: 1 | -1) => {
		const y = (value: number) => sign * value;
		return [
			v(0, y(6 + c)),
			v(0, y(9 - c)),
			v(c, y(9)),
			v(20 - c, y(9)),
			v(20, y(9 - c)),
			v(20, y(6 + c)),
			v(20 - c, y(6)),
			v(c, y(6))
		];
	};
	for (const sign of [1, -1] as const) {
		const points = wall(sign);
		const region = s.path().poly(points, true);
		const [x0, y0] = v(0, sign * 9);
		s.hatch(region, [x0, Math.min(y0, v(0, sign * 6)[1]), 20 * k, 3 * k], 2);
		s.poly(points);
	}
	// Bore and outside lines seen beyond the cut.
	s.line(v(c, 6), v(c, -6), 'thick');
	s.line(v(20 - c, 6), v(20 - c, -6), 'thick');
	s.line(v(-3, 0), v(23, 0), 'centre');
	s.text('A–A', [v(10, 0)[0], 30], { h: 5 });

	// End view, seen from the left, placed on the right (first angle).
	const e: Pt = [212, 86];
	s.circle(e, 9 * k);
	s.circle(e, (9 - c) * k, 'thin');
	s.circle(e, 6 * k);
	s.circle(e, (6 + c) * k, 'thin');
	s.centreMark(e, 9 * k, 4);
	const cutTop: Pt = [e[0], e[1] - 9 * k - 8];
	const cutBottom: Pt = [e[0], e[1] + 9 * k + 8];
	s.line(cutTop, [cutTop[0], cutTop[1] + 5], 'border');
	s.line(cutBottom, [cutBottom[0], cutBottom[1] - 5], 'border');
	s.line(cutTop, [cutTop[0] - 8, cutTop[1]], 'thin');
	s.arrow([cutTop[0] - 8, cutTop[1]], cutTop);
	s.line(cutBottom, [cutBottom[0] - 8, cutBottom[1]], 'thin');
	s.arrow([cutBottom[0] - 8, cutBottom[1]], cutBottom);
	s.text('A', [cutTop[0] - 4, cutTop[1] - 4], { h: 5 });
	s.text('A', [cutBottom[0] - 4, cutBottom[1] + 4.5], { h: 5 });

	s.dimension(v(0, 9), v(0, -9), 'v', 44, 'Ø18 p6 Ⓔ', {
		label: 'Outside diameter',
		kind: 'size',
		shift: -10
	});
	s.dimension(v(13, 6), v(13, -6), 'v', v(13, 0)[0], 'Ø12 H7', {
		label: 'Bore',
		kind: 'size',
		shift: -10
	});
	s.dimension(v(0, -9), v(20, -9), 'h', 136, '20', { label: 'Length', kind: 'size' });
}

// ——— KF-2001 mounting bracket (inch, third angle): L bracket with pivot tab, and its pin ———

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
	const arcPoint = w(0.75 - 0.75 * Math.SQRT1_2, 1.25 + 0.75 * Math.SQRT1_2);
	s.leader(arcPoint, [270, 84], 'R.75', 'Tab end radius', 'dimension');
	s.dimension(w(0, 0), w(1.5, 0), 'h', 204, '1.50', { label: 'Tab width' });
	s.dimension(pivot, w(1.5, 0), 'v', 372, '1.250', { label: 'Pivot height' });

	s.dimension(v(2.75, 2), v(3, 2), 'h', 76, '.250 ±.005', { label: 'Tab thickness', kind: 'size' });
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

function fontsFor(doc: PDFDocument) {
	const files = drawingFontFiles();
	doc.registerFontkit(cachedFontkit);
	const faces = { text: files.text, symbols: files.symbols, marks: files.marks };
	return Promise.all([
		doc.embedFont(files.text, { subset: true }),
		doc.embedFont(files.bold, { subset: true }),
		doc.embedFont(files.symbols, { subset: true }),
		doc.embedFont(files.marks, { subset: true })
	]).then(([text, bold, symbols, marks]) => ({
		text,
		bold,
		symbols,
		marks,
		has: (face: keyof typeof faces, codePoint: number) =>
			parsedFont(faces[face]).hasGlyphForCodePoint(codePoint)
	}));
}

function layout(definition: Definition, sheet: Sheet, revision: string, date: string) {
	drawBorder(sheet);
	definition.draw(sheet);
	const height = sizes[definition.size][1];
	const notesAt: Pt = [28, height - 16 - 5 * definition.noteLines.length - 6];
	const ys = drawNotes(sheet, definition.noteLines, notesAt);
	definition.noteLines.forEach((line, i) => {
		sheet.record(line, [notesAt[0] + 5, ys[i]], 'note', 'General note');
	});
	drawTitleBlock(sheet, {
		number: definition.number,
		title: definition.title,
		partName: definition.partName,
		material: definition.material,
		units: definition.units,
		tolerancing: definition.tolerancing,
		scale: definition.scale,
		size: definition.size,
		projection: definition.projection,
		revision,
		revisionNote: revision === 'A' ? 'FIRST ISSUE' : 'SEE CHANGE RECORD',
		date,
		drawnBy: definition.drawnBy
	});
}

function describe(definition: Definition): DemoDrawing {
	const [w, h] = sizes[definition.size];
	const dry = new Sheet(w, h, null, null);
	layout(definition, dry, 'A', '');
	const { number, title, partName, material, units, standard, generalTolerance } = definition;
	return {
		number,
		title,
		partName,
		material,
		units,
		standard,
		generalTolerance,
		notes: definition.noteLines.map((line, i) => `${i + 1}. ${line}`).join('\n'),
		sheets: [{ width: round2(w * MM), height: round2(h * MM) }],
		callouts: dry.callouts
	};
}

function round2(n: number) {
	return Math.round(n * 100) / 100;
}

/** The four demo drawings of the Kestrel Fluidics pump, with every callout drawn on them. */
export const demoDrawings: DemoDrawing[] = definitions.map(describe);

export interface DemoPdfOptions {
	/** Revision letter in the title block (default A). */
	revision?: string;
	/** Issue date in the title block, ISO format (default 2026-11-16). */
	date?: string;
}

/** A vector PDF of a demo drawing: one sheet, real text in embedded, subset fonts. */
export async function demoDrawingPdf(
	number: DemoDrawingNumber,
	options: DemoPdfOptions = {}
): Promise<Uint8Array> {
	const definition = definitions.find((d) => d.number === number);
	if (!definition) throw new Error(`No demo drawing ${number}`);
	const { revision = 'A', date = '2026-11-16' } = options;
	const [w, h] = sizes[definition.size];
	const doc = await PDFDocument.create();
	const fixed = new Date('2026-11-16T09:00:00Z');
	doc.setTitle(`${definition.number} ${definition.title}`);
	doc.setAuthor('Kestrel Fluidics');
	doc.setSubject(`${definition.partName}, revision ${revision}`);
	doc.setCreator('Checkplate demo data');
	doc.setProducer('Checkplate');
	doc.setCreationDate(fixed);
	doc.setModificationDate(fixed);
	const fonts = await fontsFor(doc);
	const page = doc.addPage([w * MM, h * MM]);
	layout(definition, new Sheet(w, h, page, fonts), revision, date);
	return doc.save();
}
