/*
 * One feature of size, evaluated: limits, MMC/LMC, whether the envelope applies and why, gauge
 * sizes, and the boundaries its geometric tolerances make (PRODUCT.md §4). Exact Lengths
 * throughout; every value also comes back as a decimal string in the callout's unit.
 */
import { calloutLimits, parseCallout } from './callout';
import type { CalloutSpec, Modifier, Tolerance } from './callout-types';
import {
	ZERO,
	add,
	formatLength,
	neg,
	parseDecimal,
	perUnit,
	sub,
	type Length,
	type Units
} from './decimal';
import { isoLimits } from './iso286';
import {
	STANDARDS,
	isAsme,
	type GeneralTolerance,
	type GoverningStandard
} from './drawing-context';
import { generalLinearTolerance } from './iso2768';
import { titleBlockTolerance } from './title-block';

export type { GoverningStandard, GeneralTolerance } from './drawing-context';

export const CHARACTERISTICS = [
	'straightness',
	'flatness',
	'circularity',
	'cylindricity',
	'profile-of-a-line',
	'profile-of-a-surface',
	'angularity',
	'perpendicularity',
	'parallelism',
	'position',
	'concentricity',
	'symmetry',
	'circular-runout',
	'total-runout'
] as const;

export type Characteristic = (typeof CHARACTERISTICS)[number];

export const MATERIAL_MODIFIERS = ['mmc', 'lmc', 'rfs'] as const;
export type MaterialModifier = (typeof MATERIAL_MODIFIERS)[number];

export interface GeometricControl {
	characteristic: Characteristic;
	/** The tolerance value as written, in the feature's unit ('0.02', '.005'). */
	value: string;
	diameterZone: boolean;
	appliesTo: 'surface' | 'median';
	modifier: MaterialModifier;
	datums: string[];
}

export interface FeatureOverrides {
	envelope?: boolean;
	independency?: boolean;
	stock?: boolean;
	freeState?: boolean;
}

export interface FeatureInput {
	callout?: string;
	spec?: CalloutSpec;
	/** True for a hole (internal feature). May be left out when an ISO 286 code says it. */
	internal?: boolean;
	units: Units;
	standard: GoverningStandard;
	generalTolerance?: GeneralTolerance | null;
	controls?: GeometricControl[];
	overrides?: FeatureOverrides;
	/** Drawing or feature notes; "PERFECT FORM AT MMC NOT REQD" lifts Rule #1. */
	notes?: string;
	/** An actual mating size, as measured, in the feature's unit. */
	actual?: string;
}

export interface FeatureError {
	ok: false;
	message: string;
	/** The character at fault in the callout, or null when the fault is elsewhere. */
	position: number | null;
	field: 'callout' | 'internal' | 'controls' | 'actual';
}

export interface Boundaries {
	innerBoundary: Length;
	outerBoundary: Length;
	virtualCondition: Length | null;
	resultantCondition: Length | null;
}

/** A control's exact values: a ControlEvaluation without its text. */
export interface ControlValues {
	control: GeometricControl;
	value: Length;
	/** Null for surface form controls, and when the feature has no two limits. */
	boundaries: Boundaries | null;
	note: string | null;
	/** At the actual mating size, when one is given and lies within the limits. */
	bonus: { bonus: Length; allowed: Length } | null;
}

export interface ControlEvaluation extends ControlValues {
	text: {
		value: string;
		innerBoundary: string | null;
		outerBoundary: string | null;
		virtualCondition: string | null;
		resultantCondition: string | null;
		bonus: string | null;
		allowed: string | null;
	};
}

export type LimitsSource = 'callout' | 'iso286' | 'general' | 'none';

/** A feature's exact values: a FeatureEvaluation without the text, for callers that judge many. */
export interface FeatureValues {
	ok: true;
	spec: CalloutSpec;
	units: Units;
	internal: boolean;
	/** Decimal places every value is shown with. */
	places: number;
	nominal: Length | null;
	limitsSource: LimitsSource;
	/** Where the limits come from, in words (the ISO code, the general tolerance, or why none). */
	limitsNote: string;
	upper: Length | null;
	lower: Length | null;
	tolerance: Length | null;
	mmc: Length | null;
	lmc: Length | null;
	envelope: { applies: boolean; reason: string };
	gauges: { go: Length | null; noGo: Length | null; note: string | null };
	/** The largest form deviation the size tolerance permits. */
	formDeviation: Length | 'unbounded' | null;
	controls: ControlValues[];
	actual: { value: Length; withinLimits: boolean } | null;
}

