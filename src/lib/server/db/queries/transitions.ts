/*
 * A revision's state changes (PRODUCT.md §3): each is one write through `writeOnRevision` (the
 * revision locked, the gates judged on the locked row, the move kept in `revision_transitions`
 * and on the trail). Releasing supersedes the drawing's previously released revision in the
 * same transaction.
 */
import { and, asc, eq, inArray, ne, sql } from 'drizzle-orm';
import { movePastTense, type RevisionMove } from '$lib/revisions';
import type { Db } from '../connect';
import { revisions, revisionTransitions, users, type RevisionRow } from '../schema';
import { recordActivity, type Actor } from './activity';
import { writeOnRevision, type RevisionPlace } from './revision-writes';

const transitionColumns = {
	revisionId: revisionTransitions.revisionId,
	from: revisionTransitions.from,
	to: revisionTransitions.to,
	message: revisionTransitions.message,
	by: revisionTransitions.byId,
	byName: sql<string | null>`coalesce(${users.name}, ${users.email})`,
	at: revisionTransitions.at
};

/** The moves of one revision, or of several (a drawing's history), oldest first, with who made each. */
export async function listTransitions(db: Db, revisionIds: string | string[]) {
	const ids = typeof revisionIds === 'string' ? [revisionIds] : revisionIds;
	if (ids.length === 0) return [];
	return db
		.select(transitionColumns)
		.from(revisionTransitions)
		.leftJoin(users, eq(users.id, revisionTransitions.byId))
		.where(inArray(revisionTransitions.revisionId, ids))
		.orderBy(asc(revisionTransitions.id));
}

/** Whether `userId` submitted the revision for check (first time or again). */
export async function hasSubmitted(db: Db, revisionId: string, userId: string) {
	const [row] = await db
		.select({ id: revisionTransitions.id })
		.from(revisionTransitions)
		.where(
			and(
				eq(revisionTransitions.revisionId, revisionId),
				eq(revisionTransitions.byId, userId),
				eq(revisionTransitions.to, 'in-check'),
				inArray(revisionTransitions.from, ['draft', 'returned'])
			)
		)
		.limit(1);
	return Boolean(row);
}

const revisionName = (revision: RevisionRow, number: string) =>
	`revision ${revision.letter} of ${number}`;

/** Who approved and released it: set by those moves, cleared when an approval is reopened. */
function signatures(move: RevisionMove, actor: Actor, at: Date) {
	if (move.to === 'approved') return { approvedBy: actor.id, approvedAt: at };
	if (move.to === 'released') return { releasedBy: actor.id, releasedAt: at };
	if (move.from === 'approved') return { approvedBy: null, approvedAt: null };
	return {};
}

/**
 * Moves the revision with `message`: `judge` finds the move on the locked revision (its state
 * as it is now) and throws to refuse it. Returns the revision and the move as kept.
 */
export async function moveRevision(
	db: Db,
	place: RevisionPlace,
	message: string,
	judge: (tx: Db, locked: RevisionRow) => Promise<RevisionMove>
) {
	const { actor, drawing } = place;
	let move: RevisionMove | null = null;
	const at = new Date();
	const revision = await writeOnRevision<RevisionRow>(db, place, {
		entity: 'revision',
		stateChange: true,
		check: async (tx, locked) => {
			move = await judge(tx, locked);
		},
		write: async (tx) => {
			const made = move!;
			const rows = await tx
				.update(revisions)
				.set({
					state: made.to,
					...signatures(made, actor, at),
					version: sql`${revisions.version} + 1`
				})
				.where(and(eq(revisions.id, place.revision.id), eq(revisions.state, made.from)))
				.returning();
			if (rows.length === 0) return rows;
			await tx.insert(revisionTransitions).values({
				revisionId: place.revision.id,
				from: made.from,
				to: made.to,
				message,
				byId: actor.id,
				at
			});
			if (made.to === 'released') await supersedeOthers(tx, actor, place, rows[0], at);
			return rows;
		},
		record: (row) => ({
			action: move!.name,
			summary: `${movePastTense[move!.name] ?? move!.name} ${revisionName(row, drawing.number)}${message ? `: ${message}` : ''}`,
			before: { state: move!.from },
			after: { state: row.state, message }
		})
	});
	return { revision, move: move! as RevisionMove, at };
}

/** The drawing's previously released revision becomes superseded by `released`. */
async function supersedeOthers(
	tx: Db,
	actor: Actor,
	{ drawing }: RevisionPlace,
	released: RevisionRow,
	at: Date
) {
	const older = await tx
		.update(revisions)
		.set({ state: 'superseded', version: sql`${revisions.version} + 1` })
		.where(
			and(
				eq(revisions.drawingId, drawing.id),
				eq(revisions.state, 'released'),
				ne(revisions.id, released.id)
			)
		)
		.returning();
	for (const row of older) {
		const message = `Revision ${released.letter} released`;
		await tx.insert(revisionTransitions).values({
			revisionId: row.id,
			from: 'released',
			to: 'superseded',
			message,
			byId: actor.id,
			at
		});
		await recordActivity(tx, {
			teamId: drawing.teamId,
			actor,
			entity: 'revision',
			entityId: row.id,
			drawingId: drawing.id,
			action: 'supersede',
			summary: `superseded ${revisionName(row, drawing.number)}: ${message}`,
			before: { state: 'released' },
			after: { state: 'superseded', message }
		});
	}
}
