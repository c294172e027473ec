import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../connect';
import { comments, type CommentRow } from '../schema';
import { recordActivity, type Actor } from './activity';

/** What a thread hangs on: a finding or a feature. */
export type ThreadSubject = { findingId: string } | { featureId: string };

const onSubject = (subject: ThreadSubject) =>
	'findingId' in subject
		? eq(comments.findingId, subject.findingId)
		: eq(comments.featureId, subject.featureId);

/** Where the trail files a comment, and how it names the thread. */
export interface ThreadPlace {
	teamId: string;
	drawingId: string;
	/** e.g. "F-3 on revision A of KF-1001". */
	title: string;
}

export async function listComments(db: Db, subject: ThreadSubject) {
	return db
		.select()
		.from(comments)
		.where(onSubject(subject))
		.orderBy(asc(comments.createdAt), asc(comments.id));
}

export async function getComment(db: Db, subject: ThreadSubject, id: string) {
	const [row] = await db
		.select()
		.from(comments)
		.where(and(onSubject(subject), eq(comments.id, id)));
	return row ?? null;
}

const stored = (row: CommentRow) => ({
	id: row.id,
	body: row.body,
	mentions: row.mentions,
	editedAt: row.editedAt?.toISOString() ?? null
});

export async function createComment(
	db: Db,
	actor: Actor,
	place: ThreadPlace,
	subject: ThreadSubject,
	values: { body: string; mentions: string[] }
) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.insert(comments)
			.values({ ...values, ...subject, teamId: place.teamId, authorId: actor.id })
			.returning();
		await recordActivity(tx, {
			teamId: place.teamId,
			actor,
			entity: 'comment',
			entityId: row.id,
			drawingId: place.drawingId,
			action: 'create',
			summary: `commented on ${place.title}`,
			after: stored(row)
		});
		return row;
	});
}

/** Replaces a comment's body; it shows as edited from now on. */
export async function updateComment(
	db: Db,
	actor: Actor,
	place: ThreadPlace,
	comment: CommentRow,
	values: { body: string; mentions: string[] }
) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.update(comments)
			.set({ ...values, editedAt: new Date() })
			.where(eq(comments.id, comment.id))
			.returning();
		await recordActivity(tx, {
			teamId: place.teamId,
			actor,
			entity: 'comment',
			entityId: row.id,
			drawingId: place.drawingId,
			action: 'update',
			summary: `edited a comment on ${place.title}`,
			before: stored(comment),
			after: stored(row)
		});
		return row;
	});
}
