/*
 * A hole with a shaft or a bought fastener: clearances from the limits and from the boundaries,
 * classification, the verdict against the intent, fastener budgets and an optional operating
 * temperature (PRODUCT.md §4). Exact Lengths; strings in the hole's unit.
 */
import type { CalloutSpec } from './callout-types';
import { formatLength, mulDiv, parseDecimal, type Length, type Units } from './decimal';
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

export interface FastenerInput {
	callout: string;
	units?: Units;
	/** Position tolerance of the part that fixes the fastener (T₂: tapped or press-fit hole). */
	fixedPosition?: string;
	/**
	 * When the fixed part's position tolerance is not projected: P, the greatest projection of
	 * the fastener (or thickness of the part with the clearance hole), and D, the least depth of
	 * thread or thickness of the part that fixes the fastener.
	 */
	projection?: { P: string; D: string };
}

export interface TemperatureInput {
	/** Operating temperature in °C; the standard reference temperature is 20 °C (ISO 1). */
	operating: string;
	/** Linear expansion coefficients in 10⁻⁶/K (µm per m and kelvin). */
	holeCoefficient: string;
	shaftCoefficient: string;
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

export interface FastenerBudget {
	formula: 'floating' | 'fixed' | 'fixed-unprojected';
	/** H: the clearance hole at MMC. F: the fastener at MMC. */
	H: Length;
	F: Length;
	/** H − F: the position tolerance the pair may share. */
	available: Length;
	/** T (floating), T₁ + T₂ (fixed), or the hole size the out-of-squareness formula requires. */
	used: Length | null;
	required: Length | null;
	ok: boolean | null;
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
	e.tolerance = 0;
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
		t.tolerance = formatValue(0, e.units, e.places);
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

function readLength(text: string | undefined, units: Units): Length | null | undefined {
	if (text === undefined || text.trim() === '') return undefined;
	const v = parseDecimal(text.trim(), units);
	return v === null ? null : v.value;
}

const SCALE = 10n ** 20n;

/** value × (1 + α·Δθ·10⁻⁶), one rounding to the grid (half away from zero). */
function expand(value: Length, alpha: bigint, deltaT: bigint): Length {
	// alpha and deltaT are decimals × 10⁷ each (read on the mm grid), so α·Δθ carries 10¹⁴.
	const numerator = BigInt(value) * (SCALE + alpha * deltaT);
	const q = numerator / SCALE;
	const r = numerator - q * SCALE;
	const twice = 2n * (r < 0n ? -r : r);
	if (twice >= SCALE) return Number(r > 0n ? q + 1n : q - 1n);
	return Number(q);
}

function readScaled(text: string): bigint | null {
	const v = parseDecimal(text.trim(), 'mm');
	return v === null ? null : BigInt(v.value);
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

function fastenerBudget(
	hole: FeatureValues,
	fastener: FeatureValues,
	input: FastenerInput | undefined,
	intent: FitIntent,
	units: Units
): FastenerBudget | FitError | null {
	if (hole.mmc === null || fastener.mmc === null) return null;
	const H = hole.mmc;
	const F = fastener.mmc;
	const available = H - F;
	const position = hole.controls.find((c) => c.control.characteristic === 'position');
	const T1 = position ? position.value : null;
	if (intent === 'floating-fastener') {
		return {
			formula: 'floating',
			H,
			F,
			available,
			used: T1,
			required: null,
			ok: T1 === null ? null : T1 <= available,
			text: 'floating fastener: T = H − F for each part (ASME Y14.5 Appendix B)'
		};
	}
	const T2 = readLength(input?.fixedPosition, units);
	if (T2 === null)
		return {
			ok: false,
			member: 'fastener',
			message: `'${input?.fixedPosition}' is not a position tolerance`,
			position: null,
			field: 'controls'
		};
	const used = T1 !== null && T2 !== undefined ? T1 + T2 : null;
	if (input?.projection) {
		const P = readLength(input.projection.P, units);
		const D = readLength(input.projection.D, units);
		if (!P || !D || P < 0 || D <= 0)
			return {
				ok: false,
				member: 'fastener',
				message: 'the projection P and depth D must be sizes above zero',
				position: null,
				field: 'controls'
			};
		if (T1 === null || T2 === undefined)
			return {
				formula: 'fixed-unprojected',
				H,
				F,
				available,
				used,
				required: null,
				ok: null,
				text: 'fixed fastener without a projected zone: needs both position tolerances'
			};
		// H = F + T₁ + T₂(1 + 2P/D), rounded up: the hole must be at least this large.
		const required = F + T1 + mulDiv(T2, D + 2 * P, D, 'up');
		return {
			formula: 'fixed-unprojected',
			H,
			F,
			available,
			used,
			required,
			ok: H >= required,
			text: 'fixed fastener, tolerance not projected: H = F + T₁ + T₂(1 + 2P/D) (ASME Y14.5 Appendix B)'
		};
	}
	return {
		formula: 'fixed',
		H,
		F,
		available,
		used,
		required: null,
		ok: used === null ? null : used <= available,
		text: "fixed fastener: T₁ + T₂ = H − F, with the fixed part's tolerance projected (ASME Y14.5 Appendix B)"
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

function fitWith(input: FitInput, text: boolean): FitValues | FitError {
	const hole = member(input.hole, true, input, text);
	if (!hole.ok) return { ...hole, member: 'hole' };
	let shaft: FeatureValues | FeatureError;
	let memberKind: 'shaft' | 'fastener';
	if (input.shaft) {
		shaft = member(input.shaft, false, input, text);
		memberKind = 'shaft';
		if (!shaft.ok) return { ...shaft, member: 'shaft' };
	} else if (input.fastener) {
		shaft = fastenerMember(input.fastener, input, text);
		memberKind = 'fastener';
		if (!shaft.ok) return { ...shaft, member: 'fastener' };
	} else {
		return {
			ok: false,
			member: 'fit',
			message: 'a fit needs a shaft or a fastener',
			position: null,
			field: 'callout'
		};
	}
	const units = hole.units;
	const intent = input.intent ?? null;
	const minClearance =
		hole.lower !== null && shaft.upper !== null ? hole.lower - shaft.upper : null;
	const maxClearance =
		hole.upper !== null && shaft.lower !== null ? hole.upper - shaft.lower : null;
	const classification =
		minClearance !== null && maxClearance !== null ? classifyFit(minClearance, maxClearance) : null;

	const hb = matingBoundary(hole);
	const sb = matingBoundary(shaft);
	let minClearanceAtBoundary: Length | null = null;
	let maxClearanceAtBoundary: Length | null = null;
	let boundaryNote: string | null = null;
	if (hb.controlled || sb.controlled) {
		if (hb.mmcSide !== null && sb.mmcSide !== null)
			minClearanceAtBoundary = hb.mmcSide - sb.mmcSide;
		else
			boundaryNote = `nothing bounds the ${hb.mmcSide === null ? 'hole' : 'shaft'}'s mating envelope at MMC (no envelope and no MMC control)`;
		if (hb.lmcSide !== null && sb.lmcSide !== null)
			maxClearanceAtBoundary = hb.lmcSide - sb.lmcSide;
	}

	const fmtPlaces = placesFor(
		[minClearance, maxClearance, minClearanceAtBoundary, maxClearanceAtBoundary],
		units,
		hole.places
	);
	const hp = hole.places;
	const checks = defaultChecks(intent, minClearance, maxClearance, units, hp);
	const reqMin = readLength(input.requiredMinClearance, units);
	if (reqMin === null)
		return {
			ok: false,
			member: 'fit',
			message: `'${input.requiredMinClearance}' is not a clearance`,
			position: null,
			field: 'requiredMinClearance'
		};
	const reqMax = readLength(input.requiredMaxClearance, units);
	if (reqMax === null)
		return {
			ok: false,
			member: 'fit',
			message: `'${input.requiredMaxClearance}' is not a clearance`,
			position: null,
			field: 'requiredMaxClearance'
		};
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
	if (hb.controlled || sb.controlled) {
		const floor =
			reqMin ??
			(intent === 'running'
				? 1
				: intent === 'locational-clearance' ||
					  intent === 'floating-fastener' ||
					  intent === 'fixed-fastener'
					? 0
					: null);
		if (floor !== null) {
			checks.push({
				what: 'assembles at the boundaries (virtual condition, envelope)',
				ok: minClearanceAtBoundary !== null && minClearanceAtBoundary >= floor,
				text:
					minClearanceAtBoundary === null
						? (boundaryNote ?? 'boundary unknown')
						: `minimum clearance at the boundaries ${clearanceText(minClearanceAtBoundary, units, hp)}`
			});
		}
	}

	let fastener: FastenerBudget | null = null;
	if (intent === 'floating-fastener' || intent === 'fixed-fastener') {
		const budget = fastenerBudget(hole, shaft, input.fastener, intent, units);
		if (budget && 'member' in budget) return budget;
		fastener = budget;
		if (fastener && fastener.ok !== null) {
			checks.push({
				what: fastener.text,
				ok: fastener.ok,
				text: `H − F = ${clearanceText(fastener.available, units, hp)}${fastener.used !== null ? `, position tolerance ${clearanceText(fastener.used, units, hp)}` : ''}${fastener.required !== null ? `, hole needed ${clearanceText(fastener.required, units, hp)}` : ''}`
			});
		}
	}

	let temperature: FitEvaluation['temperature'] = null;
	if (input.temperature) {
		const operating = readScaled(input.temperature.operating);
		const ah = readScaled(input.temperature.holeCoefficient);
		const as = readScaled(input.temperature.shaftCoefficient);
		if (operating === null || ah === null || as === null)
			return {
				ok: false,
				member: 'fit',
				message: 'the temperature and both expansion coefficients must be decimal numbers',
				position: null,
				field: 'temperature'
			};
		if (
			hole.lower !== null &&
			hole.upper !== null &&
			shaft.lower !== null &&
			shaft.upper !== null
		) {
			const dT = operating - 20n * 10_000_000n;
			const minT = expand(hole.lower, ah, dT) - expand(shaft.upper, as, dT);
			const maxT = expand(hole.upper, ah, dT) - expand(shaft.lower, as, dT);
			temperature = {
				operating: input.temperature.operating.trim(),
				minClearance: minT,
				maxClearance: maxT,
				classification: classifyFit(minT, maxT)
			};
		}
	}

	const verdict = checks.length === 0 ? 'undetermined' : allPass(checks) ? 'pass' : 'fail';
	return {
		ok: true,
		units,
		places: fmtPlaces,
		intent,
		hole,
		shaft,
		memberKind,
		basicSize: hole.nominal ?? shaft.nominal ?? null,
		minClearance,
		maxClearance,
		classification,
		minClearanceAtBoundary,
		maxClearanceAtBoundary,
		boundaryNote,
		checks,
		verdict,
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
