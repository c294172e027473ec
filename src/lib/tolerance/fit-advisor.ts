/*
 * Fit advisor: hole and shaft classes for a basic size and the kind of fit wanted. Metric sizes
 * get the ISO 286 preferred fits (ISO 286-1:2010 figure 16 / annex, the same list as ASME B4.2
 * table 1), hole basis or shaft basis; inch sizes get the ANSI B4.1 classes.
 */
import { parseDecimal, formatLength, type Length, type Units } from './decimal';
import { ansiFit, ANSI_FIT_CLASSES, type AnsiFitClass } from './ansi-fits';
import { exactPlaces } from './feature';
import type { FitIntent } from './fit';
import { classifyFit, isoFit, type FitClassification } from './iso286';

export type FitWanted = Exclude<FitIntent, 'floating-fastener' | 'fixed-fastener'>;

export interface PreferredFit {
	hole: string;
	shaft: string;
	basis: 'hole' | 'shaft';
	wanted: FitWanted;
	/** A plain description in the trade's words. */
	description: string;
}

const HOLE_BASIS: [string, string, FitWanted, string][] = [
	['H11', 'c11', 'running', 'loose running'],
	['H9', 'd9', 'running', 'free running'],
	['H8', 'f7', 'running', 'close running'],
	['H7', 'g6', 'locational-clearance', 'sliding'],
	['H7', 'h6', 'locational-clearance', 'locational clearance'],
	['H7', 'k6', 'transition', 'locational transition'],
	['H7', 'n6', 'transition', 'locational transition'],
	['H7', 'p6', 'interference', 'locational interference'],
	['H7', 's6', 'interference', 'medium drive'],
	['H7', 'u6', 'interference', 'force']
];

const SHAFT_BASIS: [string, string, FitWanted, string][] = [
	['C11', 'h11', 'running', 'loose running'],
	['D9', 'h9', 'running', 'free running'],
	['F8', 'h7', 'running', 'close running'],
	['G7', 'h6', 'locational-clearance', 'sliding'],
	['H7', 'h6', 'locational-clearance', 'locational clearance'],
	['K7', 'h6', 'transition', 'locational transition'],
	['N7', 'h6', 'transition', 'locational transition'],
	['P7', 'h6', 'interference', 'locational interference'],
	['S7', 'h6', 'interference', 'medium drive'],
	['U7', 'h6', 'interference', 'force']
];

export const PREFERRED_FITS: readonly PreferredFit[] = [
	...HOLE_BASIS.map(([hole, shaft, wanted, description]) => ({
		hole,
		shaft,
		basis: 'hole' as const,
		wanted,
		description
	})),
	...SHAFT_BASIS.map(([hole, shaft, wanted, description]) => ({
		hole,
		shaft,
		basis: 'shaft' as const,
		wanted,
		description
	}))
];

const ANSI_WANTED: Record<string, FitWanted> = {
	RC: 'running',
	LC: 'locational-clearance',
	LT: 'transition',
	LN: 'interference',
	FN: 'interference'
};

const ANSI_NAMES: Record<string, string> = {
	RC: 'running and sliding',
	LC: 'locational clearance',
	LT: 'locational transition',
	LN: 'locational interference',
	FN: 'force or shrink'
};

export interface FitProposal {
	designation: string;
	standard: 'ISO 286' | 'ANSI B4.1';
	basis: 'hole' | 'shaft';
	description: string;
	classification: FitClassification;
	hole: { code: string | null; upper: string; lower: string; callout: string };
	shaft: { code: string | null; upper: string; lower: string; callout: string };
	minClearance: string;
	maxClearance: string;
}

export interface AdviseInput {
	basicSize: string | Length;
	units: Units;
	wanted?: FitWanted;
	basis?: 'hole' | 'shaft';
}

export type AdviseResult =
	| { ok: true; basicSize: string; units: Units; proposals: FitProposal[]; notCovered: string[] }
	| { ok: false; message: string };

function sizeOf(input: AdviseInput): { value: Length; text: string } | null {
	if (typeof input.basicSize === 'number') {
		const places = exactPlaces(input.basicSize, input.units);
		return { value: input.basicSize, text: formatLength(input.basicSize, input.units, places) };
	}
	const text = input.basicSize.trim().replace(/^[Ø⌀]\s*/, '');
	const v = parseDecimal(text, input.units);
	return v === null || v.value <= 0 ? null : { value: v.value, text };
}

