/*
 * A hole with a shaft or a bought fastener: clearances from the limits and from the boundaries,
 * classification, the verdict against the intent, fastener budgets and an optional operating
 * temperature (PRODUCT.md §4). Exact Lengths; strings in the hole's unit.
 */
import type { CalloutSpec } from './callout-types';
import { ZERO, formatLength, sub, toLength, type Length, type Units } from './decimal';
import { fastenerBudget, readLength, type FastenerBudget, type FastenerInput } from './fastener';
import {
	evaluateFeature,
	exactPlaces,
	featureValues,
	formatValue,
	isSurfaceForm,
	placesFor,
	type FeatureError,
	type FeatureEvaluation,
	type FeatureValues,
	type FeatureOverrides,
	type GeneralTolerance,
	type GeometricControl,
	type GoverningStandard
} from './feature';
import { classifyFit, type FitClassification } from './iso286';
import { expand, readThermal, type TemperatureInput } from './thermal';

export type { FastenerBudget, FastenerInput } from './fastener';
export type { TemperatureInput } from './thermal';

export const FIT_INTENTS = [
	'running',
	'locational-clearance',
	'transition',
	'interference',
	'floating-fastener',
	'fixed-fastener'
] as const;

export type FitIntent = (typeof FIT_INTENTS)[number];

export interface FitMemberInput {
	callout?: string;
	spec?: CalloutSpec;
	/** Defaults to the fit's units. */
	units?: Units;
	controls?: GeometricControl[];
	overrides?: FeatureOverrides;
	notes?: string;
}

export interface FitInput {
	hole: FitMemberInput;
	shaft?: FitMemberInput;
	fastener?: FastenerInput;
	units: Units;
	standard: GoverningStandard;
	generalTolerance?: GeneralTolerance | null;
	intent?: FitIntent;
	/** In the hole's unit. */
	requiredMinClearance?: string;
	requiredMaxClearance?: string;
	temperature?: TemperatureInput;
}

export interface FitError {
	ok: false;
	member: 'hole' | 'shaft' | 'fastener' | 'fit';
	message: string;
	position: number | null;
	field: FeatureError['field'] | 'requiredMinClearance' | 'requiredMaxClearance' | 'temperature';
}

export interface FitCheck {
	what: string;
	ok: boolean;
	text: string;
}

/** A fit's exact values and verdict: a FitEvaluation without the text, for callers that judge many. */
export interface FitValues {
	ok: true;
	units: Units;
	places: number;
	intent: FitIntent | null;
	hole: FeatureValues;
	shaft: FeatureValues;
	memberKind: 'shaft' | 'fastener';
	basicSize: Length | null;
	minClearance: Length | null;
	maxClearance: Length | null;
	classification: FitClassification | null;
	/** From the boundaries (VC, envelope at MMC), when geometric tolerances apply. */
	minClearanceAtBoundary: Length | null;
	maxClearanceAtBoundary: Length | null;
	boundaryNote: string | null;
	checks: FitCheck[];
	verdict: 'pass' | 'fail' | 'undetermined';
	fastener: FastenerBudget | null;
	temperature: {
		operating: string;
		minClearance: Length;
		maxClearance: Length;
		classification: FitClassification;
	} | null;
}

export interface FitEvaluation extends FitValues {
	hole: FeatureEvaluation;
	shaft: FeatureEvaluation;
	text: {
		minClearance: string | null;
		maxClearance: string | null;
		minClearanceAtBoundary: string | null;
		maxClearanceAtBoundary: string | null;
		hole: { upper: string | null; lower: string | null };
		shaft: { upper: string | null; lower: string | null };
		temperature: { minClearance: string; maxClearance: string } | null;
		fastener: {
			H: string;
			F: string;
			available: string;
			used: string | null;
			required: string | null;
		} | null;
	};
}

export type FitResult = FitEvaluation | FitError;

/** A member's values, with its text when `text` is set (then a FeatureEvaluation). */
function member(
	input: FitMemberInput,
	internal: boolean,
	fit: FitInput,
	text: boolean
): FeatureValues | FeatureError {
	return (text ? evaluateFeature : featureValues)({
		callout: input.callout,
		spec: input.spec,
		internal,
		units: input.units ?? fit.units,
		standard: fit.standard,
		generalTolerance: fit.generalTolerance,
		controls: input.controls,
		overrides: input.overrides,
		notes: input.notes
	});
}

