/*
 * FIT: fits (PRODUCT.md §5). FIT-01…05 are judged on one fit, from ../fit.ts's evaluation of
 * the pair; FIT-06 on each feature that is a fit member.
 */
import { ZERO, formatLength, parseDecimal, sub, type Length, type Units } from '../decimal';
import type { FeatureValues } from '../feature';
import {
	fitValues,
	type FastenerBudget,
	type FitIntent,
	type FitMemberInput,
	type FitValues,
	type MatingBoundary
} from '../fit';
import {
	LengthFormat,
	characteristicWord,
	memberWord,
	signed,
	value,
	type FeatureContext
} from './context';
import type { Characteristic } from '../feature';
import { fitList, type FeatureEnv } from './feature-env';
import type { Finding } from './emit';
import type { RulebookDrawing, RulebookFeature, RulebookFit } from './types';

const INTENT_WORDS: Record<FitIntent, string> = {
	running: 'a running fit',
	'locational-clearance': 'a locational clearance fit',
	transition: 'a transition fit',
	interference: 'an interference fit',
	'floating-fastener': 'a floating fastener',
	'fixed-fastener': 'a fixed fastener'
};

/**
 * The least clearance the intent asks for. A fixed fastener's own fit is not judged: the fit
 * may name the hole that holds it (press fit, tapped), where no clearance is wanted.
 */
function requiredMinimum(
	fit: RulebookFit,
	units: Units
): { value: Length; strict: boolean; text: string } | null {
	const stated = fit.requiredMinClearance?.trim();
	if (stated) {
		const v = parseDecimal(stated, units);
		if (v !== null) return { value: v.value, strict: false, text: `≥ ${stated} (stated)` };
	}
	if (fit.intent === 'running') return { value: ZERO, strict: true, text: '> 0' };
	if (fit.intent === 'locational-clearance' || fit.intent === 'floating-fastener')
		return { value: ZERO, strict: false, text: '≥ 0' };
	return null;
}

function fails(clearance: Length, req: { value: Length; strict: boolean }): boolean {
	return req.strict ? clearance <= req.value : clearance < req.value;
}

/** Words for a member whose mating envelope nothing bounds on the MMC side. */
function unbounded(b: MatingBoundary, e: FeatureValues): string {
	return b.bounded
		? ''
		: ` (nothing bounds it; taken at its ${e.internal ? 'smallest' : 'largest'} size)`;
}

function memberInput(c: RulebookFeature, drawing: RulebookDrawing): FitMemberInput {
	return {
		callout: c.callout,
		controls: c.controls,
		overrides: c.overrides,
		notes: c.notes,
		drawing: c.drawing ?? drawing
	};
}

export function evaluateFitFor(
	fit: RulebookFit,
	hole: RulebookFeature,
	shaft: RulebookFeature | null,
	fixedHole: RulebookFeature | null,
	drawing: RulebookDrawing
) {
	return fitValues({
		hole: memberInput(hole, drawing),
		shaft: shaft ? memberInput(shaft, drawing) : undefined,
		fixedHole: fixedHole ? memberInput(fixedHole, drawing) : undefined,
		fastener: fit.fastener
			? {
					callout: fit.fastener.callout,
					fixedPosition: fit.fastener.fixedPosition,
					projection: fit.fastener.projection
				}
			: undefined,
		units: drawing.units,
		standard: drawing.standard,
		generalTolerance: drawing.generalTolerance,
		intent: fit.intent,
		sharedDatumFrame: fit.sharedDatumFrame,
		temperature: fit.temperature ?? undefined,
		requiredMinClearance: fit.requiredMinClearance ?? undefined,
		requiredMaxClearance: fit.requiredMaxClearance ?? undefined
	});
}

/** What the fit rules say about a fit's members. */
interface FitWords {
	fit: RulebookFit;
	r: FitValues;
	f: LengthFormat;
	holeWord: string;
	shaftWord: string;
	intent: string;
	req: { value: Length; strict: boolean; text: string } | null;
}