export interface FeatureEvaluation extends FeatureValues {
	controls: ControlEvaluation[];
	text: {
		upper: string | null;
		lower: string | null;
		tolerance: string | null;
		mmc: string | null;
		lmc: string | null;
		go: string | null;
		noGo: string | null;
		formDeviation: string | null;
		actual: string | null;
	};
}

export type FeatureResult = FeatureEvaluation | FeatureError;

const PERFECT_FORM_NOTE = /PERFECT\s+FORM\s+AT\s+MMC\s+NOT\s+REQ(?:UIRE)?D/i;
/** Size modifiers only ISO GPS has (Ⓔ of ISO 14405-1 and its other size specifications). */
export const ISO_ONLY_MODIFIERS: readonly Modifier[] = [
	'envelope',
	'twoPointSize',
	'sphereSize',
	'leastSquaresSize',
	'maximumInscribedSize',
	'minimumCircumscribedSize',
	'circumferenceDiameter',
	'areaDiameter',
	'volumeDiameter'
];

export function isSurfaceForm(control: Pick<GeometricControl, 'characteristic' | 'appliesTo'>) {
	const c = control.characteristic;
	if (c === 'circularity' || c === 'cylindricity') return true;
	return (c === 'straightness' || c === 'flatness') && control.appliesTo === 'surface';
}

/** The fewest decimals that show `value` exactly in `units` (capped at the grid). */
export function exactPlaces(value: Length, units: Units): number {
	let step = perUnit(units);
	const max = units === 'mm' ? 7 : 6;
	for (let p = 0; p < max; p++) {
		if (value % step === 0) return p;
		step /= 10;
	}
	return max;
}

export function placesFor(values: (Length | null)[], units: Units, base: number): number {
	let places = base;
	for (let i = 0; i < values.length; i++) places = placesWith(places, values[i], units);
	return places;
}

/** `places`, or more when `value` needs more to show exactly (placesFor one value, no array). */
function placesWith(places: number, value: Length | null, units: Units): number {
	if (value === null) return places;
	const p = exactPlaces(value, units);
	return p > places ? p : places;
}

/** A decimal string in `units` with a leading zero (PRODUCT.md §6). */
export function formatValue(value: Length | null, units: Units, places: number): string | null {
	return value === null ? null : formatLength(value, units, places);
}

function writtenPlaces(spec: CalloutSpec, tolerance: Tolerance | null): number {
	const nominal = spec.nominal?.places ?? 0;
	if (tolerance === null) return nominal;
	switch (tolerance.type) {
		case 'limits':
			return Math.max(tolerance.lower.places, tolerance.upper.places);
		case 'bilateral':
			return Math.max(nominal, tolerance.deviation.places);
		case 'deviations':
			return Math.max(nominal, tolerance.upper.places, tolerance.lower.places);
		case 'single':
			return nominal;
	}
}

function usesIsoNotation(spec: CalloutSpec, general: GeneralTolerance | null | undefined) {
	return (
		spec.toleranceClass !== null ||
		spec.fit !== null ||
		spec.decimalSeparator === ',' ||
		general?.kind === 'iso2768' ||
		hasIsoOnlyModifier(spec.modifiers)
	);
}

function hasIsoOnlyModifier(modifiers: readonly Modifier[]): boolean {
	for (let i = 0; i < modifiers.length; i++)
		if (ISO_ONLY_MODIFIERS.includes(modifiers[i])) return true;
	return false;
}

/** The governing standard to compute with: an unstated one becomes ISO 8015 when ISO notation shows. */
export function effectiveStandard(
	standard: GoverningStandard,
	spec: CalloutSpec,
	general: GeneralTolerance | null | undefined
): { standard: GoverningStandard; assumed: boolean } {
	if (standard !== 'unstated') return { standard, assumed: false };
	if (usesIsoNotation(spec, general)) return { standard: 'iso-8015', assumed: true };
	return { standard: 'unstated', assumed: false };
}

