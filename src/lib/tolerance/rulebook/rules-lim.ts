/*
 * LIM: limits of size (PRODUCT.md §5). LIM-05 is judged on fit members only.
 */
import type { CalloutSpec, Tolerance, ToleranceClass } from '../callout-types';
import { isAsme } from '../drawing-context';
import { add, mulDiv, parseDecimal, roundToPlaces, sub, type Length } from '../decimal';
import { isoLimits, standardTolerance } from '../iso286';
import { LengthFormat, show, signed, value, type FeatureContext } from './context';
import type { Finding } from './emit';
import { fitList, type FeatureEnv } from './feature-env';

/** Deviations written so that the one in the upper place is below the one in the lower place. */
function invertedDeviations(callout: string, tolerance: Tolerance, units: 'mm' | 'in'): boolean {
	if (tolerance.type !== 'deviations') return false;
	const m = /([+\-−]?\s*\d*[.,]?\d+)\s*\/\s*([+\-−]?\s*\d*[.,]?\d+)/.exec(callout);
	if (!m) return false;
	const first = parseDecimal(m[1].replace(/\s+/g, ''), units);
	const second = parseDecimal(m[2].replace(/\s+/g, ''), units);
	return first !== null && second !== null && first.value < second.value;
}

function unequalPlaces(
	tolerance: Tolerance,
	nominalPlaces: number | null,
	inch: boolean
): string | null {
	if (tolerance.type === 'limits')
		return tolerance.lower.places !== tolerance.upper.places
			? `lower limit ${tolerance.lower.places} places, upper limit ${tolerance.upper.places}`
			: null;
	if (tolerance.type === 'bilateral')
		return inch && nominalPlaces !== null && nominalPlaces !== tolerance.deviation.places
			? `size ${nominalPlaces} places, tolerance ${tolerance.deviation.places}`
			: null;
	if (tolerance.type === 'deviations') {
		const { upper, lower } = tolerance;
		// Metric practice writes a nil deviation as a single 0.
		const bareZero =
			!inch &&
			((upper.value === 0 && upper.places === 0) || (lower.value === 0 && lower.places === 0));
		if (!bareZero && upper.places !== lower.places)
			return `upper deviation ${upper.places} places, lower ${lower.places}`;
		if (inch && nominalPlaces !== null && nominalPlaces !== upper.places)
			return `size ${nominalPlaces} places, tolerance ${upper.places}`;
	}
	return null;
}

/** The two limits a tolerance states beside an ISO class, with the places each was written with. */
function statedLimits(tolerance: Tolerance | null, nominal: Length) {
	if (!tolerance) return null;
	switch (tolerance.type) {
		case 'limits':
			return {
				lower: tolerance.lower.value,
				upper: tolerance.upper.value,
				lowerPlaces: tolerance.lower.places,
				upperPlaces: tolerance.upper.places
			};
		case 'deviations':
			return {
				lower: add(nominal, tolerance.lower.value),
				upper: add(nominal, tolerance.upper.value),
				lowerPlaces: tolerance.lower.places,
				upperPlaces: tolerance.upper.places
			};
		case 'bilateral':
			return {
				lower: sub(nominal, tolerance.deviation.value),
				upper: add(nominal, tolerance.deviation.value),
				lowerPlaces: tolerance.deviation.places,
				upperPlaces: tolerance.deviation.places
			};
		default:
			return null;
	}
}

/**
 * A stated limit agrees with the class when it is the class's limit exactly, or rounded inward
 * to the places written (a lower limit up, an upper limit down): the stated zone never reaches
 * outside the class's. Rounded outward (Ø12 g6 (11.98/11.99): 11.98 is below 11.983) it does not.
 */
function agrees(stated: Length, iso: Length, places: number, units: 'mm' | 'in', lower: boolean) {
	return stated === iso || stated === roundToPlaces(iso, units, places, lower ? 'up' : 'down');
}

/** Stated limits agree with the class's, or for js/JS with the exact ±IT/2 (ISO 286-1 rounds odd IT). */
function statedAgree(
	stated: NonNullable<ReturnType<typeof statedLimits>>,
	iso: { lower: Length; upper: Length; it: Length },
	nominal: Length,
	js: boolean,
	units: 'mm' | 'in'
): boolean {
	const pair = (lower: Length, upper: Length) =>
		agrees(stated.lower, lower, stated.lowerPlaces, units, true) &&
		agrees(stated.upper, upper, stated.upperPlaces, units, false);
	if (pair(iso.lower, iso.upper)) return true;
	if (!js) return false;
	const half = mulDiv(iso.it, 1, 2, 'nearest');
	return pair(sub(nominal, half), add(nominal, half));
}

