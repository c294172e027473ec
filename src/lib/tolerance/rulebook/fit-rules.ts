/*
 * Rules judged on one fit (FIT-01…05), from ../fit.ts's evaluation of the pair.
 */
import { parseDecimal, type Length, type Units } from '../decimal';
import type { FeatureValues } from '../feature';
import { fitValues, type FitIntent, type FitMemberInput, type FitValues } from '../fit';
import { LengthFormat, boundingControls, memberWord, signed, value } from './context';
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
	if (fit.intent === 'running') return { value: 0, strict: true, text: '> 0' };
	if (fit.intent === 'locational-clearance' || fit.intent === 'floating-fastener')
		return { value: 0, strict: false, text: '≥ 0' };
	return null;
}

function fails(clearance: Length, req: { value: Length; strict: boolean }): boolean {
	return req.strict ? clearance <= req.value : clearance < req.value;
}

/** The mating boundary on the MMC side and what it is, for the boundary check. */
function mmcBoundary(e: FeatureValues): { at: Length; what: string; bounded: boolean } | null {
	if (e.mmc === null) return null;
	let at = e.mmc;
	let what = 'MMC';
	let bounded = e.envelope.applies;
	if (bounded) what = 'MMC (envelope)';
	for (const c of boundingControls(e)) {
		const b = c.boundaries!;
		const edge = e.internal ? b.innerBoundary : b.outerBoundary;
		if (!bounded || (e.internal ? edge < at : edge > at)) {
			at = edge;
			what = c.control.modifier === 'mmc' ? 'VC' : 'boundary';
			bounded = true;
		}
	}
	return { at, what, bounded };
}

/** Words for a member whose mating envelope nothing bounds on the MMC side. */
function unbounded(b: { bounded: boolean }, e: FeatureValues): string {
	return b.bounded
		? ''
		: ` (nothing bounds it; taken at its ${e.internal ? 'smallest' : 'largest'} size)`;
}

function memberInput(c: RulebookFeature, drawing: RulebookDrawing): FitMemberInput {
	return {
		callout: c.callout,
		controls: c.controls,
		overrides: c.overrides,
		notes: c.notes ? (drawing.notes ? `${drawing.notes}\n${c.notes}` : c.notes) : drawing.notes
	};
}

export function evaluateFitFor(
	fit: RulebookFit,
	hole: RulebookFeature,
	shaft: RulebookFeature | null,
	drawing: RulebookDrawing
) {
	return fitValues({
		hole: memberInput(hole, drawing),
		shaft: shaft ? memberInput(shaft, drawing) : undefined,
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
		requiredMinClearance: fit.requiredMinClearance ?? undefined,
		requiredMaxClearance: fit.requiredMaxClearance ?? undefined
	});
}

export function fitRules(
	fit: RulebookFit,
	r: FitValues,
	hole: RulebookFeature,
	shaft: RulebookFeature | null,
	out: Finding[]
): void {
	const units = r.units;
	const f = new LengthFormat(units, r.places);
	const holeWord = memberWord(hole);
	const shaftWord = shaft ? memberWord(shaft) : fit.fastener?.label || 'fastener';
	const intent = INTENT_WORDS[fit.intent];
	const req = requiredMinimum(fit, units);

	// FIT-01: the sizes alone.
	let sizeFails = false;
	if (req && r.minClearance !== null && r.hole.mmc !== null && r.shaft.mmc !== null) {
		sizeFails = fails(r.minClearance, req);
		if (sizeFails) {
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
		}
	}

	// FIT-02: the boundaries, when geometric tolerances make them (fastener budgets are FIT-05's).
	const fastenerIntent = fit.intent === 'floating-fastener' || fit.intent === 'fixed-fastener';
	if (req && !sizeFails && !fastenerIntent && r.minClearance !== null) {
		const hb = mmcBoundary(r.hole);
		const sb = mmcBoundary(r.shaft);
		const controlled = boundingControls(r.hole).length > 0 || boundingControls(r.shaft).length > 0;
		if (controlled && hb && sb) {
			const c = hb.at - sb.at;
			if (fails(c, req)) {
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
		}
	}

	// FIT-03 / FIT-04: the loose end.
	const maxC = r.maxClearance;
	if (maxC !== null && r.hole.lmc !== null && r.shaft.lmc !== null) {
		const interferenceFails = fit.intent === 'interference' && maxC > 0;
		const statedMax = fit.requiredMaxClearance?.trim();
		const max = statedMax ? parseDecimal(statedMax, units) : null;
		const maxFails = max !== null && maxC > max.value && !interferenceFails;
		// Only a finding needs the words; most fits are fine.
		if (interferenceFails || maxFails) {
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
	}

	// FIT-05: the fastener budget.
	const b = r.fastener;
	if (b && b.ok === false && (b.formula === 'floating' || b.available >= 0)) {
		const budget = `H ${f.show(b.H)} − F ${f.show(b.F)} = ${signed(f.show(b.available))}`;
		let line: string;
		if (b.required !== null)
			line = `hole needed F + T₁ + T₂(1 + 2P/D) = ${f.show(b.required)} > H ${f.show(b.H)}`;
		else if (b.formula === 'floating')
			line = `position ${f.show(b.used!)} > ${budget} (floating fastener: T = H − F)`;
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
				...(b.required !== null ? [value('hole needed', b.required, f.show(b.required))] : [])
			],
			line,
			fix: 'Reduce the position tolerance, or enlarge the clearance hole.'
		});
	}
}
