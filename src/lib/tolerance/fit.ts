/*
 * A hole with a shaft or a bought fastener: clearances from the limits and from the boundaries,
 * classification, the verdict against the intent, fastener budgets and an optional operating
 * temperature (PRODUCT.md §4). Exact Lengths; strings in the hole's unit.
 */
import type { CalloutSpec } from './callout-types';
import { mulDiv, parseDecimal, type Length, type Units } from './decimal';
import {
	evaluateFeature,
	exactPlaces,
	formatValue,
	isSurfaceForm,
	placesFor,
	type FeatureError,
	type FeatureEvaluation,
	type FeatureOverrides,
	type GeneralTolerance,
	type GeometricControl,
	type GoverningStandard
} from './feature';
import { classifyFit, type FitClassification } from './iso286';

export type FitIntent =
	| 'running'
	| 'locational-clearance'
	| 'transition'
	| 'interference'
	| 'floating-fastener'
	| 'fixed-fastener';

export const FIT_INTENTS: readonly FitIntent[] = [
	'running',
	'locational-clearance',
	'transition',
	'interference',
	'floating-fastener',
	'fixed-fastener'
];

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

export interface FitEvaluation {
	ok: true;
	units: Units;
	places: number;
	intent: FitIntent | null;
	hole: FeatureEvaluation;
	shaft: FeatureEvaluation;
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

function member(
	input: FitMemberInput,
	internal: boolean,
	fit: FitInput
): FeatureEvaluation | FeatureError {
	return evaluateFeature({
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
function fastenerMember(f: FastenerInput, fit: FitInput): FeatureEvaluation | FeatureError {
	const e = evaluateFeature({
		callout: f.callout,
		internal: false,
		units: f.units ?? fit.units,
		standard: fit.standard
	});
	if (!e.ok || e.spec.kind !== 'thread' || !e.spec.thread) return e;
	const major = e.spec.thread.diameter.value;
	return {
		...e,
		upper: major,
		lower: major,
		tolerance: 0,
		mmc: major,
		lmc: major,
		limitsSource: 'callout',
		limitsNote: 'thread: counted at its nominal major diameter',
		text: {
			...e.text,
			upper: formatValue(major, e.units, e.places),
			lower: formatValue(major, e.units, e.places),
			mmc: formatValue(major, e.units, e.places),
			lmc: formatValue(major, e.units, e.places),
			tolerance: formatValue(0, e.units, e.places)
		}
	};
}

/** The smallest a hole's mating envelope can be, and the largest a shaft's, from its boundaries. */
function matingBoundary(f: FeatureEvaluation): {
	mmcSide: Length | null;
	lmcSide: Length | null;
	controlled: boolean;
} {
	const mmcSide: Length[] = [];
	const lmcSide: Length[] = [];
	let controlled = false;
	for (const c of f.controls) {
		if (!c.boundaries || isSurfaceForm(c.control)) continue;
		controlled = true;
		mmcSide.push(f.internal ? c.boundaries.innerBoundary : c.boundaries.outerBoundary);
		lmcSide.push(f.internal ? c.boundaries.outerBoundary : c.boundaries.innerBoundary);
	}
	if (f.envelope.applies && f.mmc !== null) mmcSide.push(f.mmc);
	if (f.lmc !== null) lmcSide.push(f.lmc);
	const pick = (values: Length[], smallest: boolean) =>
		values.length === 0 ? null : values.reduce((a, b) => (smallest === a < b ? a : b));
	return {
		mmcSide: pick(mmcSide, f.internal),
		lmcSide: pick(lmcSide, !f.internal),
		controlled
	};
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

function defaultChecks(
	intent: FitIntent | null,
	minC: Length | null,
	maxC: Length | null,
	fmt: (v: Length) => string
): FitCheck[] {
	const checks: FitCheck[] = [];
	if (intent === 'running') {
		checks.push({
			what: 'running fit: minimum clearance above zero',
			ok: minC !== null && minC > 0,
			text: minC === null ? 'minimum clearance unknown' : `minimum clearance ${fmt(minC)}`
		});
	} else if (
		intent === 'locational-clearance' ||
		intent === 'floating-fastener' ||
		intent === 'fixed-fastener'
	) {
		checks.push({
			what: 'clearance fit: minimum clearance not below zero',
			ok: minC !== null && minC >= 0,
			text: minC === null ? 'minimum clearance unknown' : `minimum clearance ${fmt(minC)}`
		});
	} else if (intent === 'interference') {
		checks.push({
			what: 'interference fit: maximum clearance not above zero',
			ok: maxC !== null && maxC <= 0,
			text: maxC === null ? 'maximum clearance unknown' : `maximum clearance ${fmt(maxC)}`
		});
	}
	return checks;
}

function fastenerBudget(
	hole: FeatureEvaluation,
	fastener: FeatureEvaluation,
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

/** Clearances, classification and verdict of one fit. Never throws. */
export function evaluateFit(input: FitInput): FitResult {
	const hole = member(input.hole, true, input);
	if (!hole.ok) return { ...hole, member: 'hole' };
	let shaft: FeatureEvaluation | FeatureError;
	let memberKind: 'shaft' | 'fastener';
	if (input.shaft) {
		shaft = member(input.shaft, false, input);
		memberKind = 'shaft';
		if (!shaft.ok) return { ...shaft, member: 'shaft' };
	} else if (input.fastener) {
		shaft = fastenerMember(input.fastener, input);
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
	const fmt = (v: Length) =>
		formatValue(v, units, Math.max(hole.places, exactPlaces(v, units))) as string;
	const checks = defaultChecks(intent, minClearance, maxClearance, fmt);
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
			what: `minimum clearance at least ${fmt(reqMin)}`,
			ok: minClearance !== null && minClearance >= reqMin,
			text:
				minClearance === null
					? 'minimum clearance unknown'
					: `minimum clearance ${fmt(minClearance)}`
		});
	}
	if (reqMax !== undefined) {
		checks.push({
			what: `maximum clearance at most ${fmt(reqMax)}`,
			ok: maxClearance !== null && maxClearance <= reqMax,
			text:
				maxClearance === null
					? 'maximum clearance unknown (a limit is open)'
					: `maximum clearance ${fmt(maxClearance)}`
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
						: `minimum clearance at the boundaries ${fmt(minClearanceAtBoundary)}`
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
				text: `H − F = ${fmt(fastener.available)}${fastener.used !== null ? `, position tolerance ${fmt(fastener.used)}` : ''}${fastener.required !== null ? `, hole needed ${fmt(fastener.required)}` : ''}`
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

	const verdict =
		checks.length === 0 ? 'undetermined' : checks.every((c) => c.ok) ? 'pass' : 'fail';
	const sf = (v: Length | null) =>
		formatValue(
			v,
			units,
			placesFor([v], units, shaft.units === units ? shaft.places : hole.places)
		);
	const cf = (v: Length | null) => (v === null ? null : fmt(v));
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
		temperature,
		text: {
			minClearance: cf(minClearance),
			maxClearance: cf(maxClearance),
			minClearanceAtBoundary: cf(minClearanceAtBoundary),
			maxClearanceAtBoundary: cf(maxClearanceAtBoundary),
			hole: { upper: hole.text.upper, lower: hole.text.lower },
			shaft: { upper: sf(shaft.upper), lower: sf(shaft.lower) },
			temperature: temperature
				? {
						minClearance: fmt(temperature.minClearance),
						maxClearance: fmt(temperature.maxClearance)
					}
				: null,
			fastener: fastener
				? {
						H: fmt(fastener.H),
						F: fmt(fastener.F),
						available: fmt(fastener.available),
						used: cf(fastener.used),
						required: cf(fastener.required)
					}
				: null
		}
	};
}
