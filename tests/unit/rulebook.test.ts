/*
 * One test per rule that trips it with the numbers expected. Sources beside each value:
 * ISO 286-1/-2 values are checked against isoLimits (whose tables cite ISO 286-2:2010);
 * values marked "recalled" were recalled from memory of the published tables.
 */
import { describe, expect, it } from 'vitest';
import { evaluate, CATALOGUE, RULE_CODES } from '../../src/lib/tolerance/rulebook';
import type {
	RuleResult,
	RulebookDrawing,
	RulebookFeature,
	RulebookFit,
	RulebookTeam
} from '../../src/lib/tolerance/rulebook';
import type { GeometricControl } from '../../src/lib/tolerance/feature';
import { isoLimits, PER_MM, toLength } from '../../src/lib/tolerance';

const iso: RulebookDrawing = {
	units: 'mm',
	standard: 'iso-8015',
	generalTolerance: { kind: 'iso2768', linear: 'm' },
	notes: 'ISO 8015',
	datums: ['A', 'B']
};
const asme: RulebookDrawing = {
	units: 'in',
	standard: 'asme-y14.5-2018',
	generalTolerance: { kind: 'decimal-places', byPlaces: { '2': '0.01', '3': '0.005' } },
	notes: 'ASME Y14.5-2018',
	datums: ['A', 'B']
};

let n = 0;
function feature(
	callout: string,
	internal: boolean,
	more: Partial<RulebookFeature> = {}
): RulebookFeature {
	return {
		id: `f${++n}`,
		kind: internal ? 'hole' : 'shaft',
		internal,
		callout,
		...more
	};
}

function control(
	characteristic: GeometricControl['characteristic'],
	value: string,
	modifier: GeometricControl['modifier'] = 'rfs',
	more: Partial<GeometricControl> = {}
): GeometricControl {
	const median = ['position', 'concentricity', 'symmetry', 'perpendicularity'].includes(
		characteristic
	);
	return {
		characteristic,
		value,
		diameterZone: median,
		appliesTo: median ? 'median' : 'surface',
		modifier,
		datums: [],
		...more
	};
}

function fit(hole: RulebookFeature, shaft: RulebookFeature, more: Partial<RulebookFit> = {}) {
	return {
		id: `fit-${hole.id}-${shaft.id}`,
		holeFeatureId: hole.id,
		shaftFeatureId: shaft.id,
		intent: 'running',
		...more
	} as RulebookFit;
}

function run(
	drawing: RulebookDrawing,
	features: RulebookFeature[],
	fits: RulebookFit[] = [],
	team?: RulebookTeam
): RuleResult[] {
	return evaluate({ drawing, features, fits, team });
}

function one(results: RuleResult[], rule: string): RuleResult {
	const found = results.filter((r) => r.rule === rule);
	expect(found.map((r) => r.key)).toHaveLength(1);
	return found[0];
}

function valueOf(result: RuleResult, name: string): string | undefined {
	return result.values.find((v) => v.name === name)?.text;
}

describe('the catalogue', () => {
	it('explains every rule of PRODUCT.md §5, with its default severity', () => {
		expect(CATALOGUE.map((r) => r.code)).toEqual([...RULE_CODES]);
		const severities = Object.fromEntries(CATALOGUE.map((r) => [r.code, r.severity]));
		expect(severities).toMatchObject({
			'LIM-01': 'critical',
			'LIM-03': 'minor',
			'LIM-06': 'note',
			'ENV-02': 'major',
			'GEO-02': 'critical',
			'FIT-01': 'critical',
			'FIT-06': 'minor',
			'DOC-01': 'major'
		});
		for (const r of CATALOGUE) {
			for (const field of [r.summary, r.checks, r.why, r.example, r.fix, r.clause])
				expect(field.length, `${r.code}`).toBeGreaterThan(10);
		}
	});
});

describe('LIM-01 no limits', () => {
	it('a size given only as a reference dimension', () => {
		const r = one(run(iso, [feature('(2.4)', true, { kind: 'slot' })]), 'LIM-01');
		expect(r.cause).toBe('reference');
		expect(r.severity).toBe('critical');
		expect(r.line).toContain('reference dimension');
	});
	it('a size below the range of ISO 2768-1 (its table starts at 0.5 mm)', () => {
		const r = one(run(iso, [feature('0.4', false, { kind: 'width' })]), 'LIM-01');
		expect(r.cause).toBe('not-covered');
		expect(r.line).toContain('not covered');
	});
	it('a callout that cannot be read', () => {
		const r = one(run(iso, [feature('SLOT 8', true)]), 'LIM-01');
		expect(r.cause).toBe('unreadable');
	});
	it('a basic size is toleranced by the profile that controls it (ASME Y14.5-2018 §11, recalled)', () => {
		const profile = control('profile-of-a-surface', '0.1', 'rfs', { datums: ['A'] });
		expect(run(iso, [feature('[25]', false, { kind: 'width', controls: [profile] })])).toEqual([]);
		expect(one(run(iso, [feature('[25]', false, { kind: 'width' })]), 'LIM-01').cause).toBe(
			'basic'
		);
	});
	it('not when the general tolerance covers the size (8 ±0.2, ISO 2768-1 m over 6 up to 30)', () => {
		expect(run(iso, [feature('8', true, { kind: 'slot' })])).toEqual([]);
	});
});

