import { describe, expect, test } from 'vitest';
import { ZERO, parseDecimal } from '../../src/lib/tolerance/decimal';
import {
	ISO_2768_2_STATUS,
	angularTolerance,
	brokenEdgeTolerance,
	generalCircularRunout,
	generalLinearTolerance,
	generalPerpendicularity,
	generalStraightnessFlatness,
	generalSymmetry,
	type GeometricClass,
	type LinearClass
} from '../../src/lib/tolerance/iso2768';

const mm = (text: string) => parseDecimal(text, 'mm')!.value;

describe('ISO 2768-1 linear sizes', () => {
	// ISO 2768-1:1989, table 1 (values recalled); one size inside each range plus both bounds
	const rows: [string, LinearClass, string | null][] = [
		['0.5', 'f', '0.05'],
		['2', 'f', '0.05'],
		['3', 'f', '0.05'],
		['5', 'f', '0.05'],
		['6.001', 'f', '0.1'],
		['30', 'f', '0.1'],
		['100', 'f', '0.15'],
		['400', 'f', '0.2'],
		['800', 'f', '0.3'],
		['2000', 'f', '0.5'],
		['2000.001', 'f', null],
		['0.5', 'm', '0.1'],
		['3', 'm', '0.1'],
		['4', 'm', '0.1'],
		['25', 'm', '0.2'],
		['30.5', 'm', '0.3'],
		['120', 'm', '0.3'],
		['120.01', 'm', '0.5'],
		['1000', 'm', '0.8'],
		['1500', 'm', '1.2'],
		['4000', 'm', '2'],
		['1', 'c', '0.2'],
		['5', 'c', '0.3'],
		['12', 'c', '0.5'],
		['60', 'c', '0.8'],
		['300', 'c', '1.2'],
		['500', 'c', '2'],
		['1200', 'c', '3'],
		['3000', 'c', '4'],
		['3', 'v', null],
		['0.5', 'v', null],
		['3.01', 'v', '0.5'],
		['18', 'v', '1'],
		['80', 'v', '1.5'],
		['250', 'v', '2.5'],
		['700', 'v', '4'],
		['1800', 'v', '6'],
		['2500', 'v', '8']
	];
	test.each(rows)('%s mm class %s', (size, cls, expected) => {
		const r = generalLinearTolerance(mm(size), cls);
		if (expected === null) {
			expect(r.ok).toBe(false);
			if (!r.ok) expect(r.reason).toMatch(/^not covered/);
		} else expect(r).toMatchObject({ ok: true, deviation: mm(expected), published: expected });
	});

	test('gaps: below 0.5 mm and above 4000 mm', () => {
		// ISO 2768-1:1989, table 1 and clause 1 (sizes below 0.5 mm need their own tolerance)
		for (const cls of ['f', 'm', 'c', 'v'] as const) {
			expect(generalLinearTolerance(mm('0.49'), cls).ok).toBe(false);
			expect(generalLinearTolerance(mm('4000.1'), cls).ok).toBe(false);
		}
		const r = generalLinearTolerance(mm('0.4'), 'm');
		expect(!r.ok && r.reason).toContain('0.5 mm');
		const v = generalLinearTolerance(mm('2'), 'v');
		expect(!v.ok && v.reason).toContain('from 0.5 up to 3 mm');
		expect(generalLinearTolerance(mm('10'), 'x' as LinearClass).ok).toBe(false);
	});

	test('each class is at least as coarse as the one before', () => {
		for (const size of ['4', '20', '100', '300', '900', '1500']) {
			let previous = 0;
			for (const cls of ['f', 'm', 'c', 'v'] as const) {
				const r = generalLinearTolerance(mm(size), cls);
				if (!r.ok) continue;
				expect(r.deviation).toBeGreaterThanOrEqual(previous);
				previous = r.deviation;
			}
		}
	});
});

describe('ISO 2768-1 broken edges', () => {
	// ISO 2768-1:1989, table 2 (values recalled)
	const rows: [string, LinearClass, string | null][] = [
		['0.5', 'f', '0.2'],
		['3', 'm', '0.2'],
		['4', 'f', '0.5'],
		['6', 'm', '0.5'],
		['10', 'f', '1'],
		['100', 'm', '1'],
		['1', 'c', '0.4'],
		['5', 'c', '1'],
		['8', 'c', '2'],
		['2', 'v', '0.4'],
		['6', 'v', '1'],
		['50', 'v', '2'],
		['0.3', 'm', null]
	];
	test.each(rows)('%s mm class %s', (size, cls, expected) => {
		const r = brokenEdgeTolerance(mm(size), cls);
		if (expected === null) expect(r.ok).toBe(false);
		else expect(r).toMatchObject({ ok: true, deviation: mm(expected) });
	});
});

