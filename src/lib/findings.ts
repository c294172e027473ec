/*
 * Findings (PRODUCT.md §3): their kinds, severities and the state machine, as the API names
 * them. No server or database import: safe in the browser.
 */
import type { z } from 'zod';
import type {
	commentResponse,
	findingInput,
	findingPatch,
	findingResponse
} from '$lib/schemas/findings';
import { FAMILIES } from '$lib/tolerance/rulebook/catalogue';
import type { Severity } from '$lib/tolerance/rulebook';
import type { Marker, MarkerFinish } from '$lib/board/markers';
import { writeViewLink } from '$lib/board/view-params';
import type { MarkerLocation } from '$lib/features';
import { roleLabels, type RoleName } from '$lib/roles';

/** `manual`: raised by a person; `rule`: raised by the rulebook, keyed by its result. */
export const findingKinds = ['manual', 'rule'] as const;
export type FindingKind = (typeof findingKinds)[number];

export const severities = [
	'critical',
	'major',
	'minor',
	'note'
] as const satisfies readonly Severity[];

export const findingStates = ['raised', 'answered', 'resolved', 'verified', 'withdrawn'] as const;
export type FindingState = (typeof findingStates)[number];

/** "Open" means raised or answered. */
export const openStates: readonly FindingState[] = ['raised', 'answered'];
export const isOpen = (state: FindingState) => openStates.includes(state);

/**
 * The machine: from each state, the states a finding may go to. `raised → answered → resolved →
 * verified`; an open finding may be withdrawn; reopening returns any other state to `raised`.
 */
export const findingMoves: Record<FindingState, readonly FindingState[]> = {
	raised: ['answered', 'withdrawn'],
	answered: ['resolved', 'withdrawn', 'raised'],
	resolved: ['verified', 'raised'],
	verified: ['raised'],
	withdrawn: ['raised']
};

export const canMove = (from: FindingState, to: FindingState) => findingMoves[from].includes(to);

/** What each move is called on screen and in the trail. */
export const moveNames: Record<FindingState, string> = {
	raised: 'reopen',
	answered: 'answer',
	resolved: 'resolve',
	verified: 'verify',
	withdrawn: 'withdraw'
};

/** Moves that need a message saying why. */
export const needsMessage: readonly FindingState[] = ['withdrawn', 'raised'];

export const stateLabels: Record<FindingState, string> = {
	raised: 'Raised',
	answered: 'Answered',
	resolved: 'Resolved',
	verified: 'Verified',
	withdrawn: 'Withdrawn'
};

export const severityLabels: Record<Severity, string> = {
	critical: 'Critical',
	major: 'Major',
	minor: 'Minor',
	note: 'Note'
};

/**
 * What one person may do to findings: their id and role, and the capabilities it gives
 * (`raiseFindings`, `answerFindings`, `judgeFindings` of the server's capability table).
 */
export interface FindingPowers {
	userId: string;
	role: RoleName;
	raise: boolean;
	answer: boolean;
	judge: boolean;
}

type Judged = { state: FindingState; number: number; assigneeId: string | null };

/**
 * Why this person may not move the finding to `to`, or null when their role allows it: answering
 * is for whoever may answer (the assignee when there is one); every other move is a judge's.
 * Whether the machine has the move is `canMove`'s.
 */
export function moveRefused(who: FindingPowers, finding: Judged, to: FindingState): string | null {
	const role = roleLabels[who.role];
	if (to === 'answered') {
		if (!who.answer) return `Your role (${role}) does not answer findings`;
		if (finding.assigneeId && finding.assigneeId !== who.userId) {
			return `${findingName(finding.number)} is assigned to someone else to answer`;
		}
		return null;
	}
	return who.judge ? null : `Your role (${role}) does not ${moveNames[to]} findings`;
}

/** The states this person may move the finding to now: their role allows it and the machine has it. */
export const movesAllowed = (who: FindingPowers, finding: Judged) =>
	findingMoves[finding.state].filter((to) => !moveRefused(who, finding, to));

/** Why this person may not edit the finding's fields (its place among them), or null. */
export function editRefused(
	who: FindingPowers,
	finding: { number: number; raisedBy: string | null }
): string | null {
	if (!who.raise) return `Your role (${roleLabels[who.role]}) does not edit findings`;
	if (!who.judge && finding.raisedBy !== who.userId) {
		return `Only whoever raised ${findingName(finding.number)} or a checker edits it`;
	}
	return null;
}

/** A finding is shown as F-12. */
export const findingName = (number: number) => `F-${number}`;

/** The board's marker id of a finding (the `show` view parameter). */
export const findingMarkerId = (id: string) => `finding-${id}`;

/** A marker's id back to the finding's id (`new` for one being raised), or null. */
export const findingIdOf = (markerId: string) =>
	markerId.startsWith('finding-') ? markerId.slice('finding-'.length) : null;