/** A bought fastener's MMC: its largest size. A thread counts at its nominal major diameter. */
function fastenerMember(
	f: FastenerInput,
	fit: FitInput,
	text: boolean
): FeatureValues | FeatureError {
	const e = (text ? evaluateFeature : featureValues)({
		callout: f.callout,
		internal: false,
		units: f.units ?? fit.units,
		standard: fit.standard
	});
	if (!e.ok || e.spec.kind !== 'thread' || !e.spec.thread) return e;
	// The evaluation is ours alone, so it is changed in place (a copy by spread is slow).
	const major = e.spec.thread.diameter.value;
	e.upper = major;
	e.lower = major;
	e.tolerance = ZERO;
	e.mmc = major;
	e.lmc = major;
	e.limitsSource = 'callout';
	e.limitsNote = 'thread: counted at its nominal major diameter';
	if (text) {
		const t = (e as FeatureEvaluation).text;
		t.upper = formatValue(major, e.units, e.places);
		t.lower = formatValue(major, e.units, e.places);
		t.mmc = formatValue(major, e.units, e.places);
		t.lmc = formatValue(major, e.units, e.places);
		t.tolerance = formatValue(ZERO, e.units, e.places);
	}
	return e;
}

/** The smallest a hole's mating envelope can be, and the largest a shaft's, from its boundaries. */
function matingBoundary(f: FeatureValues): {
	mmcSide: Length | null;
	lmcSide: Length | null;
	controlled: boolean;
} {
	// A hole's mating envelope is bounded by the smallest of its MMC-side values and the largest
	// of its LMC-side ones; a shaft's the other way round.
	let mmcSide: Length | null = null;
	let lmcSide: Length | null = null;
	let controlled = false;
	for (let i = 0; i < f.controls.length; i++) {
		const c = f.controls[i];
		if (!c.boundaries || isSurfaceForm(c.control)) continue;
		controlled = true;
		const { innerBoundary, outerBoundary } = c.boundaries;
		mmcSide = bound(mmcSide, f.internal ? innerBoundary : outerBoundary, f.internal);
		lmcSide = bound(lmcSide, f.internal ? outerBoundary : innerBoundary, !f.internal);
	}
	if (f.envelope.applies && f.mmc !== null) mmcSide = bound(mmcSide, f.mmc, f.internal);
	if (f.lmc !== null) lmcSide = bound(lmcSide, f.lmc, !f.internal);
	return { mmcSide, lmcSide, controlled };
}

/** The smaller (or larger) of a running bound and a value; the earlier one on a tie. */
function bound(so: Length | null, value: Length, smallest: boolean): Length {
	if (so === null) return value;
	return smallest === so < value ? so : value;
}

/** A clearance in the hole's unit with at least the hole's places, more where it needs them. */
function clearanceText(value: Length, units: Units, places: number): string {
	return formatLength(value, units, Math.max(places, exactPlaces(value, units)));
}

function defaultChecks(
	intent: FitIntent | null,
	minC: Length | null,
	maxC: Length | null,
	units: Units,
	places: number
): FitCheck[] {
	const checks: FitCheck[] = [];
	if (intent === 'running') {
		checks.push({
			what: 'running fit: minimum clearance above zero',
			ok: minC !== null && minC > 0,
			text:
				minC === null
					? 'minimum clearance unknown'
					: `minimum clearance ${clearanceText(minC, units, places)}`
		});
	} else if (
		intent === 'locational-clearance' ||
		intent === 'floating-fastener' ||
		intent === 'fixed-fastener'
	) {
		checks.push({
			what: 'clearance fit: minimum clearance not below zero',
			ok: minC !== null && minC >= 0,
			text:
				minC === null
					? 'minimum clearance unknown'
					: `minimum clearance ${clearanceText(minC, units, places)}`
		});
	} else if (intent === 'interference') {
		checks.push({
			what: 'interference fit: maximum clearance not above zero',
			ok: maxC !== null && maxC <= 0,
			text:
				maxC === null
					? 'maximum clearance unknown'
					: `maximum clearance ${clearanceText(maxC, units, places)}`
		});
	}
	return checks;
}

/**
 * Clearances, classification and verdict of one fit, without the text: what evaluateFit works
 * out, for callers that judge many fits. The members come back as FeatureValues. Never throws.
 */
export function fitValues(input: FitInput): FitValues | FitError {
	return fitWith(input, false);
}

/** Clearances, classification and verdict of one fit. Never throws. */
export function evaluateFit(input: FitInput): FitResult {
	const values = fitWith(input, true);
	if (!values.ok) return values;
	// The members were evaluated with their text; the fit's joins the values in place, last.
	const e = values as FitEvaluation;
	e.text = fitText(e);
	return e;
}

type Members =
	{ hole: FeatureValues; shaft: FeatureValues; memberKind: 'shaft' | 'fastener' } | FitError;