const NO_OVERRIDES: FeatureOverrides = {};

/** The first derived median line straightness or median plane flatness, if any. */
function medianControl(controls: GeometricControl[] | undefined): GeometricControl | undefined {
	if (!controls) return undefined;
	for (let i = 0; i < controls.length; i++) {
		const c = controls[i];
		if (
			(c.characteristic === 'straightness' || c.characteristic === 'flatness') &&
			c.appliesTo === 'median'
		)
			return c;
	}
	return undefined;
}

function envelopeFor(input: FeatureInput, spec: CalloutSpec): { applies: boolean; reason: string } {
	const o = input.overrides ?? NO_OVERRIDES;
	const median = medianControl(input.controls);
	const { standard, assumed } = effectiveStandard(input.standard, spec, input.generalTolerance);
	if (isAsme(standard)) {
		const edition = STANDARDS[standard].label;
		if (o.stock)
			return { applies: false, reason: `${edition}: stock as furnished is exempt from Rule #1` };
		if (o.freeState || spec.modifiers.includes('freeState'))
			return {
				applies: false,
				reason: `${edition}: a non-rigid part in the free state is exempt from Rule #1`
			};
		if (o.independency || spec.modifiers.includes('independency'))
			return { applies: false, reason: `${edition}: the independency symbol lifts Rule #1` };
		if (input.notes && PERFECT_FORM_NOTE.test(input.notes))
			return {
				applies: false,
				reason: `${edition}: the note PERFECT FORM AT MMC NOT REQD lifts Rule #1`
			};
		if (median) {
			const what =
				median.characteristic === 'straightness'
					? 'derived median line straightness'
					: 'derived median plane flatness';
			return {
				applies: false,
				reason: `${edition}: a ${what} lifts Rule #1 (its virtual condition bounds the feature instead)`
			};
		}
		return {
			applies: true,
			reason: `${edition} Rule #1: perfect form at MMC (envelope principle)`
		};
	}
	if (standard === 'iso-8015') {
		const prefix = assumed
			? 'no governing standard stated; ISO GPS notation present, so ISO 8015 is assumed: '
			: 'ISO 8015: ';
		if (o.independency || spec.modifiers.includes('independency'))
			return {
				applies: false,
				reason: `${prefix}independency (the independency symbol is ASME notation)`
			};
		if (spec.modifiers.includes('envelope') || o.envelope)
			return {
				applies: true,
				reason: `${prefix}envelope requirement Ⓔ on the feature (ISO 14405-1)`
			};
		const g = input.generalTolerance;
		if (g?.kind === 'iso2768' && g.envelope)
			return {
				applies: true,
				reason: `${prefix}envelope requirement from the general note ISO 2768-${g.linear}${g.geometric ?? ''}-E`
			};
		return {
			applies: false,
			reason: `${prefix}independency by default; form is not limited by size without Ⓔ`
		};
	}
	if (o.envelope || spec.modifiers.includes('envelope'))
		return {
			applies: true,
			reason: 'no governing standard stated; the feature asks for the envelope'
		};
	return {
		applies: false,
		reason:
			'no governing standard stated: whether the envelope applies is undetermined, so it is not assumed'
	};
}

interface Limits {
	upper: Length | null;
	lower: Length | null;
	source: LimitsSource;
	note: string;
	places: number;
}

function classFor(spec: CalloutSpec, internal: boolean) {
	if (spec.toleranceClass) return spec.toleranceClass;
	if (spec.fit) return internal ? spec.fit.hole : spec.fit.shaft;
	return null;
}

/** No limits, and why. */
function noLimits(note: string, places: number): Limits {
	return { upper: null, lower: null, source: 'none', note, places };
}

