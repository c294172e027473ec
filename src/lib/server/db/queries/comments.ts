import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../connect';
import { comments, type CommentRow } from '../schema';
import { takesComments } from '$lib/revisions';
import { recordActivity, type Actor } from './activity';
import { appendEvent } from './revision-events';
import { lockRevision } from './revision-writes';

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
	/** The revision whose boards hear of the comment. */
	revisionId: string;
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

/**
 * Adds a comment to the thread of `subject`, or replaces the body of `comment` (which shows as
 * edited from then on); the trail keeps both bodies. The revision is locked first: an approved
 * or superseded one takes no comments (`RevisionFrozen`), a released one does.
 */
export async function saveComment(
	db: Db,
	actor: Actor,
	place: ThreadPlace,
	target: { subject: ThreadSubject } | { comment: CommentRow },
	values: { body: string; mentions: string[] }
) {
	return db.transaction(async (tx) => {
		await lockRevision(tx, { id: place.revisionId }, (state) => !takesComments(state));
		const before = 'comment' in target ? target.comment : null;
		const [row] =
			'comment' in target
				? await tx
						.update(comments)
						.set({ ...values, editedAt: new Date() })
						.where(eq(comments.id, target.comment.id))
						.returning()
				: await tx
						.insert(comments)
						.values({ ...values, ...target.subject, teamId: place.teamId, authorId: actor.id })
						.returning();
		await recordActivity(tx, {
			teamId: place.teamId,
			actor,
			entity: 'comment',
			entityId: row.id,
			drawingId: place.drawingId,
			action: before ? 'update' : 'create',
			summary: before ? `edited a comment on ${place.title}` : `commented on ${place.title}`,
			before: before ? stored(before) : undefined,
			after: stored(row)
		});
		await appendEvent(tx, {
			revisionId: place.revisionId,
			type: 'comment',
			action: before ? 'update' : 'create',
			id: row.id,
			subject: row.findingId
				? { type: 'finding', id: row.findingId }
				: { type: 'feature', id: row.featureId! }
		});
		return row;
	});
}