/** The ISO 286 class that applies to the feature, from its class or its fit designation. */
export function classOf(spec: CalloutSpec, internal: boolean): ToleranceClass | null {
	return spec.toleranceClass ?? (spec.fit ? (internal ? spec.fit.hole : spec.fit.shaft) : null);
}

/** LIM-04: the ISO 286 class itself. */
function classRules(ctx: FeatureContext, out: Finding[], f: LengthFormat): void {
	const { feature } = ctx;
	const spec = ctx.spec!;
	const e = ctx.evaluation!;
	const cls = classOf(spec, feature.internal);
	if (!cls) return;
	const internal = feature.internal;
	if ((cls.feature === 'hole') !== internal) {
		out.push({
			rule: 'LIM-04',
			cause: 'letter-case',
			message: `${cls.code} is a ${cls.feature} class on ${internal ? 'an internal' : 'an external'} feature.`,
			values: [
				value('class', null, cls.code),
				value('feature', null, internal ? 'internal' : 'external')
			],
			line: `${cls.code}: ${cls.feature === 'hole' ? 'capital letter = hole' : 'small letter = shaft'}, but the feature is ${internal ? 'a hole' : 'a shaft'}`,
			fix: `Write the class in ${internal ? 'capitals' : 'small letters'} (${internal ? cls.code.toUpperCase() : cls.code.toLowerCase()}).`
		});
	}
	const nominal = spec.nominal?.value ?? null;
	// A class alone that gave the limits is defined and states nothing to compare with.
	if (nominal === null || (spec.tolerance === null && e.limitsSource === 'iso286')) return;
	const iso = isoLimits(nominal, cls.code);
	if (!iso.ok) {
		out.push({
			rule: 'LIM-04',
			cause: 'undefined',
			message: `${cls.code} is not defined at ${f.show(nominal)}.`,
			values: [value('class', null, cls.code), value('nominal size', nominal, f.show(nominal))],
			line: `${cls.code} at ${f.show(nominal)}: ${iso.reason}`,
			fix: 'Choose a tolerance class ISO 286 defines at this size, or write the limits.'
		});
		return;
	}
	const stated = statedLimits(spec.tolerance, nominal);
	const units = f.units;
	const js = cls.deviation === 'js' || cls.deviation === 'JS';
	if (!stated || statedAgree(stated, iso, nominal, js, units)) return;
	const isoText = `${show(iso.lower, units, 3)}–${show(iso.upper, units, 3)}`;
	out.push({
		rule: 'LIM-04',
		cause: 'disagrees',
		message: `The limits written beside ${cls.code} are not the limits ${cls.code} gives.`,
		values: [
			value('stated lower', stated.lower, f.show(stated.lower)),
			value('stated upper', stated.upper, f.show(stated.upper)),
			value(`${cls.code} lower`, iso.lower, show(iso.lower, units, 3)),
			value(`${cls.code} upper`, iso.upper, show(iso.upper, units, 3))
		],
		line: `stated ${f.show(stated.lower)}–${f.show(stated.upper)}, ${cls.code} at ${f.show(nominal)} gives ${isoText} (ISO 286-2)`,
		fix: `Write ${isoText}, or drop one of the two statements.`
	});
}

/** LIM-02: inverted deviations (the parser refuses zero widths; see parseErrorRule). */
function inversionRule(ctx: FeatureContext, out: Finding[], f: LengthFormat): void {
	const tolerance = ctx.spec!.tolerance;
	const callout = ctx.feature.callout;
	if (!tolerance || tolerance.type !== 'deviations') return;
	if (!invertedDeviations(callout, tolerance, f.units)) return;
	out.push({
		rule: 'LIM-02',
		cause: 'inverted',
		message: 'The deviation written in the upper place is below the one in the lower place.',
		values: [value('callout', null, callout)],
		line: `${callout}: upper place ${signed(f.show(tolerance.lower.value))} below lower place ${signed(f.show(tolerance.upper.value))}`,
		fix: 'Write the larger deviation on top.'
	});
}

/** LIM-03: unequal decimal places (ASME only). */
function placesRule(ctx: FeatureContext, out: Finding[], f: LengthFormat): void {
	const spec = ctx.spec!;
	if (!spec.tolerance || !isAsme(ctx.standard)) return;
	const why = unequalPlaces(spec.tolerance, spec.nominal?.places ?? null, f.units === 'in');
	if (!why) return;
	const callout = ctx.feature.callout;
	out.push({
		rule: 'LIM-03',
		cause: spec.tolerance.type,
		message: `${callout} is written with unequal decimal places.`,
		values: [value('callout', null, callout), value('places', null, why)],
		line: `${callout}: ${why}`,
		fix: 'Add trailing zeros so both values carry the same number of places.'
	});
}