/** Basic, reference and thread callouts carry no size tolerance of their own. */
function untoleranced(spec: CalloutSpec): Limits | null {
	if (spec.kind === 'basic')
		return noLimits(
			'basic dimension: theoretically exact, no tolerance of its own',
			spec.nominal?.places ?? 0
		);
	if (spec.kind === 'reference')
		return noLimits(
			'reference dimension: information only, no tolerance',
			spec.nominal?.places ?? 0
		);
	if (spec.kind === 'thread')
		return noLimits(
			`thread: its limits come from its tolerance class${spec.thread?.toleranceClass ? ` ${spec.thread.toleranceClass}` : ''}, not from a size tolerance`,
			0
		);
	return null;
}

/** The limits an ISO 286 class gives at the nominal size. */
function classLimits(nominal: Length, code: string, units: Units): Limits {
	const isoPlaces = units === 'mm' ? 3 : 4;
	const r = isoLimits(nominal, code);
	if (!r.ok) return noLimits(`no limits: ${code} at this size is ${r.reason}`, isoPlaces);
	return {
		upper: r.upper,
		lower: r.lower,
		source: 'iso286',
		note: `ISO 286-2 ${r.code}: IT ${formatLength(r.it, units, placesFor([r.it], units, isoPlaces))}`,
		places: isoPlaces
	};
}

/** The limits the drawing's general tolerance gives a size written with `written` places. */
function generalLimits(
	nominal: Length,
	written: number,
	g: GeneralTolerance | null | undefined,
	units: Units
): Limits {
	if (!g)
		return noLimits(
			'no limits: no tolerance on the callout and no general tolerance on the drawing',
			written
		);
	if (g.kind === 'iso2768') {
		// ISO 2768 is a metric table: read the size in mm, whatever the drawing's unit.
		const r = generalLinearTolerance(nominal, g.linear);
		if (!r.ok) return noLimits(`no limits: ISO 2768-${g.linear} ${r.reason}`, written);
		const dev = r.deviation;
		return {
			upper: add(nominal, dev),
			lower: sub(nominal, dev),
			source: 'general',
			note: `general tolerance ISO 2768-${g.linear}: ±${r.published} mm`,
			places: Math.max(written, exactPlaces(dev, units))
		};
	}
	const r = titleBlockTolerance(written, g, units);
	if (!r.ok) return noLimits(`no limits: ${r.reason}`, written);
	return {
		upper: add(nominal, r.deviation),
		lower: sub(nominal, r.deviation),
		source: 'general',
		note: `general tolerance from the title block: ${written} places ±${r.published}`,
		places: Math.max(written, exactPlaces(r.deviation, units))
	};
}

/** The limits of size: stated on the callout, from its ISO class, or from the general tolerance. */
function limitsFor(input: FeatureInput, spec: CalloutSpec, internal: boolean): Limits {
	const fixed = untoleranced(spec);
	if (fixed) return fixed;
	const stated = calloutLimits(spec);
	const cls = classFor(spec, internal);
	if (stated) {
		const note = cls ? `stated limits (with ${cls.code})` : 'stated on the callout';
		// Written out field by field: an object spread here costs microseconds on Node 20.
		return {
			upper: stated.upper,
			lower: stated.lower,
			source: 'callout',
			note,
			places: writtenPlaces(spec, spec.tolerance)
		};
	}
	const nominal = spec.nominal?.value ?? null;
	if (cls && nominal !== null) return classLimits(nominal, cls.code, spec.units);
	if (nominal === null) return noLimits('no limits: the callout has no size', 0);
	return generalLimits(nominal, spec.nominal?.places ?? 0, input.generalTolerance, spec.units);
}

function resolveSpec(input: FeatureInput): { spec: CalloutSpec } | FeatureError {
	if (input.spec) return { spec: input.spec };
	const feature = input.internal === undefined ? undefined : input.internal ? 'hole' : 'shaft';
	const parsed = parseCallout(input.callout ?? '', { units: input.units, feature });
	if (!parsed.ok)
		return { ok: false, message: parsed.message, position: parsed.position, field: 'callout' };
	return { spec: parsed.spec };
}

function internalFor(input: FeatureInput, spec: CalloutSpec): boolean | null {
	if (input.internal !== undefined) return input.internal;
	if (spec.toleranceClass) return spec.toleranceClass.feature === 'hole';
	return null;
}

