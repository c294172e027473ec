/*
 * Fits between features as the API answers them (PRODUCT.md §6), for the pages and other
 * clients. No server or database import: safe in the browser.
 */
import type { z } from 'zod';
import { call, revisionUrl } from '$lib/api-client';
import type { featureMatch } from '$lib/schemas/features';
import type { fitCreate, fitPatch, fitResponse } from '$lib/schemas/fits';
import type { FitIntent } from '$lib/tolerance/fit';

/** One fit with its computed values, the diagram and its members' names. */
export type FitAnswer = z.output<typeof fitResponse>;
/** POST …/revisions/{letter}/fits (on the hole's revision). */
export type NewFit = z.input<typeof fitCreate>;
/** PATCH …/fits/{id}: `version` and only what changes. */
export type FitChanges = z.input<typeof fitPatch>;
/** One feature found by GET /teams/{team}/features?q=. */
export type FeatureMatch = z.output<typeof featureMatch>;
export type FitMember = FitAnswer['members']['hole'];
/** A feature picked as a fit member: a search match or a fit's member. */
export type MemberPick = FitMember & { internal?: boolean };

/** Plain words for each intent, in the order a form offers them. */
export const intentLabels: Record<FitIntent, string> = {
	running: 'Running',
	'locational-clearance': 'Locational clearance',
	transition: 'Transition',
	interference: 'Interference',
	'floating-fastener': 'Floating fastener',
	'fixed-fastener': 'Fixed fastener'
};

/** `KF-1003 A #4 Bore`: where a member sits and what it is called. */
export const memberName = (m: Pick<FitMember, 'drawing' | 'letter' | 'balloon' | 'label'>) =>
	`${m.drawing} ${m.letter} #${m.balloon}${m.label ? ` ${m.label}` : ''}`;

/** The other member of a fit in words: a feature on its drawing, or the bought fastener. */
export function otherMemberName(fit: Pick<FitAnswer, 'members' | 'fastener'>) {
	if (fit.members.shaft) return memberName(fit.members.shaft);
	const f = fit.fastener;
	return f ? `${f.callout}${f.label ? ` ${f.label}` : ''} (bought)` : '—';
}

/** Deletes a fit on its hole's revision, where it is owned (its members stay). */
export function deleteFit(team: string, fit: Pick<FitAnswer, 'id' | 'version' | 'members'>) {
	const hole = fit.members.hole;
	return call<void>(
		`${revisionUrl(team, hole.drawing, hole.letter)}/fits/${fit.id}?version=${fit.version}`,
		{ method: 'DELETE' }
	);
}