describe('ISO 2768-1 angles', () => {
	// ISO 2768-1:1989, table 3 (values recalled), by the length of the shorter leg
	const rows: [string, LinearClass, number, string][] = [
		['5', 'f', 60, '1°'],
		['10', 'm', 60, '1°'],
		['10.1', 'm', 30, '0°30′'],
		['50', 'f', 30, '0°30′'],
		['100', 'm', 20, '0°20′'],
		['400', 'f', 10, '0°10′'],
		['500', 'm', 5, '0°5′'],
		['8', 'c', 90, '1°30′'],
		['30', 'c', 60, '1°'],
		['120', 'c', 30, '0°30′'],
		['200', 'c', 15, '0°15′'],
		['1000', 'c', 10, '0°10′'],
		['10', 'v', 180, '3°'],
		['20', 'v', 120, '2°'],
		['80', 'v', 60, '1°'],
		['300', 'v', 30, '0°30′'],
		['401', 'v', 20, '0°20′']
	];
	test.each(rows)('shorter leg %s mm class %s', (leg, cls, minutes, published) => {
		expect(angularTolerance(mm(leg), cls)).toMatchObject({ ok: true, minutes, published });
	});
	test('a leg of no length is not an angle', () => {
		expect(angularTolerance(ZERO, 'm').ok).toBe(false);
	});
});

describe('ISO 2768-2 (withdrawn 2021, still read)', () => {
	// ISO 2768-2:1989, table 1: straightness and flatness (values recalled)
	const flat: [string, GeometricClass, string][] = [
		['10', 'H', '0.02'],
		['20', 'H', '0.05'],
		['100', 'H', '0.1'],
		['250', 'H', '0.2'],
		['1000', 'H', '0.3'],
		['3000', 'H', '0.4'],
		['5', 'K', '0.05'],
		['30', 'K', '0.1'],
		['60', 'K', '0.2'],
		['300', 'K', '0.4'],
		['600', 'K', '0.6'],
		['2000', 'K', '0.8'],
		['1', 'L', '0.1'],
		['15', 'L', '0.2'],
		['90', 'L', '0.4'],
		['200', 'L', '0.8'],
		['999', 'L', '1.2'],
		['1001', 'L', '1.6']
	];
	test.each(flat)('straightness/flatness %s mm class %s', (length, cls, expected) => {
		expect(generalStraightnessFlatness(mm(length), cls)).toMatchObject({
			ok: true,
			tolerance: mm(expected),
			withdrawn: true
		});
	});

	test('perpendicularity, symmetry, run-out', () => {
		// ISO 2768-2:1989, tables 2, 3 and 4 (values recalled)
		const perp: [string, GeometricClass, string][] = [
			['100', 'H', '0.2'],
			['200', 'H', '0.3'],
			['500', 'H', '0.4'],
			['2000', 'H', '0.5'],
			['50', 'K', '0.4'],
			['300', 'K', '0.6'],
			['800', 'K', '0.8'],
			['3000', 'K', '1'],
			['10', 'L', '0.6'],
			['150', 'L', '1'],
			['400', 'L', '1.5'],
			['1500', 'L', '2']
		];
		for (const [length, cls, expected] of perp) {
			expect(generalPerpendicularity(mm(length), cls)).toMatchObject({ tolerance: mm(expected) });
		}
		const sym: [string, GeometricClass, string][] = [
			['50', 'H', '0.5'],
			['2500', 'H', '0.5'],
			['100', 'K', '0.6'],
			['300', 'K', '0.6'],
			['600', 'K', '0.8'],
			['2000', 'K', '1'],
			['80', 'L', '0.6'],
			['250', 'L', '1'],
			['700', 'L', '1.5'],
			['1200', 'L', '2']
		];
		for (const [length, cls, expected] of sym) {
			expect(generalSymmetry(mm(length), cls)).toMatchObject({ tolerance: mm(expected) });
		}
		expect(generalCircularRunout('H')).toMatchObject({ tolerance: mm('0.1'), withdrawn: true });
		expect(generalCircularRunout('K')).toMatchObject({ tolerance: mm('0.2') });
		expect(generalCircularRunout('L')).toMatchObject({ tolerance: mm('0.5') });
	});

	test('beyond 3000 mm is not covered, and the withdrawal is stated', () => {
		expect(generalStraightnessFlatness(mm('3000.1'), 'K').ok).toBe(false);
		expect(generalPerpendicularity(mm('3001'), 'H').ok).toBe(false);
		expect(generalStraightnessFlatness(ZERO, 'K').ok).toBe(false);
		expect(generalStraightnessFlatness(mm('10'), 'm' as GeometricClass).ok).toBe(false);
		expect(ISO_2768_2_STATUS).toMatchObject({ withdrawn: 2021, replacedBy: 'ISO 22081' });
		const r = generalStraightnessFlatness(mm('50'), 'H');
		expect(r.ok && r.note).toContain('ISO 22081');
	});
});
