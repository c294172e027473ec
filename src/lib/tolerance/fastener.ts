/*
 * Fastener position budgets (ASME Y14.5 Appendix B formulas; the same arithmetic serves ISO
 * drawings): a floating fastener through clearance holes in both parts, or a fixed fastener held
 * by one part (tapped or press-fit) and passing through the other's clearance hole.
 */
import { add, mulDiv, parseDecimal, sub, type Length, type Units } from './decimal';
import type { FeatureValues } from './feature';

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
	/** H − F: the position tolerance the pair may share. */
	available: Length;
	/** T (floating), T₁ + T₂ (fixed), or the hole size the out-of-squareness formula requires. */
	used: Length | null;
	required: Length | null;
	ok: boolean | null;
	text: string;
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

function floatingBudget(H: Length, F: Length, T: Length | null): FastenerBudget {
	const available = sub(H, F);
	return {
		formula: 'floating',
		H,
		F,
		available,
		used: T,
		required: null,
		ok: T === null ? null : T <= available,
		text: 'floating fastener: T = H − F for each part (ASME Y14.5 Appendix B)'
	};
}

function unprojectedBudget(
	H: Length,
	F: Length,
	T1: Length | null,
	T2: Length | undefined,
	projection: { P: string; D: string },
	units: Units
): FastenerBudget | FastenerInputError {
	const P = readLength(projection.P, units);
	const D = readLength(projection.D, units);
	if (!P || !D || P < 0 || D <= 0)
		return { message: 'the projection P and depth D must be sizes above zero' };
	const available = sub(H, F);
	const used = T1 !== null && T2 !== undefined ? add(T1, T2) : null;
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
	const required = add(add(F, T1), mulDiv(T2, D + 2 * P, D, 'up'));
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

/** The budget of a fastener fit, null when a size is open, or what is wrong with the input. */
export function fastenerBudget(
	hole: FeatureValues,
	fastener: FeatureValues,
	input: FastenerInput | undefined,
	intent: 'floating-fastener' | 'fixed-fastener',
	units: Units
): FastenerBudget | FastenerInputError | null {
	if (hole.mmc === null || fastener.mmc === null) return null;
	const H = hole.mmc;
	const F = fastener.mmc;
	const position = hole.controls.find((c) => c.control.characteristic === 'position');
	const T1 = position ? position.value : null;
	if (intent === 'floating-fastener') return floatingBudget(H, F, T1);
	const T2 = readLength(input?.fixedPosition, units);
	if (T2 === null) return { message: `'${input?.fixedPosition}' is not a position tolerance` };
	if (input?.projection) return unprojectedBudget(H, F, T1, T2, input.projection, units);
	const available = sub(H, F);
	const used = T1 !== null && T2 !== undefined ? add(T1, T2) : null;
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
