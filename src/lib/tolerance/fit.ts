/*
 * A hole with a shaft or a bought fastener: clearances from the limits and from the boundaries,
 * classification, the verdict against the intent, fastener budgets and an optional operating
 * temperature (PRODUCT.md §4). Each member is read under its own drawing (units, standard,
 * general tolerance), and the fit is computed in the hole's unit: a shaft drawn in the other
 * unit has its limits converted inward to the hole's places (convertLimitsInward), so the
 * converted zone never reaches outside the drawn one. Exact Lengths; strings in the hole's unit.
 */
import type { CalloutSpec } from './callout-types';
import {
	ZERO,
	convertLimitsInward,
	formatLength,
	roundToPlaces,
	sub,
	type Length,
	type Units
} from './decimal';
import type { DrawingContext } from './drawing-context';
import { fastenerBudget, readLength, type FastenerBudget, type FastenerInput } from './fastener';
import {
	evaluateFeature,
	featureValues,
	formatValue,
	placesFor,
	type ControlValues,
	type FeatureError,
	type FeatureEvaluation,
	type FeatureValues,
	type FeatureOverrides,
	type GeneralTolerance,
	type GeometricControl,
	type GoverningStandard
} from './feature';
import {
	allPass,
	boundaryCheck,
	boundaryFloor,
	clearanceText,
	fastenerCheck,
	intentChecks,
	requiredChecks,
	type Clearances,
	type FitCheck
} from './fit-checks';
import { classifyFit, type FitClassification } from './iso286';
import { boughtBoundary, matingBoundary, type MatingBoundary } from './mating';
import { expand, readThermal, type TemperatureInput } from './thermal';

export type { FastenerBudget, FastenerInput } from './fastener';
export type { FitCheck } from './fit-checks';
export type { MatingBoundary } from './mating';
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
	/**
	 * The drawing the member sits on, when it is not the fit's own (a journal on the shaft
	 * drawing in a bore on the bushing drawing): its units, standard and general tolerance.
	 */
	drawing?: DrawingContext;
	/** Defaults to the drawing's units, then the fit's. */
	units?: Units;
	controls?: GeometricControl[];
	overrides?: FeatureOverrides;
	notes?: string;
}

export interface FitInput {
	hole: FitMemberInput;
	shaft?: FitMemberInput;
	fastener?: FastenerInput;
	/** A fixed fastener's holding hole (tapped or press-fit) as a feature: T₂ is its position tolerance. */
	fixedHole?: FitMemberInput;
	units: Units;
	standard: GoverningStandard;
	generalTolerance?: GeneralTolerance | null;
	intent?: FitIntent;
	/**
	 * Both members are located by the same datum features: their orientation and location
	 * controls then enter the boundary check too (see ./mating.ts). Default false.
	 */
	sharedDatumFrame?: boolean;
	/** In the hole's unit. */
	requiredMinClearance?: string;
	requiredMaxClearance?: string;
	temperature?: TemperatureInput;
}

export interface FitError {
	ok: false;
	member: 'hole' | 'shaft' | 'fastener' | 'fixedHole' | 'fit';
	message: string;
	position: number | null;
	field: FeatureError['field'] | 'requiredMinClearance' | 'requiredMaxClearance' | 'temperature';
}

