import { describe, expect, test } from 'vitest';
import { parseDecimal } from '../../src/lib/tolerance/decimal';
import {
	evaluateFeature,
	type FeatureEvaluation,
	type FeatureInput,
	type GeometricControl
} from '../../src/lib/tolerance/feature';

const mm = (t: string) => parseDecimal(t, 'mm')!.value;
const inch = (t: string) => parseDecimal(t, 'in')!.value;

function ok(input: FeatureInput): FeatureEvaluation {
	const r = evaluateFeature(input);
	if (!r.ok) throw new Error(`${input.callout}: ${r.message}`);
	return r;
}

function control(
	characteristic: GeometricControl['characteristic'],
	value: string,
	modifier: GeometricControl['modifier'],
	appliesTo: GeometricControl['appliesTo'] = 'median'
): GeometricControl {
	return { characteristic, value, diameterZone: true, appliesTo, modifier, datums: ['A'] };
}

describe('limits, MMC, LMC and gauges', () => {
	test('ISO code alone takes its limits from ISO 286 and shows 3 places in mm', () => {
		// ISO 286-2:2010 table for H7 over 18 up to 30 mm: 0 / +21 µm
		const f = ok({ callout: 'Ø25 H7', units: 'mm', standard: 'iso-8015' });
		expect(f.internal).toBe(true);
		expect(f.limitsSource).toBe('iso286');
		expect(f.text).toMatchObject({
			upper: '25.021',
			lower: '25.000',
			tolerance: '0.021',
			mmc: '25.000',
			lmc: '25.021',
			go: '25.000',
			noGo: '25.021'
		});
	});

	test('a shaft code gives MMC at the upper limit', () => {
		// ISO 286-2:2010, g6 over 18 up to 30 mm: −7 / −20 µm
		const f = ok({ callout: 'Ø25 g6', units: 'mm', standard: 'iso-8015' });
		expect(f.internal).toBe(false);
		expect([f.text.mmc, f.text.lmc]).toEqual(['24.993', '24.980']);
	});

	test('inch limits keep the places written, with a leading zero', () => {
		const f = ok({
			callout: '.8750-.8745',
			internal: false,
			units: 'in',
			standard: 'asme-y14.5-2018'
		});
		expect(f.text).toMatchObject({ upper: '0.8750', lower: '0.8745', tolerance: '0.0005' });
		expect(f.tolerance).toBe(inch('.0005'));
	});

	test('exact arithmetic: 0.875 − 0.874 is 0.001', () => {
		const f = ok({
			callout: '.874-.875',
			internal: true,
			units: 'in',
			standard: 'asme-y14.5-2018'
		});
		expect(f.tolerance).toBe(inch('.001'));
	});

	test('plain limits need to know internal or external', () => {
		const r = evaluateFeature({ callout: '25.000-25.021', units: 'mm', standard: 'iso-8015' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.field).toBe('internal');
	});

	test('a bad callout gives the parser message and position', () => {
		const r = evaluateFeature({
			callout: 'Ø25 +0.021/',
			units: 'mm',
			standard: 'iso-8015',
			internal: true
		});
		// The callout ends where the lower deviation should start: at the '/', character 10.
		expect(r).toMatchObject({ ok: false, field: 'callout', position: 10 });
	});

	test('an ISO code of the wrong case for the feature is refused', () => {
		const r = evaluateFeature({
			callout: 'Ø25 g6',
			internal: true,
			units: 'mm',
			standard: 'iso-8015'
		});
		expect(r).toMatchObject({ ok: false, field: 'callout', position: 4 });
	});

	test('a fit designation on one feature takes the member matching the feature', () => {
		const hole = ok({ callout: 'Ø25 H7/g6', internal: true, units: 'mm', standard: 'iso-8015' });
		const shaft = ok({ callout: 'Ø25 H7/g6', internal: false, units: 'mm', standard: 'iso-8015' });
		expect(hole.text.upper).toBe('25.021');
		expect(shaft.text.upper).toBe('24.993');
	});
});

describe('general tolerance', () => {
	test('ISO 2768-m covers a size without a tolerance, and says so', () => {
		// ISO 2768-1:1989 table 1, class m, over 6 up to 30 mm: ±0.2
		const f = ok({
			callout: '25',
			internal: false,
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm' }
		});
		expect(f.limitsSource).toBe('general');
		expect(f.limitsNote).toContain('ISO 2768-m');
		expect([f.text.lower, f.text.upper]).toEqual(['24.8', '25.2']);
	});

	test('ISO 2768 does not cover sizes below 0.5 mm', () => {
		// ISO 2768-1:1989 table 1 starts at 0.5 mm
		const f = ok({
			callout: '0.3',
			internal: false,
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm' }
		});
		expect(f.limitsSource).toBe('none');
		expect(f.upper).toBeNull();
		expect(f.limitsNote).toMatch(/^no limits/);
	});

	test('inch title block tolerance by decimal places', () => {
		const f = ok({
			callout: '1.25',
			internal: false,
			units: 'in',
			standard: 'asme-y14.5-2018',
			generalTolerance: { kind: 'decimal-places', byPlaces: { '2': '0.01', '3': '0.005' } }
		});
		expect([f.text.lower, f.text.upper]).toEqual(['1.24', '1.26']);
	});

	test('no tolerance and no general tolerance: no limits', () => {
		const f = ok({ callout: '25', internal: true, units: 'mm', standard: 'iso-8015' });
		expect(f.limitsSource).toBe('none');
		expect(f.limitsNote).toMatch(/no general tolerance/);
		expect(f.mmc).toBeNull();
	});

	test('basic dimensions carry no tolerance', () => {
		const f = ok({ callout: '[25]', internal: false, units: 'mm', standard: 'iso-8015' });
		expect(f.limitsNote).toMatch(/basic/);
	});
});

describe('envelope: ASME Y14.5 Rule #1', () => {
	// ASME Y14.5-2018 §5 (Rule #1, recalled): the surface may not violate a boundary of perfect form at
	// MMC, so the largest form deviation equals the size tolerance (at LMC).
	test('Rule #1 applies to a regular feature of size; form deviation equals the size tolerance', () => {
		const f = ok({
			callout: 'Ø.500-.510',
			internal: false,
			units: 'in',
			standard: 'asme-y14.5-2018'
		});
		expect(f.envelope.applies).toBe(true);
		expect(f.envelope.reason).toMatch(/Rule #1/);
		expect(f.formDeviation).toBe(inch('.010'));
		expect(f.text.formDeviation).toBe('0.010');
	});

	test('Rule #1 applies to metric ASME drawings too', () => {
		const f = ok({ callout: 'Ø12 ±0.1', internal: true, units: 'mm', standard: 'asme-y14.5-2009' });
		expect(f.envelope.applies).toBe(true);
		expect(f.formDeviation).toBe(mm('0.2'));
	});

	test.each([
		['stock', { overrides: { stock: true } }, /stock/],
		['free state', { overrides: { freeState: true } }, /free state/],
		['independency symbol', { callout: 'Ø12 ±0.1 Ⓘ' }, /independency/],
		['note', { notes: 'PERFECT FORM AT MMC NOT REQD' }, /PERFECT FORM/],
		[
			'median-line straightness',
			{ controls: [control('straightness', '0.05', 'mmc')] },
			/median line/
		]
	])('lifted by %s', (_name, extra, reason) => {
		const f = ok({
			callout: 'Ø12 ±0.1',
			internal: false,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			...(extra as Partial<FeatureInput>)
		});
		expect(f.envelope.applies).toBe(false);
		expect(f.envelope.reason).toMatch(reason);
		expect(f.formDeviation).toBe('unbounded');
	});

	test('surface straightness does not lift Rule #1', () => {
		const f = ok({
			callout: 'Ø12 ±0.1',
			internal: false,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('straightness', '0.05', 'rfs', 'surface')]
		});
		expect(f.envelope.applies).toBe(true);
		expect(f.controls[0].boundaries).toBeNull();
	});
});

describe('envelope: ISO 8015 independency', () => {
	// ISO 8015:2011 §5.5 (independency): size controls two-point sizes only; form is free
	// unless the envelope requirement Ⓔ (ISO 14405-1) or a general -E note asks for it.
	test('independency by default', () => {
		const f = ok({ callout: 'Ø25 H7', units: 'mm', standard: 'iso-8015' });
		expect(f.envelope.applies).toBe(false);
		expect(f.formDeviation).toBe('unbounded');
		expect(f.gauges.note).toMatch(/two-point/);
	});

	test('Ⓔ on the feature', () => {
		const f = ok({ callout: 'Ø25 H7 Ⓔ', units: 'mm', standard: 'iso-8015' });
		expect(f.envelope.applies).toBe(true);
		expect(f.formDeviation).toBe(mm('0.021'));
	});

	test('a general ISO 2768-mK-E note', () => {
		const f = ok({
			callout: 'Ø25 H7',
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K', envelope: true }
		});
		expect(f.envelope.applies).toBe(true);
		expect(f.envelope.reason).toMatch(/ISO 2768-mK-E/);
	});

	test('no standard stated but ISO notation present: ISO 8015 assumed', () => {
		const f = ok({ callout: 'Ø25 H7', units: 'mm', standard: 'unstated' });
		expect(f.envelope.applies).toBe(false);
		expect(f.envelope.reason).toMatch(/ISO 8015 is assumed/);
	});

	test('no standard and no ISO notation: undetermined', () => {
		const f = ok({ callout: '.500-.510', internal: false, units: 'in', standard: 'unstated' });
		expect(f.envelope.reason).toMatch(/undetermined/);
	});
});

describe('virtual condition, resultant condition, boundaries, bonus', () => {
	// Formulas: ASME Y14.5-2018 §§ 2.11–2.12 and appendix on boundaries; PRODUCT.md §4.
	test('hole at MMC: VC = MMC − t, RC = LMC + t + T; bonus at an actual size', () => {
		// Worked example (textbook style, values follow from the formulas): hole Ø.500–.505,
		// position Ø.010 Ⓜ: VC .490, RC .520; at an actual mating size of .503 the bonus is .003
		// and the position tolerance allowed is .013.
		const f = ok({
			callout: 'Ø.500-.505',
			internal: true,
			units: 'in',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '.010', 'mmc')],
			actual: '.503'
		});
		expect(f.controls[0].text).toMatchObject({
			virtualCondition: '0.490',
			resultantCondition: '0.520',
			innerBoundary: '0.490',
			outerBoundary: '0.520',
			bonus: '0.003',
			allowed: '0.013'
		});
	});

	test('pin at MMC: VC = MMC + t, RC = LMC − t − T', () => {
		// Pin Ø.490–.500 with perpendicularity Ø.005 Ⓜ: VC = .500 + .005 = .505,
		// RC = .490 − .005 − .010 = .475; at .494 the bonus is .006 (worked by hand).
		const f = ok({
			callout: 'Ø.490-.500',
			internal: false,
			units: 'in',
			standard: 'asme-y14.5-2018',
			controls: [control('perpendicularity', '.005', 'mmc')],
			actual: '.494'
		});
		expect(f.controls[0].text).toMatchObject({
			virtualCondition: '0.505',
			resultantCondition: '0.475',
			bonus: '0.006',
			allowed: '0.011'
		});
	});

	test('LMC: hole VC = LMC + t, RC = MMC − t − T; pin VC = LMC − t, RC = MMC + t + T', () => {
		const hole = ok({
			callout: 'Ø10 +0.2/0',
			internal: true,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '0.1', 'lmc')],
			actual: '10.05'
		});
		expect(hole.controls[0].text).toMatchObject({
			virtualCondition: '10.30',
			resultantCondition: '9.70',
			bonus: '0.15',
			allowed: '0.25'
		});
		const pin = ok({
			callout: 'Ø10 0/-0.2',
			internal: false,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '0.1', 'lmc')]
		});
		expect(pin.controls[0].text).toMatchObject({
			virtualCondition: '9.7',
			resultantCondition: '10.3'
		});
	});

	test('RFS: inner and outer boundaries, no VC or RC, no bonus', () => {
		const hole = ok({
			callout: 'Ø10 +0.2/0',
			internal: true,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '0.1', 'rfs')],
			actual: '10.1'
		});
		expect(hole.controls[0].text).toMatchObject({
			innerBoundary: '9.9',
			outerBoundary: '10.3',
			virtualCondition: null,
			resultantCondition: null,
			bonus: '0.0'
		});
		const pin = ok({
			callout: 'Ø10 0/-0.2',
			internal: false,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '0.1', 'rfs')]
		});
		expect(pin.controls[0].text).toMatchObject({ innerBoundary: '9.7', outerBoundary: '10.1' });
	});

	test('surface form controls make no virtual condition', () => {
		const f = ok({
			callout: 'Ø10 0/-0.2',
			internal: false,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [
				control('cylindricity', '0.01', 'rfs', 'surface'),
				control('circularity', '0.01', 'mmc', 'surface')
			]
		});
		expect(f.controls.map((c) => c.boundaries)).toEqual([null, null]);
		expect(f.controls[1].note).toMatch(/not allowed/);
	});

	test('an actual size outside the limits earns no bonus', () => {
		const f = ok({
			callout: 'Ø10 +0.2/0',
			internal: true,
			units: 'mm',
			standard: 'asme-y14.5-2018',
			controls: [control('position', '0.1', 'mmc')],
			actual: '10.3'
		});
		expect(f.actual?.withinLimits).toBe(false);
		expect(f.controls[0].bonus).toBeNull();
	});
});