/** VC/RC and inner/outer boundaries of one control (PRODUCT.md §4). */
export function controlBoundaries(
	internal: boolean,
	modifier: MaterialModifier,
	mmc: Length,
	lmc: Length,
	t: Length
): Boundaries {
	const T = internal ? sub(lmc, mmc) : sub(mmc, lmc);
	if (modifier === 'mmc') {
		if (internal) {
			const vc = sub(mmc, t);
			const rc = add(add(lmc, t), T);
			return { innerBoundary: vc, outerBoundary: rc, virtualCondition: vc, resultantCondition: rc };
		}
		const vc = add(mmc, t);
		const rc = sub(sub(lmc, t), T);
		return { innerBoundary: rc, outerBoundary: vc, virtualCondition: vc, resultantCondition: rc };
	}
	if (modifier === 'lmc') {
		if (internal) {
			const vc = add(lmc, t);
			const rc = sub(sub(mmc, t), T);
			return { innerBoundary: rc, outerBoundary: vc, virtualCondition: vc, resultantCondition: rc };
		}
		const vc = sub(lmc, t);
		const rc = add(add(mmc, t), T);
		return { innerBoundary: vc, outerBoundary: rc, virtualCondition: vc, resultantCondition: rc };
	}
	return internal
		? {
				innerBoundary: sub(mmc, t),
				outerBoundary: add(lmc, t),
				virtualCondition: null,
				resultantCondition: null
			}
		: {
				innerBoundary: sub(lmc, t),
				outerBoundary: add(mmc, t),
				virtualCondition: null,
				resultantCondition: null
			};
}

/** Bonus tolerance: the actual mating size's departure from MMC (Ⓜ) or LMC (Ⓛ); none RFS. */
export function bonusTolerance(
	internal: boolean,
	modifier: MaterialModifier,
	mmc: Length,
	lmc: Length,
	actual: Length
): Length {
	if (modifier === 'rfs') return ZERO;
	const from = modifier === 'mmc' ? mmc : lmc;
	const departure = internal ? sub(actual, from) : sub(from, actual);
	return modifier === 'mmc' ? departure : neg(departure);
}

function evaluateControl(
	control: GeometricControl,
	t: Length,
	internal: boolean,
	mmc: Length | null,
	lmc: Length | null,
	actual: { value: Length; withinLimits: boolean } | null
): ControlValues {
	let boundaries: Boundaries | null = null;
	let note: string | null = null;
	let bonus: ControlValues['bonus'] = null;
	if (isSurfaceForm(control)) {
		note = 'a surface form control: it makes no virtual condition or boundary';
		if (control.modifier !== 'rfs')
			note += `; ${control.modifier.toUpperCase()} is not allowed on it`;
	} else if (mmc === null || lmc === null) {
		note = 'the feature has no two limits of size, so no boundary can be computed';
	} else {
		boundaries = controlBoundaries(internal, control.modifier, mmc, lmc, t);
		if (actual?.withinLimits) {
			const b = bonusTolerance(internal, control.modifier, mmc, lmc, actual.value);
			bonus = { bonus: b, allowed: add(t, b) };
		}
	}
	return { control, value: t, boundaries, note, bonus };
}

const NO_CONTROLS: GeometricControl[] = [];

/**
 * The exact values of one feature of size, without the text: what evaluateFeature works out,
 * at a fraction of the cost, for callers that judge many features and format few. Never throws.
 */