export interface FitTemperature {
	operating: string;
	minClearance: Length;
	maxClearance: Length;
	classification: FitClassification;
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
	/** The shaft's limits as the fit reads them: in the hole's unit, converted inward when drawn in the other. */
	shaftLimits: { upper: Length | null; lower: Length | null; converted: boolean };
	basicSize: Length | null;
	minClearance: Length | null;
	maxClearance: Length | null;
	classification: FitClassification | null;
	sharedDatumFrame: boolean;
	holeBoundary: MatingBoundary;
	shaftBoundary: MatingBoundary;
	/** From the boundaries (VC, envelope at MMC), when controls that count apply. */
	minClearanceAtBoundary: Length | null;
	maxClearanceAtBoundary: Length | null;
	boundaryNote: string | null;
	checks: FitCheck[];
	verdict: 'pass' | 'fail' | 'undetermined';
	fastener: FastenerBudget | null;
	temperature: FitTemperature | null;
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
		/** The controls counted in the boundary check, in words ('hole: perpendicularity 0.02 Ⓜ'). */
		countedControls: string[];
		/** Rounded to the callouts' places plus one: expansion is no exact size. */
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

function joinNotes(a: string | undefined, b: string | undefined): string | undefined {
	return a && b ? `${a}\n${b}` : (a ?? b);
}

/** A member's values under its own drawing, with its text when `text` is set. */
function member(
	input: FitMemberInput,
	internal: boolean,
	fit: FitInput,
	text: boolean
): FeatureValues | FeatureError {
	const d = input.drawing;
	return (text ? evaluateFeature : featureValues)({
		callout: input.callout,
		spec: input.spec,
		internal,
		units: input.units ?? d?.units ?? fit.units,
		standard: d ? d.standard : fit.standard,
		generalTolerance: d ? d.generalTolerance : fit.generalTolerance,
		controls: input.controls,
		overrides: input.overrides,
		notes: d ? joinNotes(d.notes, input.notes) : input.notes
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

/**
 * The places a shaft drawn in the other unit is converted to: the hole's, or more where the
 * shaft's last place needs them. Inch to mm is exact one place further (0.0001 in = 0.00254 mm);
 * mm to inch never is, so it goes to the inch grid (6 places), finer than any mm place.
 */
function conversionPlaces(hole: FeatureValues, shaft: FeatureValues): number {
	const needed = hole.units === 'mm' ? shaft.places + 1 : 6;
	return Math.min(Math.max(hole.places, needed), hole.units === 'mm' ? 7 : 6);
}

/** The shaft's limits in the hole's unit: as they are, or converted inward (see above). */
function shaftLimits(
	hole: FeatureValues,
	shaft: FeatureValues
): FitValues['shaftLimits'] | FitError {
	if (shaft.units === hole.units)
		return { upper: shaft.upper, lower: shaft.lower, converted: false };
	const units = hole.units;
	const places = conversionPlaces(hole, shaft);
	if (shaft.upper !== null && shaft.lower !== null) {
		const c = convertLimitsInward(shaft.lower, shaft.upper, units, places);
		if (c.lower > c.upper)
			return {
				ok: false,
				member: 'shaft',
				message: `the shaft's tolerance zone is narrower than one place of ${places}-place ${units}`,
				position: null,
				field: 'callout'
			};
		return { upper: c.upper, lower: c.lower, converted: true };
	}
	return {
		upper: shaft.upper === null ? null : roundToPlaces(shaft.upper, units, places, 'down'),
		lower: shaft.lower === null ? null : roundToPlaces(shaft.lower, units, places, 'up'),
		converted: true
	};
}

interface AtBoundary {
	controlled: boolean;
	min: Length | null;
	max: Length | null;
	note: string | null;
}

/** Clearances between the members' mating boundaries (VC, envelope at MMC). */
function boundaryClearances(hb: MatingBoundary, sb: MatingBoundary): AtBoundary {
	const out: AtBoundary = {
		controlled: hb.counted.length > 0 || sb.counted.length > 0,
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

/** The clearances at the operating temperature, null without one, or what is wrong with it. */
function temperatureResult(
	input: TemperatureInput | undefined,
	hole: FeatureValues,
	shaft: FitValues['shaftLimits']
): FitTemperature | FitError | null {
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

/** Expansion is no exact size: a thermal clearance is shown to the callouts' places plus one. */
function thermalText(value: Length, units: Units, places: number): string {
	return formatLength(value, units, places + 1);
}

/** The fixed fastener's T₂ from its holding hole, when the fit names one. */
function fixedHoleTolerance(input: FitInput): Length | undefined | FitError {
	if (!input.fixedHole) return undefined;
	const e = member(input.fixedHole, true, input, false);
	if (!e.ok) return { ...e, member: 'fixedHole' };
	const position = e.controls.find((c) => c.control.characteristic === 'position');
	return position ? position.value : undefined;
}

function fastenerResult(
	input: FitInput,
	hole: FeatureValues,
	shaft: FeatureValues
): FastenerBudget | FitError | null {
	const intent = input.intent;
	if (intent !== 'floating-fastener' && intent !== 'fixed-fastener') return null;
	const T2 = fixedHoleTolerance(input);
	if (T2 !== undefined && typeof T2 !== 'number') return T2;
	const budget = fastenerBudget(hole, shaft, input.fastener, intent, hole.units, T2);
	if (budget && !('H' in budget))
		return {
			ok: false,
			member: 'fastener',
			message: budget.message,
			position: null,
			field: 'controls'
		};
	return budget;
}

function fitWith(input: FitInput, text: boolean): FitValues | FitError {
	const m = members(input, text);
	if ('ok' in m) return m;
	const { hole, shaft, memberKind } = m;
	const units = hole.units;
	const intent = input.intent ?? null;
	const limits = shaftLimits(hole, shaft);
	if ('ok' in limits) return limits;
	const minClearance =
		hole.lower !== null && limits.upper !== null ? sub(hole.lower, limits.upper) : null;
	const maxClearance =
		hole.upper !== null && limits.lower !== null ? sub(hole.upper, limits.lower) : null;
	const shared = input.sharedDatumFrame === true;
	const holeBoundary = matingBoundary(hole, shared);
	const shaftBoundary =
		memberKind === 'fastener' ? boughtBoundary(shaft) : matingBoundary(shaft, shared);
	const atBoundary = boundaryClearances(holeBoundary, shaftBoundary);

	const hp = hole.places;
	const show = (v: Length) => clearanceText(v, units, hp);
	const reqMin = readLength(input.requiredMinClearance, units);
	if (reqMin === null) return clearanceError('requiredMinClearance', input.requiredMinClearance);
	const reqMax = readLength(input.requiredMaxClearance, units);
	if (reqMax === null) return clearanceError('requiredMaxClearance', input.requiredMaxClearance);
	const atLimits: Clearances = { min: minClearance, max: maxClearance, show, prefix: '' };
	const checks = intentChecks(intent, atLimits);
	checks.push(...requiredChecks(reqMin, reqMax, atLimits));
	const floor = atBoundary.controlled ? boundaryFloor(intent, reqMin) : null;
	if (floor !== null) checks.push(boundaryCheck(atBoundary.min, atBoundary.note, floor, show));

	const fastener = fastenerResult(input, hole, shaft);
	if (fastener && 'member' in fastener) return fastener;
	if (fastener && fastener.ok !== null) checks.push(fastenerCheck(fastener, show));

	const temperature = temperatureResult(input.temperature, hole, limits);
	if (temperature && 'ok' in temperature) return temperature;
	if (temperature) {
		const atT: Clearances = {
			min: temperature.minClearance,
			max: temperature.maxClearance,
			show: (v) => thermalText(v, units, hp),
			prefix: `at ${temperature.operating} °C: `
		};
		checks.push(...intentChecks(intent, atT), ...requiredChecks(reqMin, reqMax, atT));
	}

	return {
		ok: true,
		units,
		places: placesFor([minClearance, maxClearance, atBoundary.min, atBoundary.max], units, hp),
		intent,
		hole,
		shaft,
		memberKind,
		shaftLimits: limits,
		basicSize: hole.nominal ?? shaft.nominal ?? null,
		minClearance,
		maxClearance,
		classification:
			minClearance !== null && maxClearance !== null
				? classifyFit(minClearance, maxClearance)
				: null,
		sharedDatumFrame: shared,
		holeBoundary,
		shaftBoundary,
		minClearanceAtBoundary: atBoundary.min,
		maxClearanceAtBoundary: atBoundary.max,
		boundaryNote: atBoundary.note,
		checks,
		verdict: checks.length === 0 ? 'undetermined' : allPass(checks) ? 'pass' : 'fail',
		fastener,
		temperature
	};
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

const SYMBOL = { mmc: ' Ⓜ', lmc: ' Ⓛ', rfs: '' } as const;

function controlWords(who: string, c: ControlValues): string {
	const zone = c.control.diameterZone ? 'Ø' : '';
	return `${who}: ${c.control.characteristic.replaceAll('-', ' ')} ${zone}${c.control.value.trim()}${SYMBOL[c.control.modifier]}`;
}

function fitText(e: FitEvaluation): FitEvaluation['text'] {
	const { units, hole, shaft, temperature, fastener, shaftLimits: sl } = e;
	const hp = hole.places;
	const sp = shaft.units === units ? shaft.places : hp;
	const show = (v: Length | null) => (v === null ? null : clearanceText(v, units, hp));
	return {
		minClearance: show(e.minClearance),
		maxClearance: show(e.maxClearance),
		minClearanceAtBoundary: show(e.minClearanceAtBoundary),
		maxClearanceAtBoundary: show(e.maxClearanceAtBoundary),
		hole: { upper: hole.text.upper, lower: hole.text.lower },
		shaft: {
			upper: formatValue(sl.upper, units, placesFor([sl.upper], units, sp)),
			lower: formatValue(sl.lower, units, placesFor([sl.lower], units, sp))
		},
		countedControls: [
			...e.holeBoundary.counted.map((c) => controlWords('hole', c)),
			...e.shaftBoundary.counted.map((c) => controlWords(e.memberKind, c))
		],
		temperature: temperature
			? {
					minClearance: thermalText(temperature.minClearance, units, hp),
					maxClearance: thermalText(temperature.maxClearance, units, hp)
				}
			: null,
		fastener: fastener
			? {
					H: show(fastener.H)!,
					F: show(fastener.F)!,
					available: show(fastener.available)!,
					used: show(fastener.used),
					required: show(fastener.required)
				}
			: null
	};
}
