import { describe, expect, test } from 'vitest';
import { parseDecimal } from '../../src/lib/tolerance/decimal';
import type { GeometricControl } from '../../src/lib/tolerance/feature';
import { adviseFit } from '../../src/lib/tolerance/fit-advisor';
import { fitDiagramSvg } from '../../src/lib/tolerance/fit-diagram';
import { evaluateFit, type FitEvaluation, type FitInput } from '../../src/lib/tolerance/fit';

const mm = (t: string) => parseDecimal(t, 'mm')!.value;

function ok(input: FitInput): FitEvaluation {
	const r = evaluateFit(input);
	if (!r.ok) throw new Error(`${r.member}: ${r.message}`);
	return r;
}

function isoFit(size: string, hole: string, shaft: string) {
	return ok({
		hole: { callout: `Ø${size} ${hole}` },
		shaft: { callout: `Ø${size} ${shaft}` },
		units: 'mm',
		standard: 'iso-8015'
	});
}

const position = (value: string, modifier: GeometricControl['modifier']): GeometricControl => ({
	characteristic: 'position',
	value,
	diameterZone: true,
	appliesTo: 'median',
	modifier,
	datums: ['A', 'B']
});

describe('ASME B4.2 preferred metric fits (values recalled from ASME B4.2-1978 tables 1 and 2)', () => {
	// [basic size, hole, shaft, hole upper, hole lower, shaft upper, shaft lower, max clearance, min clearance]
	const rows: [string, string, string, string, string, string, string, string, string][] = [
		['25', 'H11', 'c11', '25.130', '25.000', '24.890', '24.760', '0.370', '0.110'],
		['25', 'H9', 'd9', '25.052', '25.000', '24.935', '24.883', '0.169', '0.065'],
		['25', 'H8', 'f7', '25.033', '25.000', '24.980', '24.959', '0.074', '0.020'],
		['25', 'H7', 'g6', '25.021', '25.000', '24.993', '24.980', '0.041', '0.007'],
		['25', 'H7', 'h6', '25.021', '25.000', '25.000', '24.987', '0.034', '0.000'],
		['25', 'H7', 'k6', '25.021', '25.000', '25.015', '25.002', '0.019', '-0.015'],
		['25', 'H7', 'n6', '25.021', '25.000', '25.028', '25.015', '0.006', '-0.028'],
		['25', 'H7', 'p6', '25.021', '25.000', '25.035', '25.022', '-0.001', '-0.035'],
		['25', 'H7', 's6', '25.021', '25.000', '25.048', '25.035', '-0.014', '-0.048'],
		['25', 'H7', 'u6', '25.021', '25.000', '25.061', '25.048', '-0.027', '-0.061'],
		['10', 'H7', 'g6', '10.015', '10.000', '9.995', '9.986', '0.029', '0.005'],
		['10', 'H8', 'f7', '10.022', '10.000', '9.987', '9.972', '0.050', '0.013'],
		['10', 'H7', 's6', '10.015', '10.000', '10.032', '10.023', '-0.008', '-0.032'],
		['50', 'H7', 'g6', '50.025', '50.000', '49.991', '49.975', '0.050', '0.009'],
		['50', 'H7', 'u6', '50.025', '50.000', '50.086', '50.070', '-0.045', '-0.086'],
		// shaft basis, table 2
		['25', 'C11', 'h11', '25.240', '25.110', '25.000', '24.870', '0.370', '0.110'],
		['25', 'D9', 'h9', '25.117', '25.065', '25.000', '24.948', '0.169', '0.065'],
		['25', 'F8', 'h7', '25.053', '25.020', '25.000', '24.979', '0.074', '0.020'],
		['25', 'G7', 'h6', '25.028', '25.007', '25.000', '24.987', '0.041', '0.007'],
		['25', 'K7', 'h6', '25.006', '24.985', '25.000', '24.987', '0.019', '-0.015'],
		['25', 'N7', 'h6', '24.993', '24.972', '25.000', '24.987', '0.006', '-0.028'],
		['25', 'P7', 'h6', '24.986', '24.965', '25.000', '24.987', '-0.001', '-0.035'],
		['25', 'S7', 'h6', '24.973', '24.952', '25.000', '24.987', '-0.014', '-0.048'],
		['25', 'U7', 'h6', '24.960', '24.939', '25.000', '24.987', '-0.027', '-0.061']
	];
	test.each(rows)('Ø%s %s/%s', (size, hole, shaft, hu, hl, su, sl, max, min) => {
		const fit = isoFit(size, hole, shaft);
		expect(fit.text.hole).toEqual({ upper: hu, lower: hl });
		expect(fit.text.shaft).toEqual({ upper: su, lower: sl });
		expect(fit.text.maxClearance).toBe(max);
		expect(fit.text.minClearance).toBe(min);
	});

	test('classification follows the signs', () => {
		expect(isoFit('25', 'H7', 'g6').classification).toBe('clearance');
		expect(isoFit('25', 'H7', 'h6').classification).toBe('clearance');
		expect(isoFit('25', 'H7', 'k6').classification).toBe('transition');
		expect(isoFit('25', 'H7', 'p6').classification).toBe('interference');
	});
});

