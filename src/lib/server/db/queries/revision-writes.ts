/*
 * Writes to what a revision holds (features, fits, findings) and to the revision's state: each
 * runs in one transaction that locks the revision and refuses a frozen one (a state change
 * takes frozen ones too), checks the version the writer saw, records the change on the
 * activity trail and appends it to the revision's change feed (the boards' live events,
 * `revision-events.ts`).
 */
import { eq } from 'drizzle-orm';
import type { Db } from '../connect';
import {
	isFrozen,
	revisions,
	type DrawingRow,
	type RevisionRow,
	type RevisionState
} from '../schema';
import { recordActivity, type ActivityEntry, type Actor } from './activity';
import { recheckRevision, type RecheckScope } from './rule-findings';
import { appendEvent } from './revision-events';

export class RevisionFrozen extends Error {
	constructor(readonly revision: RevisionRow) {
		super(`Revision ${revision.letter} is ${revision.state}: its features no longer change`);
	}
}

/** An edit made against a version that is gone: `current` is the row now, null when deleted. */
export class StaleWrite<Row> extends Error {
	constructor(
		readonly current: Row | null,
		readonly noun: string
	) {
		super(
			current
				? `Someone changed this ${noun} since you loaded it`
				: `Someone deleted this ${noun} since you loaded it`
		);
	}
}

/** Locks the revision for the change; `refuse` (default: frozen) throws `RevisionFrozen`. */
export async function lockRevision(
	tx: Db,
	revision: Pick<RevisionRow, 'id'>,
	refuse: (state: RevisionState) => boolean = isFrozen
) {
	const [locked] = await tx
		.select()
		.from(revisions)
		.where(eq(revisions.id, revision.id))
		.for('update');
	if (refuse(locked.state)) throw new RevisionFrozen(locked);
	return locked;
}

/** Locks the revision for the change and refuses a frozen one (approved, released). */
export const lockOpenRevision = (tx: Db, revision: Pick<RevisionRow, 'id'>) =>
	lockRevision(tx, revision);

/** Who writes, and on which revision of which drawing. */
export interface RevisionPlace {
	actor: Actor;
	drawing: DrawingRow;
	revision: RevisionRow;
}

type Written = { id: string; version: number };

export interface RevisionWrite<Row extends Written> {
	/** The trail's (and the change feed's) name for the row. */
	entity: 'feature' | 'fit' | 'finding' | 'revision';
	/** Checks under the lock (given the locked revision) before the write; throws to refuse. */
	check?: (tx: Db, locked: RevisionRow) => Promise<void>;
	/** A change of the revision's own state: frozen revisions take it too (the check judges). */
	stateChange?: boolean;
	/** The write (`… .returning()`); no row back means the version it was made against is gone. */
	write: (tx: Db) => Promise<Row[]>;
	/** The error for a write that found no row at its version (a `StaleWrite`). */
	stale?: (tx: Db) => Promise<Error>;
	/** What the trail records of the written row. */
	record: (row: Row) => Pick<ActivityEntry, 'action' | 'summary' | 'before' | 'after'>;
	/** What the rulebook re-checks after the write, in the same transaction. */
	recheck?: (row: Row) => RecheckScope;
	/** Other revisions the row is listed on (a fit, on its shaft's revision), told of it too. */
	listedOn?: (row: Row) => (string | null)[];
}

/**
 * One change to a revision's content in one transaction: lock the revision (refusing a frozen
 * one), check, write with the version check, record it on the trail and in the change feed,
 * and re-check what the rulebook finds about it. Returns the written row.
 */
export async function writeOnRevision<Row extends Written>(
	db: Db,
	{ actor, drawing, revision }: RevisionPlace,
	change: RevisionWrite<Row>
): Promise<Row> {
	return db.transaction(async (tx) => {
		const locked = await lockRevision(tx, revision, change.stateChange ? () => false : isFrozen);
		await change.check?.(tx, locked);
		const [row] = await change.write(tx);
		if (!row) throw (await change.stale?.(tx)) ?? new Error(`The ${change.entity} was not written`);
		const recorded = change.record(row);
		await recordActivity(tx, {
			teamId: drawing.teamId,
			actor,
			entity: change.entity,
			entityId: row.id,
			drawingId: drawing.id,
			...recorded
		});
		if (change.recheck) await recheckRevision(tx, actor, revision.id, change.recheck(row));
		const event = {
			type: change.entity,
			action: recorded.action,
			id: row.id,
			version: row.version
		};
		// The revision is locked above: its sequence numbers already commit in order.
		await appendEvent(tx, { ...event, revisionId: revision.id, lock: false });
		for (const other of new Set(change.listedOn?.(row) ?? [])) {
			if (other && other !== revision.id) {
				await appendEvent(tx, { ...event, revisionId: other, lock: false });
			}
		}
		return row;
	});
}