describe('LIM-02 inverted or zero width', () => {
	it('deviations written smaller on top', () => {
		const r = one(run(iso, [feature('Ø25 +0.01/+0.03', true)]), 'LIM-02');
		// The band 25.010–25.030 is still valid: a slip of notation, minor.
		expect([r.cause, r.severity]).toEqual(['inverted', 'minor']);
	});
	it('equal limits', () => {
		const r = one(run(iso, [feature('25.000-25.000', false)]), 'LIM-02');
		expect([r.cause, r.severity]).toEqual(['zero-width', 'critical']);
	});
});

describe('LIM-03 unequal decimal places (ASME)', () => {
	it('a limit pair with 3 and 4 places', () => {
		const r = one(run(asme, [feature('Ø.250-.2515', true)]), 'LIM-03');
		expect(r.line).toBe('Ø.250-.2515: lower limit 3 places, upper limit 4');
		expect(r.severity).toBe('minor');
	});
	it('an inch size with more places than its ± tolerance', () => {
		const r = one(run(asme, [feature('.2500 ±.001', false)]), 'LIM-03');
		expect(r.cause).toBe('bilateral');
	});
	it('not on an ISO drawing', () => {
		expect(run(iso, [feature('6.00-6.012', true)]).filter((r) => r.rule === 'LIM-03')).toEqual([]);
	});
});

describe('LIM-04 ISO 286 code in conflict', () => {
	it('stated limits that disagree with H7 (25 mm: 0/+0.021, ISO 286-2)', () => {
		const h7 = isoLimits(toLength(25 * PER_MM), 'H7');
		expect(h7.ok && [h7.lower, h7.upper]).toEqual([250_000_000, 250_210_000]);
		const r = one(run(iso, [feature('Ø25 H7 (25.000/25.025)', true)]), 'LIM-04');
		expect(r.cause).toBe('disagrees');
		expect(r.line).toBe('stated 25.000–25.025, H7 at 25.000 gives 25.000–25.021 (ISO 286-2)');
	});
	it('deviations beside a class are checked too, and agreeing ones pass', () => {
		const r = one(run(iso, [feature('Ø25 H7 (+0.025/0)', true)]), 'LIM-04');
		expect(r.line).toBe('stated 25.000–25.025, H7 at 25.000 gives 25.000–25.021 (ISO 286-2)');
		expect(run(iso, [feature('Ø25 H7 (25.000/25.021)', true)])).toEqual([]);
		expect(run(iso, [feature('Ø25 +0.021/0 (H7)', true)])).toEqual([]);
	});
	it('js/JS: exact ±IT/2 and the rounded limits both agree (ISO 286-1:2010 4.3.2.4, recalled)', () => {
		// IT7 at 25 mm is 21 µm (ISO 286-1 table 1): exact ±0.0105, rounded ±0.010.
		expect(run(iso, [feature('Ø25 JS7 (24.9895/25.0105)', true)])).toEqual([]);
		expect(run(iso, [feature('Ø25 JS7 (24.990/25.010)', true)])).toEqual([]);
		expect(one(run(iso, [feature('Ø25 JS7 (24.985/25.015)', true)]), 'LIM-04').cause).toBe(
			'disagrees'
		);
	});
	it('limits rounded outward disagree; inward-rounded ones agree (g6 at 12 mm: 11.983/11.994)', () => {
		// ISO 286-2:2010 table: g6 over 10 up to 18 mm is −0.006/−0.017.
		const out = one(run(iso, [feature('Ø12 g6 (11.98/11.99)', false)]), 'LIM-04');
		expect(out.cause).toBe('disagrees');
		// H7 at 25 mm is 25.000/25.021 (ISO 286-2): 25.00/25.02 is inward, 25.00/25.03 outward.
		expect(run(iso, [feature('Ø25 H7 (25.00/25.02)', true)])).toEqual([]);
		expect(one(run(iso, [feature('Ø25 H7 (25.00/25.03)', true)]), 'LIM-04').cause).toBe(
			'disagrees'
		);
	});
	it('a code not defined at the size (a is not used up to 1 mm, ISO 286-1)', () => {
		const r = one(run(iso, [feature('Ø1 a11', false)]), 'LIM-04');
		expect(r.cause).toBe('undefined');
	});
	it('a hole class on a shaft', () => {
		const r = one(run(iso, [feature('Ø12 H7', false)]), 'LIM-04');
		expect(r.cause).toBe('letter-case');
	});
});