/** Both members evaluated (with their text when `text` is set). */
function members(input: FitInput, text: boolean): Members {
	const hole = member(input.hole, true, input, text);
	if (!hole.ok) return { ...hole, member: 'hole' };
	if (input.shaft) {
		const shaft = member(input.shaft, false, input, text);
		if (!shaft.ok) return { ...shaft, member: 'shaft' };
		return { hole, shaft, memberKind: 'shaft' };
	}
	if (input.fastener) {
		const shaft = fastenerMember(input.fastener, input, text);
		if (!shaft.ok) return { ...shaft, member: 'fastener' };
		return { hole, shaft, memberKind: 'fastener' };
	}
	return {
		ok: false,
		member: 'fit',
		message: 'a fit needs a shaft or a fastener',
		position: null,
		field: 'callout'
	};
}

interface AtBoundary {
	controlled: boolean;
	min: Length | null;
	max: Length | null;
	note: string | null;
}

/** Clearances between the members' mating boundaries (VC, envelope at MMC). */
function boundaryClearances(hole: FeatureValues, shaft: FeatureValues): AtBoundary {
	const hb = matingBoundary(hole);
	const sb = matingBoundary(shaft);
	const out: AtBoundary = {
		controlled: hb.controlled || sb.controlled,
		min: null,
		max: null,
		note: null
	};
	if (!out.controlled) return out;
	if (hb.mmcSide !== null && sb.mmcSide !== null) out.min = sub(hb.mmcSide, sb.mmcSide);
	else
		out.note = `nothing bounds the ${hb.mmcSide === null ? 'hole' : 'shaft'}'s mating envelope at MMC (no envelope and no MMC control)`;
	if (hb.lmcSide !== null && sb.lmcSide !== null) out.max = sub(hb.lmcSide, sb.lmcSide);
	return out;
}

function clearanceError(
	field: 'requiredMinClearance' | 'requiredMaxClearance',
	text?: string
): FitError {
	return {
		ok: false,
		member: 'fit',
		message: `'${text}' is not a clearance`,
		position: null,
		field
	};
}

/** The checks of stated minimum and maximum clearances. */
function requiredChecks(
	reqMin: Length | undefined,
	reqMax: Length | undefined,
	minClearance: Length | null,
	maxClearance: Length | null,
	units: Units,
	hp: number
): FitCheck[] {
	const checks: FitCheck[] = [];
	if (reqMin !== undefined) {
		checks.push({
			what: `minimum clearance at least ${clearanceText(reqMin, units, hp)}`,
			ok: minClearance !== null && minClearance >= reqMin,
			text:
				minClearance === null
					? 'minimum clearance unknown'
					: `minimum clearance ${clearanceText(minClearance, units, hp)}`
		});
	}
	if (reqMax !== undefined) {
		checks.push({
			what: `maximum clearance at most ${clearanceText(reqMax, units, hp)}`,
			ok: maxClearance !== null && maxClearance <= reqMax,
			text:
				maxClearance === null
					? 'maximum clearance unknown (a limit is open)'
					: `maximum clearance ${clearanceText(maxClearance, units, hp)}`
		});
	}
	return checks;
}

/** The least clearance the boundaries must leave: stated, or what the intent implies. */
function boundaryFloor(intent: FitIntent | null, reqMin: Length | undefined): Length | null {
	if (reqMin !== undefined) return reqMin;
	if (intent === 'running') return toLength(1);
	if (
		intent === 'locational-clearance' ||
		intent === 'floating-fastener' ||
		intent === 'fixed-fastener'
	)
		return ZERO;
	return null;
}

function boundaryCheck(b: AtBoundary, floor: Length, units: Units, hp: number): FitCheck {
	return {
		what: 'assembles at the boundaries (virtual condition, envelope)',
		ok: b.min !== null && b.min >= floor,
		text:
			b.min === null
				? (b.note ?? 'boundary unknown')
				: `minimum clearance at the boundaries ${clearanceText(b.min, units, hp)}`
	};
}

function fastenerCheck(b: FastenerBudget, units: Units, hp: number): FitCheck {
	return {
		what: b.text,
		ok: b.ok === true,
		text: `H − F = ${clearanceText(b.available, units, hp)}${b.used !== null ? `, position tolerance ${clearanceText(b.used, units, hp)}` : ''}${b.required !== null ? `, hole needed ${clearanceText(b.required, units, hp)}` : ''}`
	};
}

/** The clearances at the operating temperature, null without one, or what is wrong with it. */
function temperatureResult(
	input: TemperatureInput | undefined,
	hole: FeatureValues,
	shaft: FeatureValues
): FitValues['temperature'] | FitError {
	if (!input) return null;
	const t = readThermal(input);
	if (t === null)
		return {
			ok: false,
			member: 'fit',
			message: 'the temperature and both expansion coefficients must be decimal numbers',
			position: null,
			field: 'temperature'
		};
	if (hole.lower === null || hole.upper === null || shaft.lower === null || shaft.upper === null)
		return null;
	const minT = sub(expand(hole.lower, t.hole, t.deltaT), expand(shaft.upper, t.shaft, t.deltaT));
	const maxT = sub(expand(hole.upper, t.hole, t.deltaT), expand(shaft.lower, t.shaft, t.deltaT));
	return {
		operating: t.operating,
		minClearance: minT,
		maxClearance: maxT,
		classification: classifyFit(minT, maxT)
	};
}

