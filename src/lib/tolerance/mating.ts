/*
 * The mating envelope of one member of a pin-in-hole fit: how small a hole's (or how large a
 * shaft's) can be, from its envelope and the boundaries of the controls that act on it.
 *
 * Only some controls enter the boundary of one pin in one hole: form controls that make a
 * boundary (straightness of the derived median line, flatness of the derived median plane).
 * Orientation and location controls (perpendicularity to A, position) bound the feature
 * relative to its datums, not to the mating feature, unless both members are located by the
 * same datum features (`sharedDatumFrame`). Common practice (ASME Y14.5 virtual condition of
 * a form control; the orientation and location controls only relate features in one frame).
 */
import type { Length } from './decimal';
import {
	isSurfaceForm,
	type ControlValues,
	type FeatureValues,
	type GeometricControl
} from './feature';

export interface MatingBoundary {
	/** The tightest the mating envelope can be (smallest hole, largest shaft); null unbounded. */
	mmcSide: Length | null;
	/** The loosest (largest hole, smallest shaft), from the LMC and the controls counted. */
	lmcSide: Length | null;
	/** For words: the MMC-side value, or the MMC itself when nothing bounds the member. */
	at: Length | null;
	/** What `at` is: 'VC', 'boundary', 'MMC (envelope)', 'MMC' or 'largest size'. */
	what: string;
	/** Something bounds the mating envelope on the MMC side. */
	bounded: boolean;
	/** The controls whose boundaries were counted. */
	counted: ControlValues[];
}

/** Straightness of a derived median line or flatness of a derived median plane. */
export function isMedianForm(c: Pick<GeometricControl, 'characteristic' | 'appliesTo'>): boolean {
	return (
		(c.characteristic === 'straightness' || c.characteristic === 'flatness') &&
		c.appliesTo === 'median'
	);
}

/** Whether a control's boundary enters the fit's boundary check. */
export function countsInFit(c: ControlValues, sharedDatumFrame: boolean): boolean {
	if (c.boundaries === null || isSurfaceForm(c.control)) return false;
	return sharedDatumFrame || isMedianForm(c.control);
}

/** The smaller (or larger) of a running bound and a value; the earlier one on a tie. */
function bound(so: Length | null, value: Length, smallest: boolean): Length {
	if (so === null) return value;
	return smallest === so < value ? so : value;
}

/** A bought fastener: its largest size bounds it (a thread at its nominal major diameter). */
export function boughtBoundary(f: FeatureValues): MatingBoundary {
	return {
		mmcSide: f.mmc,
		lmcSide: f.lmc,
		at: f.mmc,
		what: 'largest size',
		bounded: f.mmc !== null,
		counted: []
	};
}

/** A member's mating boundary from its envelope and the controls that count (see above). */
export function matingBoundary(f: FeatureValues, sharedDatumFrame: boolean): MatingBoundary {
	const inner = f.internal;
	let mmcSide: Length | null = null;
	let lmcSide: Length | null = null;
	let at = f.mmc;
	let bounded = f.envelope.applies && f.mmc !== null;
	let what = bounded ? 'MMC (envelope)' : 'MMC';
	const counted: ControlValues[] = [];
	for (let i = 0; i < f.controls.length; i++) {
		const c = f.controls[i];
		if (!countsInFit(c, sharedDatumFrame)) continue;
		counted.push(c);
		const { innerBoundary, outerBoundary } = c.boundaries!;
		const edge = inner ? innerBoundary : outerBoundary;
		mmcSide = bound(mmcSide, edge, inner);
		lmcSide = bound(lmcSide, inner ? outerBoundary : innerBoundary, !inner);
		if (at !== null && (!bounded || (inner ? edge < at : edge > at))) {
			at = edge;
			what = c.control.modifier === 'mmc' ? 'VC' : 'boundary';
			bounded = true;
		}
	}
	if (f.envelope.applies && f.mmc !== null) mmcSide = bound(mmcSide, f.mmc, inner);
	if (f.lmc !== null) lmcSide = bound(lmcSide, f.lmc, !inner);
	return { mmcSide, lmcSide, at, what, bounded, counted };
}