describe('LIM-05 single limit on a fit member', () => {
	it('MMC side missing is critical, LMC side missing (looseness unbounded) is major', () => {
		const hole = feature('10 MAX', true, { controls: [control('position', '0', 'mmc')] });
		const shaft = feature('9.98 MAX', false, { controls: [control('position', '0', 'mmc')] });
		const results = run(iso, [hole, shaft], [fit(hole, shaft)]);
		const lim = results.filter((r) => r.rule === 'LIM-05');
		expect(lim.map((r) => [r.featureId, r.cause, r.severity])).toEqual([
			[hole.id, 'mmc-side', 'critical'],
			[shaft.id, 'lmc-side', 'major']
		]);
		// With an open limit the clearance is unknown: no FIT-01 for the same cause.
		expect(results.filter((r) => r.rule.startsWith('FIT-0'))).toEqual([]);
	});
});

describe('LIM-06 capability', () => {
	it('0.008 on Ø12 is tighter than IT7 (18 µm over 10 up to 18 mm, ISO 286-1 table 1)', () => {
		const r = one(
			run(iso, [feature('12.000-12.008', false)], [], { capabilityGrade: 'IT7' }),
			'LIM-06'
		);
		expect(valueOf(r, 'size tolerance')).toBe('0.008');
		expect(valueOf(r, 'IT7 at this size')).toBe('0.018');
		expect(r.severity).toBe('note');
	});
});

describe('ENV-01 form tolerance that refines nothing', () => {
	const tab = () =>
		feature('.250 ±.005', false, { kind: 'tab', controls: [control('flatness', '.015')] });
	it('ASME: flatness .015 on a tab of size tolerance .010', () => {
		const r = one(run(asme, [tab()]), 'ENV-01');
		expect(r.line).toContain('flatness 0.015 ≥ size tolerance 0.010');
	});
	it('ISO with Ⓔ', () => {
		const r = one(
			run(iso, [feature('6 ±0.1 Ⓔ', false, { controls: [control('flatness', '0.2')] })]),
			'ENV-01'
		);
		expect(valueOf(r, 'size tolerance')).toBe('0.2');
	});
	it('edge case: ISO without Ⓔ is skipped (independency: flatness is the only form limit)', () => {
		const results = run(iso, [
			feature('6 ±0.1', false, { controls: [control('flatness', '0.2')] })
		]);
		expect(results.filter((r) => r.rule === 'ENV-01')).toEqual([]);
	});
	it('edge case: a median-line straightness may exceed the size tolerance', () => {
		const journal = feature('Ø12 g6', false, {
			controls: [
				control('straightness', '0.02', 'mmc', { appliesTo: 'median', diameterZone: true })
			]
		});
		expect(run(iso, [journal])).toEqual([]);
		expect(run({ ...asme, units: 'mm' }, [{ ...journal, callout: 'Ø12 -0.006/-0.017' }])).toEqual(
			[]
		);
	});
});