/**
 * Why a feature has no limits, as a cause: 'reference', 'basic', 'no-size', 'not-covered', or
 * 'no-general-tolerance' (which is DOC-01's, not LIM-01's). Null when it has limits.
 */
export function missingLimitsCause(ctx: FeatureContext): string | null {
	const spec = ctx.spec!;
	if (ctx.evaluation!.limitsSource !== 'none') return null;
	// A class not defined at the size is LIM-04's.
	const cls = classOf(spec, ctx.feature.internal);
	if (cls && spec.nominal && !isoLimits(spec.nominal.value, cls.code).ok) return null;
	if (spec.kind === 'reference' || spec.kind === 'basic') return spec.kind;
	if (spec.nominal === null) return 'no-size';
	if (!ctx.drawing.generalTolerance) return 'no-general-tolerance';
	return 'not-covered';
}

function hasProfile(ctx: FeatureContext): boolean {
	for (const c of ctx.feature.controls ?? [])
		if (c.characteristic === 'profile-of-a-surface' || c.characteristic === 'profile-of-a-line')
			return true;
	return false;
}

/** LIM-01: no limits at all. */
function missingLimitsRule(ctx: FeatureContext, env: FeatureEnv, out: Finding[]): void {
	const cause = missingLimitsCause(ctx);
	if (cause === null || cause === 'no-general-tolerance') return;
	// A basic size whose feature a profile tolerance controls is toleranced by the profile.
	if (cause === 'basic' && hasProfile(ctx)) return;
	const { feature } = ctx;
	const e = ctx.evaluation!;
	out.push({
		rule: 'LIM-01',
		cause,
		message: `${feature.label || feature.callout} has no limits of size.`,
		values: [value('callout', null, feature.callout), value('why', null, e.limitsNote)],
		line: `${feature.callout}: ${e.limitsNote}`,
		fix:
			cause === 'reference' || cause === 'basic'
				? 'Dimension the feature with a toleranced size, not a reference or basic one.'
				: 'Give the size its own tolerance.'
	});
}

/** LIM-06: tighter than the team's capability. */
function capabilityRule(ctx: FeatureContext, env: FeatureEnv, out: Finding[], f: LengthFormat) {
	const grade = env.team?.capabilityGrade;
	const e = ctx.evaluation!;
	if (!grade || e.tolerance === null || e.tolerance <= 0) return;
	const size = ctx.spec!.nominal?.value ?? e.lower ?? e.upper;
	const it = size !== null ? standardTolerance(size, grade) : null;
	if (!it || !it.ok || e.tolerance >= it.value) return;
	out.push({
		rule: 'LIM-06',
		cause: 'capability',
		message: `The size tolerance is tighter than ${it.grade}, the team's stated capability.`,
		values: [
			value('size tolerance', e.tolerance, f.show(e.tolerance)),
			value(`${it.grade} at this size`, it.value, show(it.value, f.units, 3))
		],
		line: `size tolerance ${f.show(e.tolerance)} < ${it.grade} ${show(it.value, f.units, 3)} at ${f.show(size!)} (ISO 286-1 table 1)`,
		fix: 'Open the tolerance to what the function needs, or agree the process with the shop.'
	});
}

/** LIM-05: one limit open on a fit member. */
function openLimitRule(ctx: FeatureContext, env: FeatureEnv, out: Finding[], f: LengthFormat) {
	const e = ctx.evaluation!;
	if (env.memberships.length === 0) return;
	if (e.limitsSource !== 'callout' || (e.upper === null) === (e.lower === null)) return;
	const mmcMissing = e.mmc === null;
	out.push({
		rule: 'LIM-05',
		cause: mmcMissing ? 'mmc-side' : 'lmc-side',
		message: mmcMissing
			? `A fit member with no limit on the MMC side: assembly is not guaranteed.`
			: `A fit member with no limit on the LMC side: the looseness of the fit is unbounded.`,
		values: [
			value('MMC', e.mmc, e.mmc === null ? 'open' : f.show(e.mmc)),
			value('LMC', e.lmc, e.lmc === null ? 'open' : f.show(e.lmc)),
			value('fits', null, fitList(env))
		],
		line: `${ctx.feature.callout}: MMC ${e.mmc === null ? 'open' : f.show(e.mmc)}, LMC ${e.lmc === null ? 'open' : f.show(e.lmc)}; member of ${fitList(env)}`,
		fix: 'Give the fit member both limits.'
	});
}

/** The LIM rules of one readable feature that is not a thread. */
export function limitRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[], f: LengthFormat) {
	classRules(ctx, out, f);
	inversionRule(ctx, out, f);
	placesRule(ctx, out, f);
	missingLimitsRule(ctx, env, out);
	capabilityRule(ctx, env, out, f);
	openLimitRule(ctx, env, out, f);
}