describe('verdict against the intent', () => {
	const fit = (shaft: string, intent: FitInput['intent'], extra: Partial<FitInput> = {}) =>
		ok({
			hole: { callout: 'Ø25 H7' },
			shaft: { callout: `Ø25 ${shaft}` },
			units: 'mm',
			standard: 'iso-8015',
			intent,
			...extra
		});

	test('running needs clearance above zero: H7/h6 fails, H7/g6 passes', () => {
		expect(fit('h6', 'running').verdict).toBe('fail');
		expect(fit('g6', 'running').verdict).toBe('pass');
	});
	test('locational clearance accepts zero clearance', () => {
		expect(fit('h6', 'locational-clearance').verdict).toBe('pass');
	});
	test('transition has no default requirement', () => {
		expect(fit('k6', 'transition').verdict).toBe('undetermined');
	});
	test('interference needs max clearance ≤ 0', () => {
		expect(fit('p6', 'interference').verdict).toBe('pass');
		expect(fit('n6', 'interference').verdict).toBe('fail');
	});
	test('stated minimum and maximum clearance', () => {
		const r = fit('g6', 'running', {
			requiredMinClearance: '0.010',
			requiredMaxClearance: '0.050'
		});
		expect(r.verdict).toBe('fail');
		expect(r.checks.map((c) => c.ok)).toEqual([true, false, true]);
	});
});

describe('boundaries', () => {
	test('a running fit that passes on size fails at the virtual condition', () => {
		// Hole Ø12 H7 (12.000–12.018) with Ⓔ, shaft Ø12 g6 (11.983–11.994, ISO 286-2) with a
		// median-line straightness Ø0.02 Ⓜ: VC 12.014 > hole MMC 12.000 → −0.014 at the boundary.
		const r = ok({
			hole: { callout: 'Ø12 H7 Ⓔ' },
			shaft: {
				callout: 'Ø12 g6',
				controls: [
					{
						characteristic: 'straightness',
						value: '0.02',
						diameterZone: true,
						appliesTo: 'median',
						modifier: 'mmc',
						datums: []
					}
				]
			},
			units: 'mm',
			standard: 'iso-8015',
			intent: 'running'
		});
		expect(r.text.minClearance).toBe('0.006');
		expect(r.text.minClearanceAtBoundary).toBe('-0.014');
		expect(r.verdict).toBe('fail');
	});

	test('ASME: Rule #1 bounds both members; a position at MMC lowers the hole boundary', () => {
		const r = ok({
			hole: { callout: 'Ø10.2-10.4', controls: [position('0.1', 'mmc')] },
			shaft: { callout: 'Ø9.8-10.0' },
			units: 'mm',
			standard: 'asme-y14.5-2018',
			intent: 'locational-clearance',
			sharedDatumFrame: true
		});
		expect(r.minClearanceAtBoundary).toBe(mm('0.1'));
		// hole outer boundary RC = 10.4 + 0.1 + 0.2 = 10.7; shaft inner boundary = LMC 9.8
		expect(r.maxClearanceAtBoundary).toBe(mm('0.9'));
	});

	test('no boundary clearance without geometric tolerances', () => {
		const r = isoFit('25', 'H7', 'g6');
		expect(r.minClearanceAtBoundary).toBeNull();
	});
});