/** FIT-01: the sizes alone. Returns true when it fails. */
function sizeRule(w: FitWords, out: Finding[]): boolean {
	const { r, f, req, holeWord, shaftWord, intent } = w;
	if (!req || r.minClearance === null || r.hole.mmc === null || r.shaft.mmc === null) return false;
	if (!fails(r.minClearance, req)) return false;
	const holeMmc = f.show(r.hole.mmc);
	const shaftMmc = f.show(r.shaft.mmc);
	const clearance = f.show(r.minClearance);
	out.push({
		rule: 'FIT-01',
		cause: 'min-clearance',
		message: `The minimum clearance at MMC is below what ${intent} needs.`,
		values: [
			value(`MMC ${holeWord}`, r.hole.mmc, holeMmc),
			value(`MMC ${shaftWord}`, r.shaft.mmc, shaftMmc),
			value('minimum clearance', r.minClearance, clearance),
			value('required', null, req.text)
		],
		line: `MMC ${holeWord} ${holeMmc} − MMC ${shaftWord} ${shaftMmc} = ${signed(clearance)}, required ${req.text} for ${intent}`,
		fix: `Open the ${holeWord} or reduce the ${shaftWord} so the MMCs leave the allowance ${intent} needs.`
	});
	return true;
}

/** FIT-02: the boundaries, when geometric tolerances make them (fastener budgets are FIT-05's). */
function boundaryRule(w: FitWords, out: Finding[]): void {
	const { fit, r, f, req, holeWord, shaftWord, intent } = w;
	const fastenerIntent = fit.intent === 'floating-fastener' || fit.intent === 'fixed-fastener';
	if (!req || fastenerIntent || r.minClearance === null) return;
	// The boundaries fit.ts worked out, from the controls that count for one pin in one hole.
	const hb = r.holeBoundary;
	const sb = r.shaftBoundary;
	if (hb.counted.length === 0 && sb.counted.length === 0) return;
	if (hb.at === null || sb.at === null) return;
	const c = sub(hb.at, sb.at);
	if (!fails(c, req)) return;
	const holeAt = f.show(hb.at);
	const shaftAt = f.show(sb.at);
	const clearance = f.show(c);
	out.push({
		rule: 'FIT-02',
		cause: 'boundary',
		message: `The fit fails at the boundaries its geometric tolerances make.`,
		values: [
			value(`${hb.what} ${holeWord}`, hb.at, holeAt),
			value(`${sb.what} ${shaftWord}`, sb.at, shaftAt),
			value('clearance at the boundaries', c, clearance),
			value('required', null, req.text)
		],
		line: `${hb.what} ${holeWord} ${holeAt}${unbounded(hb, r.hole)} − ${sb.what} ${shaftWord} ${shaftAt}${unbounded(sb, r.shaft)} = ${signed(clearance)}, required ${req.text} for ${intent}`,
		fix: 'Reduce the geometric tolerance (or make it zero at MMC), or increase the allowance between the sizes.'
	});
}

