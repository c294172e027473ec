/** Demo drawing KF-1003 bushing: Ø18 outside, Ø12 bore, 20 long. */
import { viewOf, type Pt, type Sheet } from '../sheet';
import { isoMetric, type PartDrawing } from './definition';

export const bushing: PartDrawing = {
	...isoMetric,
	number: 'KF-1003',
	title: 'Bushing',
	partName: 'Bushing, drive shaft journal',
	material: 'CuSn8P (CW453K)',
	size: 'A4',
	scale: '4:1',
	noteLines: ['ISO 8015', 'ISO 2768-mK', 'CHAMFER 0.5 × 45° ALL EDGES'],
	drawnBy: 'Tomas Reyes',
	draw: drawBushing
};

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
	s.frame([44, 140], ['↗', '0.02', 'A'], 'Outside diameter: circular run-out');
	s.line([44, v(0, -9)[1]], [44, 136.5], 'thin');
	s.dimension(v(13, 6), v(13, -6), 'v', v(13, 0)[0], 'Ø12 H7', {
		label: 'Bore',
		kind: 'size',
		shift: -10
	});
	// Datum A, the bore's axis: the datum triangle on the end of the bore's dimension line.
	s.datum('A', v(13, -6), [v(13, 0)[0], v(0, -9)[1] + 7.5], 'Datum A: bore axis');
	s.dimension(v(0, -9), v(20, -9), 'h', 139, '20', { label: 'Length', kind: 'size' });
}
