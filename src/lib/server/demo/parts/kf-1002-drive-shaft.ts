/** Demo drawing KF-1002 drive shaft: coupling end, collar, journal, pump end; keyway. */
import { viewOf, type Pt, type Sheet } from '../sheet';
import { isoMetric, type PartDrawing } from './definition';

export const driveShaft: PartDrawing = {
	...isoMetric,
	number: 'KF-1002',
	title: 'Drive shaft',
	partName: 'Shaft, pump drive',
	material: 'X8CrNiS18-9 (1.4305)',
	size: 'A3',
	scale: '2:1',
	noteLines: [
		'ISO 8015',
		'ISO 2768-mK',
		'CHAMFER ENDS AND SHOULDERS 0.5 × 45°',
		'KEYWAY FOR PARALLEL KEY 3 × 3'
	],
	drawnBy: 'Tomas Reyes',
	draw: drawShaft
};

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
	s.leader(v(14, -5), [100, 172], 'Ø10 h6 Ⓔ', 'Coupling end');
	s.frame([100, 181.5], ['↗', '0.02', 'A'], 'Coupling end: circular run-out');
	s.leader(v(30.5, 8), [130, 88], 'Ø16', 'Collar', 'dimension');
	s.leader(v(56, 6), [176, 86], 'Ø12 g6', 'Journal');
	const [, straightnessRight] = s.frame(
		[176, 95.5],
		['⏤', 'Ø0.02 Ⓜ'],
		'Journal: straightness of the median line'
	);
	// Datum A, the journal's axis: the datum triangle on the journal's tolerance frame.
	s.datum('A', [straightnessRight, 95.5], [straightnessRight + 10, 95.5], 'Datum A: journal axis');
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