/** FIT-03 / FIT-04: the loose end. */
function looseEndRules(w: FitWords, out: Finding[]): void {
	const { fit, r, f, holeWord, shaftWord } = w;
	const maxC = r.maxClearance;
	if (maxC === null || r.hole.lmc === null || r.shaft.lmc === null) return;
	const interferenceFails = fit.intent === 'interference' && maxC > 0;
	const statedMax = fit.requiredMaxClearance?.trim();
	const max = statedMax ? parseDecimal(statedMax, r.units) : null;
	const maxFails = max !== null && maxC > max.value && !interferenceFails;
	// Only a finding needs the words; most fits are fine.
	if (!interferenceFails && !maxFails) return;
	const loose = `LMC ${holeWord} ${f.show(r.hole.lmc)} − LMC ${shaftWord} ${f.show(r.shaft.lmc)} = ${signed(f.show(maxC))}`;
	const looseValues = [
		value(`LMC ${holeWord}`, r.hole.lmc, f.show(r.hole.lmc)),
		value(`LMC ${shaftWord}`, r.shaft.lmc, f.show(r.shaft.lmc)),
		value('maximum clearance', maxC, f.show(maxC))
	];
	if (interferenceFails)
		out.push({
			rule: 'FIT-03',
			cause: 'clearance',
			message: `Meant as an interference fit, but the limits allow clearance (${r.classification} fit).`,
			values: [...looseValues, value('classification', null, r.classification ?? '')],
			line: `${loose}, required ≤ 0 for an interference fit: a ${r.classification} fit`,
			fix: 'Choose a shaft position further from zero (r6, s6) or a tighter hole grade.'
		});
	if (maxFails)
		out.push({
			rule: 'FIT-04',
			cause: 'max-clearance',
			message: 'The maximum clearance is above the stated maximum.',
			values: [...looseValues, value('stated maximum', max.value, statedMax!)],
			line: `${loose}, stated maximum ${statedMax}`,
			fix: 'Tighten one of the tolerances, or move the shaft position closer to zero.'
		});
}

/** FIT-05 when the fastener does not pass the hole at MMC at all (H < F). */
function holeTooSmall(b: FastenerBudget, f: LengthFormat, out: Finding[]): void {
	out.push({
		rule: 'FIT-05',
		cause: 'hole-too-small',
		message: 'The clearance hole at MMC is smaller than the fastener: it does not assemble.',
		values: [
			value('H (hole MMC)', b.H, f.show(b.H)),
			value('F (fastener MMC)', b.F, f.show(b.F)),
			value('H − F', b.available, f.show(b.available))
		],
		line: `H ${f.show(b.H)} − F ${f.show(b.F)} = ${signed(f.show(b.available))}: the hole at MMC is smaller than the fastener`,
		fix: 'Enlarge the clearance hole to at least the fastener size plus the position tolerances.'
	});
}

/** FIT-05: the fastener budget. */
function budgetRule(w: FitWords, out: Finding[]): void {
	const b = w.r.fastener;
	const f = w.f;
	if (!b || b.ok !== false) return;
	if (b.holeTooSmall) return holeTooSmall(b, f, out);
	const budget = `H ${f.show(b.H)} − F ${f.show(b.F)} = ${signed(f.show(b.available))}`;
	const share = b.modifier === 'lmc' ? 't + T' : 'position';
	let line: string;
	if (b.required !== null)
		line = `hole needed F + T₁ + T₂(1 + 2P/D) = ${f.show(b.required)} > H ${f.show(b.H)}`;
	else if (b.formula === 'floating')
		line = `${share} ${f.show(b.used!)} > ${budget} (floating fastener: ${b.modifier === 'lmc' ? 't + T' : 'T'} = H − F)`;
	else line = `T₁ + T₂ = ${f.show(b.used!)} > ${budget} (fixed fastener: T₁ + T₂ = H − F)`;
	out.push({
		rule: 'FIT-05',
		cause: b.formula,
		message: 'The position tolerances are larger than the fastener clearance allows.',
		values: [
			value('H (hole MMC)', b.H, f.show(b.H)),
			value('F (fastener MMC)', b.F, f.show(b.F)),
			value('H − F', b.available, f.show(b.available)),
			value('position tolerance', b.used, b.used === null ? '' : f.show(b.used)),
			...(b.required !== null ? [value('hole needed', b.required, f.show(b.required))] : []),
			value('boundary', null, b.boundary)
		],
		line,
		fix: 'Reduce the position tolerance, or enlarge the clearance hole.'
	});
}