describe('ENV-02 / ENV-03 nothing bounds a fit member', () => {
	it('ENV-02: an ISO bore without Ⓔ in a running fit', () => {
		const bore = feature('Ø12 H7', true, { controls: [control('position', '0', 'mmc')] });
		const journal = feature('Ø12 g6 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		const results = run(iso, [bore, journal], [fit(bore, journal)]);
		// A position at MMC bounds the bore; a circularity does not.
		expect(results.filter((r) => r.rule === 'ENV-02')).toEqual([]);
		const bare = { ...bore, controls: [control('circularity', '0.005')] };
		const r = one(run(iso, [bare, journal], [fit(bare, journal)]), 'ENV-02');
		expect(r.featureId).toBe(bore.id);
		expect(r.severity).toBe('major');
	});
	it('ENV-03: an ASME pin with Rule #1 lifted by Ⓘ', () => {
		const hole = feature('.2510-.2520', true, { controls: [control('position', '0', 'mmc')] });
		const pin = feature('.2490-.2500', false, {
			kind: 'pin',
			overrides: { independency: true },
			controls: [control('circularity', '.0005')]
		});
		const r = one(run(asme, [hole, pin], [fit(hole, pin)]), 'ENV-03');
		expect(r.featureId).toBe(pin.id);
		expect(r.line).toContain('independency');
	});
});

describe('ENV-04 no governing standard', () => {
	const unstated: RulebookDrawing = { units: 'mm', standard: 'unstated', generalTolerance: null };
	it('undetermined without ISO notation (major)', () => {
		const r = one(run(unstated, [feature('25.000-25.021', true)]), 'ENV-04');
		expect([r.cause, r.severity]).toEqual(['undetermined', 'major']);
	});
	it('ISO 8015 assumed with an ISO 286 class (minor)', () => {
		const r = one(run(unstated, [feature('Ø25 H7', true)]), 'ENV-04');
		expect([r.cause, r.severity]).toEqual(['iso-assumed', 'minor']);
	});
});

describe('GEO rules', () => {
	it('GEO-01: Ⓜ on a feature dimensioned only by reference', () => {
		const r = one(
			run(iso, [
				feature('(8)', true, { controls: [control('position', '0.1', 'mmc', { datums: ['A'] })] })
			]),
			'GEO-01'
		);
		expect(r.cause).toBe('position');
	});
	it('GEO-02: Ⓜ on cylindricity, and on concentricity under the 2009 edition', () => {
		const r = one(
			run(iso, [
				feature('Ø12 g6 Ⓔ', false, { controls: [control('cylindricity', '0.01', 'mmc')] })
			]),
			'GEO-02'
		);
		expect(r.line).toContain('cylindricity 0.010 Ⓜ');
		const y2009: RulebookDrawing = { ...asme, standard: 'asme-y14.5-2009' };
		const c = control('concentricity', '.002', 'mmc', { datums: ['A'] });
		const m = one(run(y2009, [feature('.500-.502', false, { controls: [c] })]), 'GEO-02');
		// 2009 concentricity controls median points and is RFS only (ASME Y14.5-2009 §5.11, recalled).
		expect(m.line).toContain('controls the median points');
		expect(m.line).not.toContain('surface elements');
	});
	it('GEO-03: zero position regardless of size', () => {
		const r = one(
			run(iso, [
				feature('Ø6.6', true, { controls: [control('position', '0', 'rfs', { datums: ['A'] })] })
			]),
			'GEO-03'
		);
		expect(r.severity).toBe('major');
	});
	it('GEO-04: an undefined datum, and a datum letter I on ASME drawings only', () => {
		const f = feature('Ø6.6', true, {
			controls: [control('position', '0.2', 'mmc', { datums: ['A', 'C'] })]
		});
		const r = one(run(iso, [f]), 'GEO-04');
		expect(r.line).toContain('references A C; defined: A B');
		// ASME Y14.5-2018 §7 (recalled) does not use I, O, Q; ISO 5459 has no such ban.
		const g = feature('Ø.250', true, { datumFeature: 'I' });
		expect(one(run(asme, [g]), 'GEO-04').cause).toBe('defines:I');
		const h = feature('Ø6.6', true, { datumFeature: 'I' });
		expect(run(iso, [h]).filter((x) => x.rule === 'GEO-04')).toEqual([]);
		// A datum defined by a feature counts.
		const d = feature('Ø20 H7 Ⓔ', true, { datumFeature: 'C' });
		expect(run(iso, [f, d]).filter((x) => x.rule === 'GEO-04')).toEqual([]);
	});
});

describe('FIT-01 clearance at MMC', () => {
	it('the example of the brief: 6.000 − 6.000 in a running fit', () => {
		const hole = feature('Ø6 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const pin = feature('Ø6 h6 Ⓔ', false, {
			kind: 'pin',
			controls: [control('position', '0', 'mmc')]
		});
		const r = one(run(iso, [hole, pin], [fit(hole, pin)]), 'FIT-01');
		expect(r.line).toBe('MMC hole 6.000 − MMC pin 6.000 = 0.000, required > 0 for a running fit');
		expect(r.fitId).toBe(`fit-${hole.id}-${pin.id}`);
		expect(r.key).toBe(`FIT-01|fit:fit-${hole.id}-${pin.id}|min-clearance`);
	});
	it('edge case: a line-to-line locational clearance fit passes (H7/h6, minimum clearance 0)', () => {
		const hole = feature('Ø6 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const pin = feature('Ø6 h6 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		expect(run(iso, [hole, pin], [fit(hole, pin, { intent: 'locational-clearance' })])).toEqual([]);
	});
	it('a stated minimum replaces the default', () => {
		const hole = feature('Ø12 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const shaft = feature('Ø12 g6 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		const r = one(
			run(iso, [hole, shaft], [fit(hole, shaft, { requiredMinClearance: '0.010' })]),
			'FIT-01'
		);
		// g6 at 12 mm: es −0.006 (ISO 286-2, checked by isoLimits below).
		const g6 = isoLimits(toLength(12 * PER_MM), 'g6');
		expect(g6.ok && g6.upper).toBe(119_940_000);
		expect(r.line).toBe(
			'MMC hole 12.000 − MMC shaft 11.994 = 0.006, required ≥ 0.010 (stated) for a running fit'
		);
	});
});

describe('FIT-02 boundaries', () => {
	it('a journal whose straightness at MMC exceeds the allowance', () => {
		const g6 = isoLimits(toLength(12 * PER_MM), 'g6');
		expect(g6.ok && [g6.lower, g6.upper]).toEqual([119_830_000, 119_940_000]);
		const bore = feature('Ø12 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const journal = feature('Ø12 g6', false, {
			controls: [
				control('straightness', '0.02', 'mmc', { appliesTo: 'median', diameterZone: true }),
				control('position', '0', 'mmc')
			]
		});
		const results = run(iso, [bore, journal], [fit(bore, journal)]);
		expect(results.map((r) => r.rule)).toEqual(['FIT-02']);
		expect(results[0].line).toBe(
			'MMC (envelope) hole 12.000 − VC shaft 12.014 = −0.014, required > 0 for a running fit'
		);
	});
});

describe('FIT-03 interference fit with clearance', () => {
	it('edge case: H7/p6 at 3 mm is a transition fit', () => {
		const h7 = isoLimits(toLength(3 * PER_MM), 'H7');
		const p6 = isoLimits(toLength(3 * PER_MM), 'p6');
		// ISO 286-2: H7 0/+0.010, p6 +0.006/+0.012 at 3 mm.
		expect(h7.ok && [h7.lower, h7.upper]).toEqual([30_000_000, 30_100_000]);
		expect(p6.ok && [p6.lower, p6.upper]).toEqual([30_060_000, 30_120_000]);
		const hole = feature('Ø3 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const shaft = feature('Ø3 p6 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		const r = one(
			run(iso, [hole, shaft], [fit(hole, shaft, { intent: 'interference' })]),
			'FIT-03'
		);
		expect(r.line).toBe(
			'LMC hole 3.010 − LMC shaft 3.006 = 0.004, required ≤ 0 for an interference fit: a transition fit'
		);
		expect(valueOf(r, 'classification')).toBe('transition');
	});
	it('H7/p6 at 18 mm is interference (max clearance 0.018 − 0.018 = 0)', () => {
		const hole = feature('Ø18 H7 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const shaft = feature('Ø18 p6 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		expect(run(iso, [hole, shaft], [fit(hole, shaft, { intent: 'interference' })])).toEqual([]);
	});
});

describe('FIT-04 clearance above the stated maximum', () => {
	it('H8/f7 at 12 mm against 0.060', () => {
		const h8 = isoLimits(toLength(12 * PER_MM), 'H8');
		const f7 = isoLimits(toLength(12 * PER_MM), 'f7');
		// ISO 286-2: H8 0/+0.027, f7 −0.016/−0.034 over 10 up to 18 mm.
		expect(h8.ok && h8.upper).toBe(120_270_000);
		expect(f7.ok && f7.lower).toBe(119_660_000);
		const hole = feature('Ø12 H8 Ⓔ', true, { controls: [control('position', '0', 'mmc')] });
		const shaft = feature('Ø12 f7 Ⓔ', false, { controls: [control('position', '0', 'mmc')] });
		const r = one(
			run(iso, [hole, shaft], [fit(hole, shaft, { requiredMaxClearance: '0.060' })]),
			'FIT-04'
		);
		expect(r.line).toBe('LMC hole 12.027 − LMC shaft 11.966 = 0.061, stated maximum 0.060');
	});
});

describe('FIT-05 fastener budget', () => {
	it('floating: Ø0.5 against H − F = 6.4 − 6.0 (Ø6.6 ±0.2 by ISO 2768-m, M6)', () => {
		const holes = feature('4X Ø6.6', true, {
			controls: [control('position', '0.5', 'mmc', { datums: ['A', 'B'] })]
		});
		const bolts: RulebookFit = {
			id: 'bolts',
			holeFeatureId: holes.id,
			fastener: { callout: 'M6', label: 'bolt' },
			intent: 'floating-fastener'
		};
		const r = one(run(iso, [holes], [bolts]), 'FIT-05');
		expect(r.line).toBe('position 0.5 > H 6.4 − F 6.0 = 0.4 (floating fastener: T = H − F)');
		expect(valueOf(r, 'H − F')).toBe('0.4');
	});
	it('fixed: T₁ 0.2 + T₂ 0.3 against H − F = 0.4', () => {
		const holes = feature('4X Ø6.6', true, {
			controls: [control('position', '0.2', 'mmc', { datums: ['A', 'B'] })]
		});
		const studs: RulebookFit = {
			id: 'studs',
			holeFeatureId: holes.id,
			fastener: { callout: 'M6', label: 'stud', fixedPosition: '0.3' },
			intent: 'fixed-fastener'
		};
		const r = one(run(iso, [holes], [studs]), 'FIT-05');
		expect(r.line).toBe('T₁ + T₂ = 0.5 > H 6.4 − F 6.0 = 0.4 (fixed fastener: T₁ + T₂ = H − F)');
	});
});

describe('FIT-06 fit member not located', () => {
	it('both members without a location control; an ISO 2768-2 class does not exempt them', () => {
		const hole = feature('Ø12 H7 Ⓔ', true);
		const shaft = feature('Ø12 g6 Ⓔ', false);
		const results = run(iso, [hole, shaft], [fit(hole, shaft)]);
		expect(results.map((r) => [r.rule, r.featureId])).toEqual([
			['FIT-06', hole.id],
			['FIT-06', shaft.id]
		]);
		// ISO 2768-2 K gives general perpendicularity and run-out but no position: it locates
		// nothing (ISO 2768-2:1989 scope, recalled), so FIT-06 stands (and DOC-02 for the note).
		const mk: RulebookDrawing = {
			...iso,
			generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
		};
		expect(run(mk, [hole, shaft], [fit(hole, shaft)]).map((r) => r.rule)).toEqual([
			'DOC-02',
			'FIT-06',
			'FIT-06'
		]);
	});
});

describe('fits and fasteners as a checker judges them', () => {
	it('FIT-05 at LMC: t + T = 0.5 + 0.2 = 0.7 > H − F = 0.6 (Ø6.6 +0.2/0, M6; recalled)', () => {
		const holes = feature('4X Ø6.6 +0.2/0', true, {
			controls: [control('position', '0.5', 'lmc', { datums: ['A', 'B'] })]
		});
		const bolts: RulebookFit = {
			id: 'bolts',
			holeFeatureId: holes.id,
			fastener: { callout: 'M6', label: 'bolt' },
			intent: 'floating-fastener'
		};
		const r = one(run(iso, [holes], [bolts]), 'FIT-05');
		expect(r.line).toBe('t + T 0.7 > H 6.6 − F 6.0 = 0.6 (floating fastener: t + T = H − F)');
		expect(valueOf(r, 'boundary')).toContain('MMC − t − T');
		// The same at MMC passes: the VC is the boundary and 0.5 ≤ 0.6.
		const atMmc = feature('4X Ø6.6 +0.2/0', true, {
			controls: [control('position', '0.5', 'mmc', { datums: ['A', 'B'] })]
		});
		const pass = run(iso, [atMmc], [{ ...bolts, holeFeatureId: atMmc.id }]);
		expect(pass.filter((x) => x.rule === 'FIT-05')).toEqual([]);
	});

	it('FIT-05 critical when a fixed fastener is larger than its clearance hole (common practice)', () => {
		const hole = feature('Ø5.5 ±0.1', true, {
			controls: [control('position', '0.1', 'mmc', { datums: ['A', 'B'] })]
		});
		const tapped = feature('M6-6H', true, {
			kind: 'thread',
			controls: [control('position', '0.2', 'rfs', { datums: ['A', 'B'] })]
		});
		const stud: RulebookFit = {
			id: 'stud',
			holeFeatureId: hole.id,
			fastener: { callout: 'M6', label: 'stud' },
			fixedHoleFeatureId: tapped.id,
			intent: 'fixed-fastener'
		};
		const r = one(run(iso, [hole, tapped], [stud]), 'FIT-05');
		expect([r.cause, r.severity]).toEqual(['hole-too-small', 'critical']);
		expect(r.line).toBe('H 5.4 − F 6.0 = −0.6: the hole at MMC is smaller than the fastener');
	});

	it('FIT-05 fixed: T₂ read from the holding hole named by fixedHoleFeatureId', () => {
		const holes = feature('4X Ø6.6', true, {
			controls: [control('position', '0.2', 'mmc', { datums: ['A', 'B'] })]
		});
		const tapped = feature('4X M6-6H', true, {
			kind: 'thread',
			controls: [control('position', '0.3', 'rfs', { datums: ['A', 'B'] })]
		});
		const studs: RulebookFit = {
			id: 'studs',
			holeFeatureId: holes.id,
			fastener: { callout: 'M6', label: 'stud' },
			fixedHoleFeatureId: tapped.id,
			intent: 'fixed-fastener'
		};
		const r = one(run(iso, [holes, tapped], [studs]), 'FIT-05');
		expect(r.line).toBe('T₁ + T₂ = 0.5 > H 6.4 − F 6.0 = 0.4 (fixed fastener: T₁ + T₂ = H − F)');
		// An edit of the holding hole alone re-judges the fit.
		const only = evaluate({
			drawing: iso,
			features: [holes, tapped],
			fits: [studs],
			only: { featureIds: [tapped.id] }
		});
		expect(only.filter((x) => x.rule === 'FIT-05')).toHaveLength(1);
	});

	it('FIT-02: perpendicularity to A counts only in a shared datum frame (common practice)', () => {
		const perp = control('perpendicularity', '0.02', 'mmc', { datums: ['A'] });
		const bore = feature('Ø12 H7 Ⓔ', true, { controls: [perp] });
		const journal = feature('Ø12 g6 Ⓔ', false);
		// Apart: the bore's envelope 12.000 against the journal's 11.994, no false alarm.
		expect(
			run(iso, [bore, journal], [fit(bore, journal)]).filter((r) => r.rule === 'FIT-02')
		).toEqual([]);
		// Both located from A and B: VC 11.980 − 11.994 = −0.014.
		const shared = one(
			run(iso, [bore, journal], [fit(bore, journal, { sharedDatumFrame: true })]),
			'FIT-02'
		);
		expect(shared.line).toBe(
			'VC hole 11.980 − MMC (envelope) shaft 11.994 = −0.014, required > 0 for a running fit'
		);
	});

	it('members on other drawings are judged under their own: ENV-02 on ISO, Rule #1 on ASME', () => {
		// The run is an ISO drawing's; the pin sits on an ASME inch drawing.
		const bore = feature('Ø6.4 +0.1/0', true);
		const pin = feature('Ø.2490-.2495', false, { drawing: asme, kind: 'pin' });
		const results = run(iso, [bore, pin], [fit(bore, pin)]);
		expect(results.filter((r) => r.rule === 'ENV-02').map((r) => r.featureId)).toEqual([bore.id]);
		expect(results.filter((r) => r.featureId === pin.id && r.rule.startsWith('ENV'))).toEqual([]);
		// The fit is judged in the bore's unit: no FIT finding (min clearance 0.0627 mm).
		expect(results.filter((r) => r.subject === 'fit')).toEqual([]);
	});

	it('FIT-03 at the operating temperature: Ø18 H7/p6, aluminium on bronze at 80 °C (see fit.test.ts)', () => {
		const bore = feature('Ø18 H7 Ⓔ', true, { datumFeature: 'C' });
		const bush = feature('Ø18 p6 Ⓔ', false, { kind: 'pin', boughtOut: true });
		const warm = fit(bore, bush, {
			intent: 'interference',
			temperature: { operating: '80', holeCoefficient: '23.6', shaftCoefficient: '17.5' }
		});
		const r = one(run(iso, [bore, bush], [warm]), 'FIT-03');
		expect([r.cause, r.severity]).toEqual(['clearance-at-temperature', 'major']);
		expect(r.line).toBe(
			'maximum clearance 0.0066 at 80 °C (hole α 23.6, pin α 17.5 × 10⁻⁶/K, from 20 °C), required ≤ 0 for an interference fit: a transition fit'
		);
		// At 20 °C alone the same fit is interference: no finding.
		const cold = run(iso, [bore, bush], [fit(bore, bush, { intent: 'interference' })]);
		expect(cold.filter((x) => x.rule === 'FIT-03')).toEqual([]);
	});

	it('FIT-06 does not ask a bought-out member for a location control', () => {
		const hole = feature('Ø12 H7 Ⓔ', true, {
			controls: [control('position', '0.02', 'mmc', { datums: ['A', 'B'] })]
		});
		const pin = feature('Ø12 m6 Ⓔ', false, { kind: 'pin', boughtOut: true });
		const results = run(iso, [hole, pin], [fit(hole, pin, { intent: 'transition' })]);
		expect(results.filter((r) => r.rule === 'FIT-06')).toEqual([]);
		const drawn = feature('Ø12 m6 Ⓔ', false, { kind: 'pin' });
		const again = run(iso, [hole, drawn], [fit(hole, drawn, { intent: 'transition' })]);
		expect(again.filter((r) => r.rule === 'FIT-06').map((r) => r.featureId)).toEqual([drawn.id]);
	});
});

describe('clauses for the edition the drawing states', () => {
	it('an ASME 2018 drawing cites 2018 numbers only, a 2009 drawing 2009 numbers only', () => {
		const f = () => feature('.250-.2515', true);
		const y2018 = one(run(asme, [f()]), 'LIM-03').clause;
		expect(y2018).toContain('ASME Y14.5-2018');
		expect(y2018).not.toContain('2009');
		const y2009 = one(run({ ...asme, standard: 'asme-y14.5-2009' }, [f()]), 'LIM-03').clause;
		expect(y2009).toContain('ASME Y14.5-2009 §1.6 and §2.3');
		expect(y2009).not.toContain('2018');
		// Every ASME number in the catalogue says it was recalled, not read.
		for (const r of CATALOGUE)
			for (const part of r.clause.split('; '))
				if (part.startsWith('ASME Y14.5')) expect(part).toContain('recalled');
	});
});

describe('DOC rules', () => {
	it('DOC-01: a bare size on a drawing with no general tolerance', () => {
		const r = one(run({ ...iso, generalTolerance: null }, [feature('8', true)]), 'DOC-01');
		expect(r.line).toBe('8 without a tolerance; the drawing states no general tolerance');
	});
	it('DOC-02: concentricity on Y14.5-2018, Ⓘ on ISO, ISO 2768-2 withdrawn', () => {
		const c = control('concentricity', '.002', 'rfs', { datums: ['A'] });
		const r = one(run(asme, [feature('.500-.502', false, { controls: [c] })]), 'DOC-02');
		expect(r.cause).toBe('concentricity');
		const i = one(run(iso, [feature('Ø12 g6 Ⓘ', false)]), 'DOC-02');
		expect(i.cause).toBe('independency');
		const mk: RulebookDrawing = {
			...iso,
			generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
		};
		const w = one(run(mk, []), 'DOC-02');
		expect([w.subject, w.cause]).toEqual(['drawing', 'withdrawn-iso-2768-2']);
	});
});

describe('team settings', () => {
	it('a severity override replaces the default', () => {
		const r = one(
			run(asme, [feature('Ø.250-.2515', true)], [], { severityOverrides: { 'LIM-03': 'major' } }),
			'LIM-03'
		);
		expect(r.severity).toBe('major');
	});
});

describe('clean drawings trip nothing', () => {
	it('ISO 8015', () => {
		const bore = feature('Ø20 H7 Ⓔ', true, {
			controls: [control('position', '0', 'mmc', { datums: ['A', 'B'] })]
		});
		const shaft = feature('Ø20 f7 Ⓔ', false, {
			controls: [control('perpendicularity', '0', 'mmc', { datums: ['A'] })]
		});
		const seat = feature('Ø18 H7 Ⓔ', true, {
			controls: [control('position', '0.02', 'mmc', { datums: ['A', 'B'] })]
		});
		const sleeve = feature('Ø18 s6 Ⓔ', false, {
			controls: [control('circular-runout', '0.02', 'rfs', { datums: ['A'] })]
		});
		const holes = feature('4X Ø6.6', true, {
			controls: [control('position', '0.2', 'mmc', { datums: ['A', 'B'] })]
		});
		const width = feature('25', false, { kind: 'width', controls: [] });
		const features = [bore, shaft, seat, sleeve, holes, width];
		const fits: RulebookFit[] = [
			fit(bore, shaft),
			fit(seat, sleeve, { intent: 'interference' }),
			{
				id: 'bolts',
				holeFeatureId: holes.id,
				fastener: { callout: 'M6' },
				intent: 'floating-fastener'
			}
		];
		expect(run(iso, features, fits)).toEqual([]);
	});
	for (const standard of ['asme-y14.5-2018', 'asme-y14.5-2009'] as const) {
		it(standard, () => {
			const hole = feature('.2510-.2520', true, {
				controls: [control('position', '.000', 'mmc', { datums: ['A', 'B'] })]
			});
			const pin = feature('.2490-.2500', false, {
				kind: 'pin',
				controls: [control('perpendicularity', '.000', 'mmc', { datums: ['A'] })]
			});
			const tab = feature('.250 ±.005', false, {
				kind: 'tab',
				controls: [control('flatness', '.005')]
			});
			const base = feature('.25', false, { kind: 'width' });
			expect(run({ ...asme, standard }, [hole, pin, tab, base], [fit(hole, pin)])).toEqual([]);
		});
	}
});

describe('results', () => {
	it('are deterministic, in subject then rule order, with unique keys', () => {
		const hole = feature('Ø.250-.2515', true);
		const pin = feature('Ø.2500-.249', false, { kind: 'pin' });
		const features = [hole, pin];
		const fits = [fit(hole, pin)];
		const a = run(asme, features, fits);
		expect(run(asme, features, fits)).toEqual(a);
		expect(new Set(a.map((r) => r.key)).size).toBe(a.length);
		expect(a.map((r) => `${r.rule} ${r.featureId}`)).toEqual([
			`LIM-03 ${hole.id}`,
			`FIT-06 ${hole.id}`,
			`LIM-03 ${pin.id}`,
			`FIT-06 ${pin.id}`,
			`FIT-01 ${hole.id}`
		]);
		for (const r of a) {
			expect(r.fix.length).toBeGreaterThan(5);
			expect(r.clause.length).toBeGreaterThan(5);
			expect(r.line.length).toBeGreaterThan(5);
		}
	});
});
