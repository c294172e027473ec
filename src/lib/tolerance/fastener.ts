/*
 * Fastener position budgets (ASME Y14.5 Appendix B formulas; the same arithmetic serves ISO
 * drawings). Floating: a fastener through clearance holes in both parts, T = H − F for each.
 * Fixed: a fastener held by one part (tapped or press-fit hole, tolerance T₂) and passing
 * through the other's clearance hole (T₁): T₁ + T₂ = H − F with the holding part's zone
 * projected, H = F + T₁ + T₂(1 + 2P/D) without. The formulas are those of a position
 * tolerance at MMC, where the hole's inner boundary is its virtual condition MMC − t. At RFS the
 * inner boundary is the same MMC − t (no bonus); at LMC it is MMC − t − T (T the hole's size
 * tolerance), so the clearance hole's share becomes t + T.
 */
import { add, mulDiv, parseDecimal, sub, type Length, type Units } from './decimal';
import type { FeatureValues, MaterialModifier } from './feature';

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

export interface FastenerBudget {
	formula: 'floating' | 'fixed' | 'fixed-unprojected';
	/** H: the clearance hole at MMC. F: the fastener at MMC. */
	H: Length;
	F: Length;
	/** H − F: the position tolerance the pair may share. Below zero the fastener cannot pass. */
	available: Length;
	/** The clearance hole's share (t, or t + T at LMC), plus T₂ for a fixed fastener. */
	used: Length | null;
	/** The hole size the out-of-squareness formula requires (fixed, not projected). */
	required: Length | null;
	ok: boolean | null;
	/** The formula, in words. */
	text: string;
	/** The material condition of the clearance hole's position tolerance; null without one. */
	modifier: MaterialModifier | null;
	/** Which boundary of the clearance hole the check used, in words. */
	boundary: string;
	/** The fastener does not pass the hole at MMC (H < F), whatever the position tolerances. */
	holeTooSmall: boolean;
}

/** What went wrong with a fastener's numbers, for the fit's error. */
export interface FastenerInputError {
	message: string;
}

/** A decimal in `units`: undefined when not given, null when unreadable. */
export function readLength(text: string | undefined, units: Units): Length | null | undefined {
	if (text === undefined || text.trim() === '') return undefined;
	const v = parseDecimal(text.trim(), units);
	return v === null ? null : v.value;
}

/** The clearance hole's share of H − F, and the boundary that gives it. */
function clearanceHoleShare(hole: FeatureValues): {
	share: Length | null;
	modifier: MaterialModifier | null;
	boundary: string;
} {
	const position = hole.controls.find((c) => c.control.characteristic === 'position');
	if (!position)
		return { share: null, modifier: null, boundary: 'no position tolerance on the hole' };
	const t = position.value;
	const modifier = position.control.modifier;
	if (modifier === 'mmc')
		return { share: t, modifier, boundary: 'virtual condition MMC − t (position at MMC)' };
	if (modifier === 'rfs')
		return { share: t, modifier, boundary: 'inner boundary MMC − t (position RFS, no bonus)' };
	if (hole.tolerance === null)
		return { share: null, modifier, boundary: 'position at LMC on a hole without two limits' };
	return {
		share: add(t, hole.tolerance),
		modifier,
		boundary: 'inner boundary MMC − t − T (position at LMC; T the hole’s size tolerance)'
	};
}

interface Common {
	H: Length;
	F: Length;
	available: Length;
	modifier: MaterialModifier | null;
	boundary: string;
	holeTooSmall: boolean;
}

function floatingBudget(c: Common, share: Length | null): FastenerBudget {
	return {
		...c,
		formula: 'floating',
		used: share,
		required: null,
		ok: c.holeTooSmall ? false : share === null ? null : share <= c.available,
		text:
			c.modifier === 'lmc'
				? 'floating fastener: t + T = H − F for each part, position at LMC (ASME Y14.5 Appendix B)'
				: 'floating fastener: T = H − F for each part (ASME Y14.5 Appendix B)'
	};
}

function unprojectedBudget(
	c: Common,
	T1: Length | null,
	T2: Length | undefined,
	projection: { P: string; D: string },
	units: Units
): FastenerBudget | FastenerInputError {
	const P = readLength(projection.P, units);
	const D = readLength(projection.D, units);
	if (!P || !D || P < 0 || D <= 0)
		return { message: 'the projection P and depth D must be sizes above zero' };
	const used = T1 !== null && T2 !== undefined ? add(T1, T2) : null;
	if (T1 === null || T2 === undefined)
		return {
			...c,
			formula: 'fixed-unprojected',
			used,
			required: null,
			ok: c.holeTooSmall ? false : null,
			text: 'fixed fastener without a projected zone: needs both position tolerances'
		};
	// H = F + T₁ + T₂(1 + 2P/D), rounded up: the hole must be at least this large.
	const required = add(add(c.F, T1), mulDiv(T2, D + 2 * P, D, 'up'));
	return {
		...c,
		formula: 'fixed-unprojected',
		used,
		required,
		ok: !c.holeTooSmall && c.H >= required,
		text: 'fixed fastener, tolerance not projected: H = F + T₁ + T₂(1 + 2P/D) (ASME Y14.5 Appendix B)'
	};
}

/**
 * The budget of a fastener fit, null when a size is open, or what is wrong with the input.
 * `fixedPosition` is T₂ as a Length when the holding hole is a feature (its position tolerance).
 */
export function fastenerBudget(
	hole: FeatureValues,
	fastener: FeatureValues,
	input: FastenerInput | undefined,
	intent: 'floating-fastener' | 'fixed-fastener',
	units: Units,
	fixedPosition?: Length
): FastenerBudget | FastenerInputError | null {
	if (hole.mmc === null || fastener.mmc === null) return null;
	const { share, modifier, boundary } = clearanceHoleShare(hole);
	const available = sub(hole.mmc, fastener.mmc);
	const c: Common = {
		H: hole.mmc,
		F: fastener.mmc,
		available,
		modifier,
		boundary,
		holeTooSmall: available < 0
	};
	if (intent === 'floating-fastener') return floatingBudget(c, share);
	const T2 = fixedPosition ?? readLength(input?.fixedPosition, units);
	if (T2 === null) return { message: `'${input?.fixedPosition}' is not a position tolerance` };
	if (input?.projection) return unprojectedBudget(c, share, T2, input.projection, units);
	const used = share !== null && T2 !== undefined ? add(share, T2) : null;
	return {
		...c,
		formula: 'fixed',
		used,
		required: null,
		ok: c.holeTooSmall ? false : used === null ? null : used <= available,
		text: "fixed fastener: T₁ + T₂ = H − F, with the fixed part's tolerance projected (ASME Y14.5 Appendix B)"
	};
}