describe('fasteners (ASME Y14.5-2009 appendix B formulas)', () => {
	test('floating fastener: T = H − F', () => {
		// M6 bolt (F = 6) in a medium-series clearance hole Ø6.6 (ISO 273): T = 0.6
		const r = ok({
			hole: { callout: 'Ø6.6 +0.2/0', controls: [position('0.6', 'mmc')] },
			fastener: { callout: 'M6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'floating-fastener'
		});
		expect(r.fastener?.formula).toBe('floating');
		expect(r.text.fastener?.available).toBe('0.6');
		expect(r.fastener?.ok).toBe(true);
		const tight = ok({
			hole: { callout: 'Ø6.6 +0.2/0', controls: [position('0.7', 'mmc')] },
			fastener: { callout: 'M6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'floating-fastener'
		});
		expect(tight.fastener?.ok).toBe(false);
		expect(tight.verdict).toBe('fail');
	});

	test('fixed fastener: T₁ + T₂ = H − F', () => {
		const r = ok({
			hole: { callout: 'Ø6.6 +0.2/0', controls: [position('0.3', 'mmc')] },
			fastener: { callout: 'M6', fixedPosition: '0.3' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'fixed-fastener'
		});
		expect(r.fastener?.formula).toBe('fixed');
		expect(r.fastener?.used).toBe(mm('0.6'));
		expect(r.fastener?.ok).toBe(true);
	});

	test('fixed fastener, not projected: H = F + T₁ + T₂(1 + 2P/D)', () => {
		// ASME Y14.5-2009 B-5 example (recalled, as reprinted): F 6.35, T₁ 0.2, T₂ 0.4, P 12, D 8
		// → H = 6.35 + 0.2 + 0.4 × (1 + 24/8) = 8.15
		const r = ok({
			hole: { callout: 'Ø8.15 +0.1/0', controls: [position('0.2', 'mmc')] },
			fastener: { callout: 'Ø6.35 0/-0.05', fixedPosition: '0.4', projection: { P: '12', D: '8' } },
			units: 'mm',
			standard: 'asme-y14.5-2018',
			intent: 'fixed-fastener'
		});
		expect(r.fastener?.required).toBe(mm('8.15'));
		expect(r.fastener?.ok).toBe(true);
		const small = ok({
			hole: { callout: 'Ø8.1 +0.1/0', controls: [position('0.2', 'mmc')] },
			fastener: { callout: 'Ø6.35 0/-0.05', fixedPosition: '0.4', projection: { P: '12', D: '8' } },
			units: 'mm',
			standard: 'asme-y14.5-2018',
			intent: 'fixed-fastener'
		});
		expect(small.fastener?.ok).toBe(false);
	});
});

describe('temperature and units', () => {
	test('operating temperature from two expansion coefficients (reference 20 °C, ISO 1)', () => {
		// Aluminium housing (23 × 10⁻⁶/K) on a steel shaft (11.5 × 10⁻⁶/K), Ø25 H7/g6 at 80 °C:
		// hole 25.000 → 25.0345, shaft 24.993 → 25.0102452: min clearance 0.0242548 (by hand)
		const r = ok({
			hole: { callout: 'Ø25 H7' },
			shaft: { callout: 'Ø25 g6' },
			units: 'mm',
			standard: 'iso-8015',
			temperature: { operating: '80', holeCoefficient: '23', shaftCoefficient: '11.5' }
		});
		expect(r.temperature?.minClearance).toBe(mm('0.0242548'));
		expect(r.temperature?.classification).toBe('clearance');
	});

	test('at 20 °C nothing changes', () => {
		const r = ok({
			hole: { callout: 'Ø25 H7' },
			shaft: { callout: 'Ø25 g6' },
			units: 'mm',
			standard: 'iso-8015',
			temperature: { operating: '20', holeCoefficient: '23', shaftCoefficient: '11.5' }
		});
		expect(r.temperature?.minClearance).toBe(r.minClearance);
	});

	test('mixed units are exact and reported in the hole unit', () => {
		// A 0.2500 in pin (6.35 mm exactly) in a Ø6.4 +0.1/0 hole: min clearance 0.05 mm
		const r = ok({
			hole: { callout: 'Ø6.4 +0.1/0' },
			shaft: { callout: 'Ø.2495-.2500', units: 'in' },
			units: 'mm',
			standard: 'iso-8015'
		});
		expect(r.units).toBe('mm');
		expect(r.minClearance).toBe(mm('0.05'));
		expect(r.text.minClearance).toBe('0.05');
		expect(r.text.maxClearance).toBe('0.1627');
	});
});

describe('fit advisor', () => {
	test('ISO preferred running fits at Ø25, hole basis', () => {
		const r = adviseFit({ basicSize: '25', units: 'mm', wanted: 'running', basis: 'hole' });
		if (!r.ok) throw new Error(r.message);
		expect(r.proposals.map((p) => p.designation)).toEqual(['H11/c11', 'H9/d9', 'H8/f7']);
		expect(r.proposals[2]).toMatchObject({ minClearance: '0.020', maxClearance: '0.074' });
	});

	test('shaft-basis interference fits', () => {
		const r = adviseFit({ basicSize: '25', units: 'mm', wanted: 'interference', basis: 'shaft' });
		if (!r.ok) throw new Error(r.message);
		expect(r.proposals.map((p) => p.designation)).toEqual(['P7/h6', 'S7/h6', 'U7/h6']);
	});

	test('ANSI B4.1 classes for inch, with callouts that read back', () => {
		const r = adviseFit({ basicSize: '1.000', units: 'in', wanted: 'running' });
		if (!r.ok) throw new Error(r.message);
		expect(r.proposals.map((p) => p.designation)).toContain('RC4');
		for (const p of r.proposals) {
			const fit = ok({
				hole: { callout: p.hole.callout },
				shaft: { callout: p.shaft.callout },
				units: 'in',
				standard: 'asme-y14.5-2018'
			});
			expect([fit.text.minClearance, fit.text.maxClearance]).toEqual([
				p.minClearance,
				p.maxClearance
			]);
		}
	});

	test('a bad size', () => {
		expect(adviseFit({ basicSize: 'abc', units: 'mm' }).ok).toBe(false);
	});

	test('inch callouts as a drafter writes them: no leading zero, equal places (ASME Y14.5)', () => {
		// RC1 at .25 in: hole +0.25/0 thou → .25000-.25025 (ANSI B4.1 table, recalled).
		const r = adviseFit({ basicSize: '.25', units: 'in', wanted: 'running' });
		if (!r.ok) throw new Error(r.message);
		const rc1 = r.proposals.find((p) => p.designation === 'RC1')!;
		expect(rc1.hole.callout).toBe('Ø.25000-.25025');
		// JSON decimals keep their leading zero (PRODUCT.md §6).
		expect(rc1.hole.upper).toBe('0.25025');
		for (const p of r.proposals) {
			expect(p.hole.callout).toMatch(/^Ø\.(\d+)-\.(\d+)$/);
			const [, a, b] = /^Ø\.(\d+)-\.(\d+)$/.exec(p.shaft.callout)!;
			expect(a.length).toBe(b.length);
		}
	});

	test('a preferred interference fit that is transition at the size is listed as transition', () => {
		// ISO 286-2: at 3 mm H7 is 0/+0.010 and p6 +0.006/+0.012, so H7/p6 has clearance up to 0.004.
		const interference = adviseFit({ basicSize: '3', units: 'mm', wanted: 'interference' });
		const transition = adviseFit({ basicSize: '3', units: 'mm', wanted: 'transition' });
		if (!interference.ok || !transition.ok) throw new Error('advice');
		expect(interference.proposals.map((p) => p.designation)).not.toContain('H7/p6');
		const p6 = transition.proposals.find((p) => p.designation === 'H7/p6')!;
		expect(p6.classification).toBe('transition');
		// At 25 mm it is interference again (max clearance 0.021 − 0.022 = −0.001).
		const at25 = adviseFit({ basicSize: '25', units: 'mm', wanted: 'interference' });
		expect(at25.ok && at25.proposals.map((p) => p.designation)).toContain('H7/p6');
	});
});

describe('fit diagram', () => {
	test('draws both zones with limits, clearances and the app fonts', () => {
		const svg = fitDiagramSvg(isoFit('25', 'H7', 'g6'));
		expect(svg.startsWith('<svg')).toBe(true);
		for (const t of ['25.021', '25.000', '24.993', '24.980', '0.007', '0.041', 'Hole', 'Shaft'])
			expect(svg).toContain(t);
		expect(svg).toContain("'Noto Sans Mono'");
		expect(svg.match(/<rect [^>]*width="56"/g)?.length).toBe(2);
	});

	test('to scale: zone heights are proportional to the tolerances', () => {
		const svg = fitDiagramSvg(isoFit('25', 'H7', 'g6'));
		const heights = [...svg.matchAll(/<rect x="\d+" y="[\d.]+" width="56" height="([\d.]+)"/g)].map(
			(m) => Number(m[1])
		);
		expect(heights[0] / heights[1]).toBeCloseTo(21 / 13, 1);
	});
});

describe('fits and fasteners as a checker judges them', () => {
	const bolt = (hole: string, t: string, modifier: GeometricControl['modifier']) =>
		ok({
			hole: { callout: hole, controls: [position(t, modifier)] },
			fastener: { callout: 'M6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'floating-fastener'
		});

	test('floating fastener: the modifier decides the hole boundary (ASME Y14.5 Appendix B; LMC recalled)', () => {
		// Ø6.6 +0.2/0 for M6: H = 6.6, F = 6, H − F = 0.6.
		// At MMC the boundary is the VC MMC − t: 0.5 ≤ 0.6 passes.
		const atMmc = bolt('Ø6.6 +0.2/0', '0.5', 'mmc');
		expect(atMmc.fastener).toMatchObject({ used: mm('0.5'), ok: true, modifier: 'mmc' });
		expect(atMmc.fastener?.boundary).toContain('virtual condition MMC − t');
		// RFS: no bonus, the inner boundary is still MMC − t, so the same check.
		const rfs = bolt('Ø6.6 +0.2/0', '0.5', 'rfs');
		expect(rfs.fastener).toMatchObject({ used: mm('0.5'), ok: true, modifier: 'rfs' });
		expect(rfs.fastener?.boundary).toContain('inner boundary MMC − t');
		// At LMC the inner boundary is MMC − t − T: t + T = 0.5 + 0.2 = 0.7 > 0.6 fails.
		const atLmc = bolt('Ø6.6 +0.2/0', '0.5', 'lmc');
		expect(atLmc.fastener).toMatchObject({ used: mm('0.7'), ok: false, modifier: 'lmc' });
		expect(atLmc.fastener?.boundary).toContain('MMC − t − T');
		expect(atLmc.text.fastener?.used).toBe('0.7');
		expect(atLmc.verdict).toBe('fail');
	});

	test('fixed fastener through a hole smaller than it fails, whatever else is given (common practice)', () => {
		// Ø5.5 ±0.1 for M6: H = 5.4 < F = 6, H − F = −0.6.
		const tooSmall = (fixedPosition?: string) =>
			ok({
				hole: { callout: 'Ø5.5 ±0.1' },
				fastener: { callout: 'M6', fixedPosition },
				units: 'mm',
				standard: 'iso-8015',
				intent: 'fixed-fastener'
			});
		for (const r of [tooSmall(), tooSmall('0.1')]) {
			expect(r.fastener).toMatchObject({ holeTooSmall: true, ok: false, available: mm('-0.6') });
			expect(r.verdict).toBe('fail');
			const check = r.checks.find((c) => c.what.startsWith('fastener:'))!;
			expect(check.ok).toBe(false);
			expect(check.text).toBe('H 5.4 < F 6.0: H − F = -0.6');
		}
	});

	test('fixed fastener: T₂ from the holding hole named as a feature (ASME Y14.5 Appendix B)', () => {
		const r = ok({
			hole: { callout: 'Ø6.6 +0.2/0', controls: [position('0.3', 'mmc')] },
			fastener: { callout: 'M6' },
			fixedHole: { callout: 'M6-6H', controls: [position('0.2', 'rfs')] },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'fixed-fastener'
		});
		// T₁ + T₂ = 0.3 + 0.2 = 0.5 ≤ H − F = 0.6
		expect(r.fastener).toMatchObject({ formula: 'fixed', used: mm('0.5'), ok: true });
	});

	test('a bought fastener is bounded by its largest size: no false alarm (common practice)', () => {
		// Ø6.6 +0.2/0 with position Ø0.4 Ⓜ, M6: hole VC 6.2, fastener 6.0 → 0.2 at the boundary.
		const r = ok({
			hole: { callout: 'Ø6.6 +0.2/0', controls: [position('0.4', 'mmc')] },
			fastener: { callout: 'M6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'floating-fastener',
			sharedDatumFrame: true
		});
		expect(r.boundaryNote).toBeNull();
		expect(r.minClearanceAtBoundary).toBe(mm('0.2'));
		expect(r.shaftBoundary.what).toBe('largest size');
		expect(r.verdict).toBe('pass');
	});

	test('only form controls of the derived median enter a pin-in-hole boundary unless both share a datum frame (common practice)', () => {
		const perpendicularity: GeometricControl = {
			characteristic: 'perpendicularity',
			value: '0.02',
			diameterZone: true,
			appliesTo: 'median',
			modifier: 'mmc',
			datums: ['A']
		};
		const input = (sharedDatumFrame: boolean): FitInput => ({
			hole: { callout: 'Ø12 H7 Ⓔ', controls: [perpendicularity] },
			shaft: { callout: 'Ø12 g6 Ⓔ' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'running',
			sharedDatumFrame
		});
		// Alone: the bore is bounded by its envelope at 12.000, the journal by 11.994 (g6,
		// ISO 286-2:2010 table 2 / 5): clearance 0.006 at the boundaries, nothing counted.
		const alone = ok(input(false));
		expect(alone.verdict).toBe('pass');
		expect(alone.text.countedControls).toEqual([]);
		expect(alone.minClearanceAtBoundary).toBeNull();
		// In one datum frame the perpendicularity's VC 12.000 − 0.020 = 11.980 counts: −0.014.
		const shared = ok(input(true));
		expect(shared.minClearanceAtBoundary).toBe(mm('-0.014'));
		expect(shared.text.countedControls).toEqual(['hole: perpendicularity Ø0.02 Ⓜ']);
		expect(shared.verdict).toBe('fail');
		// Straightness of the derived median line counts either way.
		const straight = ok({
			...input(false),
			hole: { callout: 'Ø12 H7 Ⓔ' },
			shaft: {
				callout: 'Ø12 g6',
				controls: [{ ...perpendicularity, characteristic: 'straightness', datums: [] }]
			}
		});
		expect(straight.text.countedControls).toEqual(['shaft: straightness Ø0.02 Ⓜ']);
		expect(straight.minClearanceAtBoundary).toBe(mm('-0.014'));
	});

	test('temperature enters the verdict: Ø18 H7/p6 aluminium on bronze at 80 °C loses its interference', () => {
		// H7 18.000/18.018, p6 18.018/18.029 (ISO 286-2:2010 tables); α aluminium 23.6, bronze
		// 17.5 × 10⁻⁶/K (recalled handbook values). By hand at Δθ = 60 K, each size rounded to the
		// 0.1 nm grid: hole 18.000 → 18.025488, 18.018 → 18.0435135 (18.043513488); shaft
		// 18.018 → 18.0369189, 18.029 → 18.0479305 (18.04793045, half away from zero).
		const r = ok({
			hole: { callout: 'Ø18 H7' },
			shaft: { callout: 'Ø18 p6' },
			units: 'mm',
			standard: 'iso-8015',
			intent: 'interference',
			temperature: { operating: '80', holeCoefficient: '23.6', shaftCoefficient: '17.5' }
		});
		expect(r.maxClearance).toBe(0); // interference at 20 °C
		expect(r.temperature?.maxClearance).toBe(mm('0.0065946'));
		expect(r.temperature?.minClearance).toBe(mm('-0.0224425'));
		expect(r.temperature?.classification).toBe('transition');
		// Shown to the callouts' places plus one, not to seven.
		expect(r.text.temperature).toEqual({ minClearance: '-0.0224', maxClearance: '0.0066' });
		const atT = r.checks.find((c) => c.what.startsWith('at 80 °C'))!;
		expect(atT).toEqual({
			what: 'at 80 °C: interference fit: maximum clearance not above zero',
			ok: false,
			text: 'maximum clearance 0.0066'
		});
		expect(r.verdict).toBe('fail');
	});

	test('members on different drawings: each under its own, the fit in the hole unit, converted inward', () => {
		// A bore on an ISO drawing (mm) and a pin on an ASME inch drawing: .2490-.2495 in is
		// 6.3246-6.3373 mm exactly (1 in = 25.4 mm), so 5 mm places hold it (common practice).
		const r = ok({
			hole: {
				callout: 'Ø6.4 +0.1/0',
				drawing: { units: 'mm', standard: 'iso-8015', generalTolerance: null }
			},
			shaft: {
				callout: 'Ø.2490-.2495',
				drawing: { units: 'in', standard: 'asme-y14.5-2018', generalTolerance: null }
			},
			units: 'mm',
			standard: 'unstated'
		});
		expect(r.units).toBe('mm');
		expect(r.shaft.units).toBe('in');
		// Rule #1 on the ASME member; independency on the ISO one.
		expect(r.shaft.envelope.applies).toBe(true);
		expect(r.hole.envelope.applies).toBe(false);
		expect(r.shaftLimits).toMatchObject({ converted: true, upper: mm('6.3373') });
		expect(r.minClearance).toBe(mm('0.0627'));
		// mm to inch rounds inward on the inch grid: never wider than the drawn zone.
		const back = ok({
			hole: { callout: 'Ø.2520-.2530', drawing: { units: 'in', standard: 'asme-y14.5-2018' } },
			shaft: { callout: 'Ø6.3 -0.01/-0.03', drawing: { units: 'mm', standard: 'iso-8015' } },
			units: 'in',
			standard: 'asme-y14.5-2018'
		});
		expect(back.shaftLimits.upper!).toBeLessThanOrEqual(mm('6.29'));
		expect(back.shaftLimits.lower!).toBeGreaterThanOrEqual(mm('6.27'));
		expect(back.shaftLimits.upper! - back.shaftLimits.lower!).toBeGreaterThan(0);
	});
});
