/*
 * Revision states and the review loop (PRODUCT.md §3): the machine, who may make each move and
 * what each is called. No server or database import: safe in the browser.
 */

export const revisionStates = [
	'draft',
	'in-check',
	'returned',
	'approved',
	'released',
	'superseded'
] as const;
export type RevisionState = (typeof revisionStates)[number];

/** Approved and released revisions (and released ones later superseded) no longer change. */
export const frozenStates: readonly RevisionState[] = ['approved', 'released', 'superseded'];
export const isFrozen = (state: RevisionState) => frozenStates.includes(state);

/**
 * Comments are taken while a revision is open and on a released one (its conversation with
 * supplier quality, kept with the release packet); an approved or superseded revision takes none.
 */
export const takesComments = (state: RevisionState) => !isFrozen(state) || state === 'released';

/** The capability a move needs (`capabilities.ts`); `system` moves are made by Checkplate itself. */
export type MoveCapability = 'author' | 'decideRevisions' | 'system';

export interface RevisionMove {
	from: RevisionState;
	to: RevisionState;
	/** The button's and the trail's word for it. */
	name: string;
	capability: MoveCapability;
	/** A message saying why is required. */
	needsMessage: boolean;
}

/**
 * The machine: `draft → in-check`; `in-check → returned | approved`; `returned → in-check`
 * (resubmit); `approved → released`, or back to `in-check` (reopened by a checker);
 * `released → superseded` when a later revision is released.
 */
export const revisionMoves: readonly RevisionMove[] = [
	{ from: 'draft', to: 'in-check', name: 'submit', capability: 'author', needsMessage: false },
	{
		from: 'in-check',
		to: 'returned',
		name: 'return',
		capability: 'decideRevisions',
		needsMessage: true
	},
	{
		from: 'in-check',
		to: 'approved',
		name: 'approve',
		capability: 'decideRevisions',
		needsMessage: false
	},
	{ from: 'returned', to: 'in-check', name: 'resubmit', capability: 'author', needsMessage: false },
	{
		from: 'approved',
		to: 'released',
		name: 'release',
		capability: 'decideRevisions',
		needsMessage: false
	},
	{
		from: 'approved',
		to: 'in-check',
		name: 'reopen',
		capability: 'decideRevisions',
		needsMessage: true
	},
	{
		from: 'released',
		to: 'superseded',
		name: 'supersede',
		capability: 'system',
		needsMessage: false
	}
];

export const findMove = (from: RevisionState, to: RevisionState) =>
	revisionMoves.find((move) => move.from === from && move.to === to) ?? null;

export const movesFrom = (from: RevisionState) => revisionMoves.filter((m) => m.from === from);

/** What the history and the trail say of a move: "returned by …". */
export const movePastTense: Record<string, string> = {
	submit: 'submitted',
	return: 'returned',
	approve: 'approved',
	resubmit: 'resubmitted',
	release: 'released',
	reopen: 'reopened',
	supersede: 'superseded'
};

export const revisionStateLabels: Record<RevisionState, string> = {
	draft: 'Draft',
	'in-check': 'In check',
	returned: 'Returned',
	approved: 'Approved',
	released: 'Released',
	superseded: 'Superseded'
};

/** One move as `GET …/transitions` lists it. */
export interface TransitionJson {
	from: RevisionState;
	to: RevisionState;
	name: string;
	message: string;
	by: string | null;
	byName: string | null;
	at: string;
}

/** A move the asker may make now, as the board offers it. */
export type MoveOffer = Pick<RevisionMove, 'to' | 'name' | 'needsMessage'>;