/** FIT-01 / FIT-03 at the operating temperature: the fit holds at 20 °C and fails there. */
function temperatureRules(w: FitWords, sizeFails: boolean, out: Finding[]): void {
	const { fit, r, req, intent } = w;
	const t = r.temperature;
	const input = fit.temperature;
	if (!t || !input) return;
	// Expansion is no exact size: shown to the callouts' places plus one.
	const f = { show: (v: Length) => formatLength(v, r.units, r.hole.places + 1) };
	const at = `at ${t.operating} °C (hole α ${input.holeCoefficient}, ${w.shaftWord} α ${input.shaftCoefficient} × 10⁻⁶/K, from 20 °C)`;
	if (req && !sizeFails && fails(t.minClearance, req))
		out.push({
			rule: 'FIT-01',
			cause: 'min-clearance-at-temperature',
			message: `At ${t.operating} °C the minimum clearance is below what ${intent} needs.`,
			values: [
				value('operating temperature', null, `${t.operating} °C`),
				value('minimum clearance', t.minClearance, f.show(t.minClearance)),
				value('required', null, req.text)
			],
			line: `minimum clearance ${signed(f.show(t.minClearance))} ${at}, required ${req.text} for ${intent}`,
			fix: 'Open the allowance, or choose materials whose expansion keeps the clearance.'
		});
	const loose = r.maxClearance !== null && r.maxClearance > 0;
	if (fit.intent === 'interference' && !loose && t.maxClearance > 0)
		out.push({
			rule: 'FIT-03',
			cause: 'clearance-at-temperature',
			message: `Interference at 20 °C, but at ${t.operating} °C the limits allow clearance (${t.classification} fit).`,
			values: [
				value('operating temperature', null, `${t.operating} °C`),
				value('maximum clearance', t.maxClearance, f.show(t.maxClearance)),
				value('classification', null, t.classification)
			],
			line: `maximum clearance ${signed(f.show(t.maxClearance))} ${at}, required ≤ 0 for an interference fit: a ${t.classification} fit`,
			fix: 'Increase the interference, or choose materials that expand alike.'
		});
}

/** FIT-01…05 on one fit. */
export function fitRules(
	fit: RulebookFit,
	r: FitValues,
	hole: RulebookFeature,
	shaft: RulebookFeature | null,
	out: Finding[]
): void {
	const w: FitWords = {
		fit,
		r,
		f: new LengthFormat(r.units, r.places),
		holeWord: memberWord(hole),
		shaftWord: shaft ? memberWord(shaft) : fit.fastener?.label || 'fastener',
		intent: INTENT_WORDS[fit.intent],
		req: requiredMinimum(fit, r.units)
	};
	const sizeFails = sizeRule(w, out);
	if (!sizeFails) boundaryRule(w, out);
	looseEndRules(w, out);
	budgetRule(w, out);
	temperatureRules(w, sizeFails, out);
}

const LOCATING: readonly Characteristic[] = [
	'perpendicularity',
	'angularity',
	'parallelism',
	'position',
	'concentricity',
	'symmetry',
	'circular-runout',
	'total-runout',
	'profile-of-a-line',
	'profile-of-a-surface'
];

/** FIT-06: nothing relates a fit member to the rest of its part. */
export function memberLocationRule(ctx: FeatureContext, env: FeatureEnv, out: Finding[]): void {
	if (env.memberships.length === 0) return;
	const { feature } = ctx;
	// A part bought to a standard is located by the standard and its own fit, not by this drawing.
	if (feature.boughtOut) return;
	// An ISO 2768-2 class (H, K, L) gives general straightness, perpendicularity, symmetry and
	// run-out but no position tolerance: it locates nothing, so it does not exempt a member.
	let located = false;
	for (const c of feature.controls ?? []) if (LOCATING.includes(c.characteristic)) located = true;
	if (located || feature.datumFeature) return;
	out.push({
		rule: 'FIT-06',
		cause: 'unlocated',
		message: 'A fit member with no orientation or location control.',
		values: [
			value(
				'controls',
				null,
				(feature.controls ?? []).map((c) => characteristicWord(c.characteristic)).join(', ') ||
					'none'
			),
			value('fits', null, fitList(env))
		],
		line: `${feature.callout}: no position, orientation or run-out control; member of ${fitList(env)}`,
		fix: 'Add a position or orientation tolerance to the appropriate datums.'
	});
}