/**
 * Limits as an inch drawing writes a fit member (ASME Y14.5): low first with a dash, no
 * leading zero, both with the same places ('Ø.25000-.25025').
 */
function limitsCallout(upper: Length, lower: Length): string {
	const places = Math.max(4, exactPlaces(upper, 'in'), exactPlaces(lower, 'in'));
	const w = (v: Length) => formatLength(v, 'in', places, { leadingZero: false });
	return `Ø${w(lower)}-${w(upper)}`;
}

/**
 * What a preferred fit is at this size: a fit preferred as interference or transition is listed
 * under what its limits make it (H7/p6 up to 3 mm is a transition fit, ISO 286-2).
 */
function listedAs(wanted: FitWanted, classification: FitClassification): FitWanted {
	if (wanted !== 'interference' && wanted !== 'transition') return wanted;
	return classification === 'clearance' ? 'locational-clearance' : classification;
}

export function adviseFit(input: AdviseInput): AdviseResult {
	const size = sizeOf(input);
	if (size === null) return { ok: false, message: 'the basic size must be a size above zero' };
	const proposals: FitProposal[] = [];
	const notCovered: string[] = [];
	if (input.units === 'mm') {
		for (const p of PREFERRED_FITS) {
			if (input.basis && p.basis !== input.basis) continue;
			const fit = isoFit(size.value, `${p.hole}/${p.shaft}`);
			if (!fit.ok) {
				if (!input.wanted || p.wanted === input.wanted)
					notCovered.push(`${p.hole}/${p.shaft}: ${fit.reason}`);
				continue;
			}
			if (input.wanted && listedAs(p.wanted, fit.classification) !== input.wanted) continue;
			const f = (v: Length) => formatLength(v, 'mm', Math.max(3, exactPlaces(v, 'mm')));
			proposals.push({
				designation: `${p.hole}/${p.shaft}`,
				standard: 'ISO 286',
				basis: p.basis,
				description: p.description,
				classification: fit.classification,
				hole: {
					code: p.hole,
					upper: f(fit.hole.upper),
					lower: f(fit.hole.lower),
					callout: `Ø${size.text} ${p.hole}`
				},
				shaft: {
					code: p.shaft,
					upper: f(fit.shaft.upper),
					lower: f(fit.shaft.lower),
					callout: `Ø${size.text} ${p.shaft}`
				},
				minClearance: f(fit.minClearance),
				maxClearance: f(fit.maxClearance)
			});
		}
	} else {
		for (const cls of ANSI_FIT_CLASSES) {
			const group = cls.slice(0, 2);
			if (input.wanted && ANSI_WANTED[group] !== input.wanted) continue;
			if (input.basis === 'shaft') continue;
			const fit = ansiFit(cls as AnsiFitClass, size.value);
			if (!fit.ok) {
				notCovered.push(`${cls}: ${fit.reason}`);
				continue;
			}
			const f = (v: Length) => formatLength(v, 'in', Math.max(4, exactPlaces(v, 'in')));
			const hu = f(fit.hole.upper);
			const hl = f(fit.hole.lower);
			const su = f(fit.shaft.upper);
			const sl = f(fit.shaft.lower);
			const holeCallout = limitsCallout(fit.hole.upper, fit.hole.lower);
			const shaftCallout = limitsCallout(fit.shaft.upper, fit.shaft.lower);
			proposals.push({
				designation: cls,
				standard: 'ANSI B4.1',
				basis: 'hole',
				description: ANSI_NAMES[group],
				classification: classifyFit(fit.minClearance, fit.maxClearance),
				hole: { code: fit.hole.designation, upper: hu, lower: hl, callout: holeCallout },
				shaft: {
					code: fit.shaft.designation,
					upper: su,
					lower: sl,
					callout: shaftCallout
				},
				minClearance: f(fit.minClearance),
				maxClearance: f(fit.maxClearance)
			});
		}
	}
	return { ok: true, basicSize: size.text, units: input.units, proposals, notCovered };
}