export function featureValues(input: FeatureInput): FeatureValues | FeatureError {
	const resolved = resolveSpec(input);
	if ('ok' in resolved) return resolved;
	const { spec } = resolved;
	const units = spec.units;
	const internal = internalFor(input, spec);
	if (internal === null)
		return {
			ok: false,
			message: 'say whether the feature is internal (a hole) or external (a shaft)',
			position: null,
			field: 'internal'
		};
	const limits = limitsFor(input, spec, internal);
	const { upper, lower } = limits;
	const tolerance = upper !== null && lower !== null ? sub(upper, lower) : null;
	const mmc = internal ? lower : upper;
	const lmc = internal ? upper : lower;
	const envelope = envelopeFor(input, spec);

	const inputControls = input.controls ?? NO_CONTROLS;
	const controlValues: Length[] = [];
	for (let i = 0; i < inputControls.length; i++) {
		const c = inputControls[i];
		const v = parseDecimal(c.value.trim(), units);
		if (v === null || v.value < 0)
			return {
				ok: false,
				message: `geometric tolerance ${i + 1}: '${c.value}' is not a tolerance value`,
				position: null,
				field: 'controls'
			};
		controlValues.push(v.value);
	}
	let actual: FeatureValues['actual'] = null;
	if (input.actual !== undefined && input.actual.trim() !== '') {
		const v = parseDecimal(input.actual.trim(), units);
		if (v === null || v.value <= 0)
			return {
				ok: false,
				message: `'${input.actual}' is not an actual size`,
				position: null,
				field: 'actual'
			};
		const withinLimits =
			(lower === null || v.value >= lower) && (upper === null || v.value <= upper);
		actual = { value: v.value, withinLimits };
	}

	const places = placesWith(placesWith(limits.places, upper, units), lower, units);
	const formDeviation = tolerance === null ? null : envelope.applies ? tolerance : 'unbounded';
	const controls: ControlValues[] = [];
	for (let i = 0; i < inputControls.length; i++)
		controls.push(evaluateControl(inputControls[i], controlValues[i], internal, mmc, lmc, actual));
	return {
		ok: true,
		spec,
		units,
		internal,
		places,
		nominal: spec.nominal?.value ?? null,
		limitsSource: limits.source,
		limitsNote: limits.note,
		upper,
		lower,
		tolerance,
		mmc,
		lmc,
		envelope,
		gauges: {
			go: mmc,
			noGo: lmc,
			note: envelope.applies
				? null
				: 'without the envelope the drawing asks for two-point sizes only; a full-form go gauge checks more than it requires'
		},
		formDeviation,
		controls,
		actual
	};
}

/** Everything a checker works out for one feature of size. Never throws. */
export function evaluateFeature(input: FeatureInput): FeatureResult {
	const values = featureValues(input);
	if (!values.ok) return values;
	// The text joins the values in place, last, as the type lists it: no copy of the object.
	const e = values as FeatureEvaluation;
	const { units, places, upper, lower, internal, tolerance, formDeviation, actual } = e;
	for (let i = 0; i < e.controls.length; i++) controlText(e.controls[i], units, places);
	const upperText = formatValue(upper, units, places);
	const lowerText = formatValue(lower, units, places);
	const mmcText = internal ? lowerText : upperText;
	const lmcText = internal ? upperText : lowerText;
	const toleranceText = formatValue(tolerance, units, places);
	e.text = {
		upper: upperText,
		lower: lowerText,
		tolerance: toleranceText,
		mmc: mmcText,
		lmc: lmcText,
		go: mmcText,
		noGo: lmcText,
		formDeviation: typeof formDeviation === 'number' ? toleranceText : formDeviation,
		actual: actual
			? formatLength(actual.value, units, placesWith(places, actual.value, units))
			: null
	};
	return e;
}

/** Adds a control's text to its values in place (see evaluateFeature). */
function controlText(c: ControlValues, units: Units, places: number): void {
	const { boundaries, bonus } = c;
	let p = placesWith(places, c.value, units);
	if (boundaries) {
		p = placesWith(p, boundaries.innerBoundary, units);
		p = placesWith(p, boundaries.outerBoundary, units);
	}
	if (bonus) p = placesWith(p, bonus.bonus, units);
	(c as ControlEvaluation).text = {
		value: formatLength(c.value, units, p),
		innerBoundary: boundaries ? formatLength(boundaries.innerBoundary, units, p) : null,
		outerBoundary: boundaries ? formatLength(boundaries.outerBoundary, units, p) : null,
		virtualCondition: formatValue(boundaries?.virtualCondition ?? null, units, p),
		resultantCondition: formatValue(boundaries?.resultantCondition ?? null, units, p),
		bonus: bonus ? formatLength(bonus.bonus, units, p) : null,
		allowed: bonus ? formatLength(bonus.allowed, units, p) : null
	};
}
