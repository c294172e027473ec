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
			intent: 'locational-clearance'
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
