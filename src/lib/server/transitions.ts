/*
 * The review loop (PRODUCT.md §3): moving a revision between its states. Callers check that the
 * asker may see the revision (`requireRevision`); this checks the rest on the locked revision —
 * that the machine has the move, that the asker's role may make it, the message it needs, and
 * for an approval separation of duties and the open critical and major findings — and answers
 * an outcome either way.
 */
import {
	findMove,
	movesFrom,
	revisionStateLabels,
	type MoveOffer,
	type RevisionState,
	type TransitionJson
} from '$lib/revisions';
import { findingName } from '$lib/findings';
import { roleLabels } from '$lib/roles';
import type { TransitionInput } from '$lib/schemas/transitions';
import { can } from './capabilities';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import { publicRevision } from './db/queries/drawings';
import { blockingFindings } from './db/queries/findings';
import { hasSubmitted, listTransitions, moveRevision } from './db/queries/transitions';
import type { DrawingRow, RevisionRow, Role, TeamRow } from './db/schema';

export interface TransitionPlace {
	team: Pick<TeamRow, 'id' | 'allowSelfApproval'>;
	drawing: DrawingRow;
	revision: RevisionRow;
}

export type TransitionRefusal = {
	ok: false;
	status: 400 | 403 | 409;
	code: 'invalid' | 'forbidden' | 'invalid_transition' | 'separation_of_duties' | 'open_findings';
	message: string;
	field?: string;
	findings?: { id: string; number: number; severity: string; state: string; text: string }[];
};

export type TransitionOutcome =
	| { ok: true; transition: TransitionJson; revision: ReturnType<typeof publicRevision> }
	| TransitionRefusal;

class Refused extends Error {
	constructor(readonly refusal: TransitionRefusal) {
		super(refusal.message);
	}
}

const refuse = (refusal: Omit<TransitionRefusal, 'ok'>): never => {
	throw new Refused({ ok: false, ...refusal });
};

/** Anyone whose role makes some move of the machine. */
const movesRevisions = (role: Role) => can(role, 'author') || can(role, 'decideRevisions');

/** The moves the asker's role may make from the revision's state now (the board's buttons). */
export function movesFor(role: Role, state: RevisionState): MoveOffer[] {
	return movesFrom(state)
		.filter((move) => move.capability !== 'system' && can(role, move.capability))
		.map(({ to, name, needsMessage }) => ({ to, name, needsMessage }));
}

/** The revision's history, oldest first. */
export async function transitionsOf(db: Db, revisionId: string): Promise<TransitionJson[]> {
	return (await listTransitions(db, revisionId)).map(transitionJson);
}

export function transitionJson(row: {
	from: RevisionState;
	to: RevisionState;
	message: string;
	by: string | null;
	byName: string | null;
	at: Date;
}): TransitionJson {
	return {
		from: row.from,
		to: row.to,
		name: findMove(row.from, row.to)?.name ?? row.to,
		message: row.message,
		by: row.by,
		byName: row.byName,
		at: row.at.toISOString()
	};
}

/** Separation of duties: nobody approves what they uploaded or submitted, unless the team allows. */
async function checkSeparation(tx: Db, place: TransitionPlace, user: Actor, locked: RevisionRow) {
	if (place.team.allowSelfApproval) return;
	const uploaded = locked.uploadedBy === user.id;
	if (!uploaded && !(await hasSubmitted(tx, locked.id, user.id))) return;
	refuse({
		status: 403,
		code: 'separation_of_duties',
		message: `You ${uploaded ? 'uploaded' : 'submitted'} revision ${locked.letter}: someone else approves it (the team's settings can allow self-approval for a one-person team).`
	});
}

/** The approval gate: no critical or major finding open and not waived. */
async function checkFindings(tx: Db, locked: RevisionRow) {
	const blocking = await blockingFindings(tx, locked.id);
	if (blocking.length === 0) return;
	refuse({
		status: 409,
		code: 'open_findings',
		message: `Revision ${locked.letter} has ${blocking.length} open critical or major finding${blocking.length === 1 ? '' : 's'} (${blocking.map((f) => findingName(f.number)).join(', ')}): resolve, withdraw or waive them before approving.`,
		findings: blocking.map((f) => ({
			id: f.id,
			number: f.number,
			severity: f.severity,
			state: f.state,
			text: f.text
		}))
	});
}

/** Judges the move on the locked revision: machine, role, message, then an approval's gates. */
function judge(asker: { user: Actor; role: Role }, place: TransitionPlace, input: TransitionInput) {
	return async (tx: Db, locked: RevisionRow) => {
		const move = findMove(locked.state, input.to);
		if (!move || move.capability === 'system') {
			return refuse({
				status: 409,
				code: 'invalid_transition',
				message: `A revision that is ${revisionStateLabels[locked.state].toLowerCase()} cannot be moved to ${input.to}${input.to === 'superseded' ? ': that happens when a later revision is released' : ''}.`
			});
		}
		if (!can(asker.role, move.capability)) {
			refuse({
				status: 403,
				code: 'forbidden',
				message: `Your role (${roleLabels[asker.role]}) may not ${move.name} a revision.`
			});
		}
		if (move.needsMessage && !input.message) {
			refuse({
				status: 400,
				code: 'invalid',
				field: 'message',
				message: `Say why you ${move.name} the revision: a message is required.`
			});
		}
		if (move.to === 'approved') {
			await checkSeparation(tx, place, asker.user, locked);
			await checkFindings(tx, locked);
		}
		return move;
	};
}

/** `POST …/transitions {to, message}`: one move of the review loop. */
export async function transitionRevision(
	db: Db,
	asker: { user: Actor; role: Role },
	place: TransitionPlace,
	input: TransitionInput
): Promise<TransitionOutcome> {
	if (!movesRevisions(asker.role)) {
		return {
			ok: false,
			status: 403,
			code: 'forbidden',
			message: `Your role (${roleLabels[asker.role]}) does not move revisions.`
		};
	}
	try {
		const { revision, move, at } = await moveRevision(
			db,
			{ actor: asker.user, drawing: place.drawing, revision: place.revision },
			input.message,
			judge(asker, place, input)
		);
		const transition = transitionJson({
			from: move.from,
			to: move.to,
			message: input.message,
			by: asker.user.id,
			byName: asker.user.name ?? asker.user.email,
			at
		});
		return { ok: true, revision: publicRevision(revision), transition };
	} catch (err) {
		if (err instanceof Refused) return err.refusal;
		throw err;
	}
}
