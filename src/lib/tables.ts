/*
 * The rows of a revision's features and fits tables: only what the columns show and what a
 * selected row needs (pairing, flying the board to it), so 5,000 features stay a small page.
 * Safe in the browser.
 */
import type { FeatureJson, MarkerLocation } from '$lib/features';
import { intentLabels, memberName, otherMemberName, type FitAnswer } from '$lib/fits';

export interface FeatureTableRow {
	id: string;
	balloon: number;
	label: string;
	kind: FeatureJson['kind'];
	internal: boolean;
	callout: string;
	quantity: number;
	upper: string | null;
	lower: string | null;
	mmc: string | null;
	lmc: string | null;
	/** Whether the envelope (Rule #1, Ⓔ) applies; null when nothing was computed. */
	envelope: boolean | null;
	/** Why the values could not be computed. */
	problem: string | null;
	/** null: not yet placed on a sheet. */
	location: MarkerLocation | null;
	/** Open findings (raised or answered) about the feature; the page's load counts them. */
	openFindings: number;
}

export function featureTableRow(f: FeatureJson): FeatureTableRow {
	return {
		id: f.id,
		balloon: f.balloon,
		label: f.label,
		kind: f.kind,
		internal: f.internal,
		callout: f.callout,
		quantity: f.quantity,
		upper: f.upper ?? null,
		lower: f.lower ?? null,
		mmc: f.mmc ?? null,
		lmc: f.lmc ?? null,
		envelope: f.envelope ? f.envelope.applies : null,
		problem: f.problem?.message ?? null,
		location: f.location,
		openFindings: 0
	};
}

export interface FitTableRow {
	id: string;
	hole: string;
	holeCallout: string;
	other: string;
	otherCallout: string;
	intent: string;
	minClearance: string | null;
	maxClearance: string | null;
	classification: string | null;
	verdict: string | null;
	owned: boolean;
}

export function fitTableRow(f: FitAnswer): FitTableRow {
	return {
		id: f.id,
		hole: memberName(f.members.hole),
		holeCallout: f.members.hole.callout,
		other: otherMemberName(f),
		otherCallout: f.members.shaft?.callout ?? f.fastener?.callout ?? '',
		intent: intentLabels[f.intent],
		minClearance: f.minClearance ?? null,
		maxClearance: f.maxClearance ?? null,
		classification: f.classification ?? null,
		verdict: f.problem ? 'not computed' : (f.verdict ?? null),
		owned: f.owned
	};
}

/** The board's marker id of a feature (the `show` view parameter). */
export const featureMarkerId = (id: string) => `feature-${id}`;