/** How far along a finding is, drawn by its marker's fill (not only its colour). */
const finishes: Record<FindingState, MarkerFinish> = {
	raised: 'solid',
	answered: 'half',
	resolved: 'hollow',
	verified: 'hollow',
	withdrawn: 'dashed'
};

/**
 * A placed finding's marker: a tag (a feature's is a balloon) in its severity's colour, filled
 * by its state, `F-12` on it (a tick once verified); an area finding also draws its cloud.
 */
export function findingMarker(
	f: Pick<FindingJson, 'id' | 'number' | 'severity' | 'state' | 'text'> & {
		location: MarkerLocation;
	},
	movable: boolean
): Marker {
	const text = f.text.length > 80 ? `${f.text.slice(0, 79)}…` : f.text;
	return {
		id: findingMarkerId(f.id),
		label: `${findingName(f.number)}${f.state === 'verified' ? '✓' : ''}`,
		title: `${findingName(f.number)} · ${severityLabels[f.severity]} · ${stateLabels[f.state]}: ${text}`,
		tone: f.severity,
		location: f.location,
		shape: 'tag',
		finish: finishes[f.state],
		...(f.location.w !== undefined && { outline: 'cloud' as const }),
		movable
	};
}

/**
 * The board's address showing a finding: its sheet, centred on its marker (an area's middle),
 * and the marker to fly to (view parameters of `$lib/board/view-params`).
 */
export function boardHref(revisionPath: string, id: string, location: MarkerLocation | null) {
	if (!location) return null;
	const centre = { x: location.x + (location.w ?? 0) / 2, y: location.y + (location.h ?? 0) / 2 };
	const query = writeViewLink(new URLSearchParams(), {
		sheet: location.sheet,
		centre,
		show: findingMarkerId(id)
	});
	return `${revisionPath}?${query}`;
}

/** One finding as the API answers it. */
export type FindingJson = z.output<typeof findingResponse>;
/** POST …/revisions/{letter}/findings */
export type NewFinding = z.input<typeof findingInput>;
/** PATCH …/findings/{id} */
export type FindingChanges = z.input<typeof findingPatch>;
/** One comment of a thread. */
export type CommentJson = z.output<typeof commentResponse>;

/** How long after posting a comment its author may still edit it. */
export const commentEditMinutes = 10;
export const canStillEdit = (createdAt: Date | string, now = Date.now()) =>
	now - new Date(createdAt).getTime() <= commentEditMinutes * 60_000;

/** Counts of findings by state and by severity, all and open only (the revision's summary). */
export function countFindings(list: readonly { state: FindingState; severity: Severity }[]) {
	const zero = <K extends string>(keys: readonly K[]) =>
		Object.fromEntries(keys.map((k) => [k, 0])) as Record<K, number>;
	const counts = {
		total: list.length,
		open: 0,
		byState: zero(findingStates),
		bySeverity: zero(severities),
		openBySeverity: zero(severities)
	};
	for (const f of list) {
		counts.byState[f.state] += 1;
		counts.bySeverity[f.severity] += 1;
		if (isOpen(f.state)) {
			counts.open += 1;
			counts.openBySeverity[f.severity] += 1;
		}
	}
	return counts;
}

/** The rule families (LIM, ENV, GEO, FIT, DOC), in the catalogue's order. */
export const ruleFamilies = FAMILIES.map((f) => f.prefix);

/** Open and not waived, open but waived, and closed (resolved, verified, withdrawn). */
export interface CheckCounts {
	open: number;
	waived: number;
	closed: number;
}

/** The check summary of a revision: its rule findings by severity and by rule family. */
export interface CheckSummary extends CheckCounts {
	total: number;
	bySeverity: Record<Severity, CheckCounts>;
	byFamily: Record<string, CheckCounts>;
}

/** Counts a revision's rule findings for its check summary; a waived finding counts as closed there. */
export function summarizeCheck(
	list: readonly {
		kind: FindingKind;
		rule: string | null;
		severity: Severity;
		state: FindingState;
		waiver: unknown;
	}[]
): CheckSummary {
	const zero = (): CheckCounts => ({ open: 0, waived: 0, closed: 0 });
	const summary: CheckSummary = {
		total: 0,
		...zero(),
		bySeverity: Object.fromEntries(severities.map((s) => [s, zero()])) as Record<
			Severity,
			CheckCounts
		>,
		byFamily: Object.fromEntries(ruleFamilies.map((f) => [f, zero()]))
	};
	for (const f of list) {
		if (f.kind !== 'rule') continue;
		const which: keyof CheckCounts = !isOpen(f.state) ? 'closed' : f.waiver ? 'waived' : 'open';
		summary.total += 1;
		summary[which] += 1;
		summary.bySeverity[f.severity][which] += 1;
		const family = (f.rule ?? '').slice(0, 3);
		if (summary.byFamily[family]) summary.byFamily[family][which] += 1;
	}
	return summary;
}