function fitWith(input: FitInput, text: boolean): FitValues | FitError {
	const m = members(input, text);
	if ('ok' in m) return m;
	const { hole, shaft, memberKind } = m;
	const units = hole.units;
	const intent = input.intent ?? null;
	const minClearance =
		hole.lower !== null && shaft.upper !== null ? sub(hole.lower, shaft.upper) : null;
	const maxClearance =
		hole.upper !== null && shaft.lower !== null ? sub(hole.upper, shaft.lower) : null;
	const classification =
		minClearance !== null && maxClearance !== null ? classifyFit(minClearance, maxClearance) : null;
	const atBoundary = boundaryClearances(hole, shaft);

	const hp = hole.places;
	const reqMin = readLength(input.requiredMinClearance, units);
	if (reqMin === null) return clearanceError('requiredMinClearance', input.requiredMinClearance);
	const reqMax = readLength(input.requiredMaxClearance, units);
	if (reqMax === null) return clearanceError('requiredMaxClearance', input.requiredMaxClearance);
	const checks = defaultChecks(intent, minClearance, maxClearance, units, hp);
	checks.push(...requiredChecks(reqMin, reqMax, minClearance, maxClearance, units, hp));
	const floor = atBoundary.controlled ? boundaryFloor(intent, reqMin) : null;
	if (floor !== null) checks.push(boundaryCheck(atBoundary, floor, units, hp));

	let fastener: FastenerBudget | null = null;
	if (intent === 'floating-fastener' || intent === 'fixed-fastener') {
		const budget = fastenerBudget(hole, shaft, input.fastener, intent, units);
		if (budget && !('H' in budget))
			return {
				ok: false,
				member: 'fastener',
				message: budget.message,
				position: null,
				field: 'controls'
			};
		fastener = budget;
		if (fastener && fastener.ok !== null) checks.push(fastenerCheck(fastener, units, hp));
	}

	const temperature = temperatureResult(input.temperature, hole, shaft);
	if (temperature && 'ok' in temperature) return temperature;

	return {
		ok: true,
		units,
		places: placesFor([minClearance, maxClearance, atBoundary.min, atBoundary.max], units, hp),
		intent,
		hole,
		shaft,
		memberKind,
		basicSize: hole.nominal ?? shaft.nominal ?? null,
		minClearance,
		maxClearance,
		classification,
		minClearanceAtBoundary: atBoundary.min,
		maxClearanceAtBoundary: atBoundary.max,
		boundaryNote: atBoundary.note,
		checks,
		verdict: checks.length === 0 ? 'undetermined' : allPass(checks) ? 'pass' : 'fail',
		fastener,
		temperature
	};
}

function fitText(e: FitEvaluation): FitEvaluation['text'] {
	const { units, hole, shaft, temperature, fastener } = e;
	const hp = hole.places;
	const sp = shaft.units === units ? shaft.places : hp;
	return {
		minClearance: clearanceOrNull(e.minClearance, units, hp),
		maxClearance: clearanceOrNull(e.maxClearance, units, hp),
		minClearanceAtBoundary: clearanceOrNull(e.minClearanceAtBoundary, units, hp),
		maxClearanceAtBoundary: clearanceOrNull(e.maxClearanceAtBoundary, units, hp),
		hole: { upper: hole.text.upper, lower: hole.text.lower },
		shaft: {
			upper: formatValue(shaft.upper, units, placesFor([shaft.upper], units, sp)),
			lower: formatValue(shaft.lower, units, placesFor([shaft.lower], units, sp))
		},
		temperature: temperature
			? {
					minClearance: clearanceText(temperature.minClearance, units, hp),
					maxClearance: clearanceText(temperature.maxClearance, units, hp)
				}
			: null,
		fastener: fastener
			? {
					H: clearanceText(fastener.H, units, hp),
					F: clearanceText(fastener.F, units, hp),
					available: clearanceText(fastener.available, units, hp),
					used: clearanceOrNull(fastener.used, units, hp),
					required: clearanceOrNull(fastener.required, units, hp)
				}
			: null
	};
}

function allPass(checks: FitCheck[]): boolean {
	for (let i = 0; i < checks.length; i++) if (!checks[i].ok) return false;
	return true;
}

function clearanceOrNull(value: Length | null, units: Units, places: number): string | null {
	return value === null ? null : clearanceText(value, units, places);
}
