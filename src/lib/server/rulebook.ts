/*
 * The rulebook on a team's stored drawings: a full check of a revision (POST …/check) and its
 * check summary. Every change to features, fits and settings re-checks what it touches on its
 * own (db/queries/rule-findings); team settings re-check in db/queries/teams.
 */
import { eq } from 'drizzle-orm';
import { summarizeCheck, type CheckSummary } from '$lib/findings';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import { listFindings } from './db/queries/findings';
import { recheckRevision } from './db/queries/rule-findings';
import { isFrozen, revisions, type RevisionRow } from './db/schema';

/** The revision's check summary. */
export async function checkSummaryOf(db: Db, revisionId: string): Promise<CheckSummary> {
	return summarizeCheck(await listFindings(db, revisionId, { kind: 'rule' }));
}

export type CheckOutcome =
	| { ok: true; summary: CheckSummary & { notes: string[] } }
	| { ok: false; status: 409; code: 'frozen'; message: string };

/** A full check of the revision: every rule, every subject, findings kept true. */
export async function runCheck(db: Db, actor: Actor, revision: RevisionRow): Promise<CheckOutcome> {
	const done = await db.transaction(async (tx) => {
		const [locked] = await tx
			.select()
			.from(revisions)
			.where(eq(revisions.id, revision.id))
			.for('update');
		if (isFrozen(locked.state)) return { frozen: locked };
		return { outcome: await recheckRevision(tx, actor, revision.id, 'full') };
	});
	if (done.frozen) {
		return {
			ok: false,
			status: 409,
			code: 'frozen',
			message: `Revision ${done.frozen.letter} is ${done.frozen.state}: its findings no longer change.`
		};
	}
	const summary = await checkSummaryOf(db, revision.id);
	return { ok: true, summary: { ...summary, notes: done.outcome!.notes } };
}
