/*
 * Threads: comments on findings and on features. The body is kept as typed; every answer
 * carries it rendered and sanitized (`comment-html.ts`), with `@mentions` resolved to members
 * of the team only. Anyone who may raise findings comments on open and released revisions;
 * supplier quality on released revisions only (PRODUCT.md §2); an approved or superseded
 * revision takes none (409 `frozen`). Authors edit their own comment for
 * ten minutes after posting; it then shows as edited.
 */
import { canStillEdit, commentEditMinutes, findingName, type CommentJson } from '$lib/findings';
import { roleLabels } from '$lib/roles';
import { can } from './capabilities';
import { renderComment, type Mentionable } from './comment-html';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import {
	listComments,
	saveComment,
	type ThreadPlace,
	type ThreadSubject
} from './db/queries/comments';
import { isVisibleToSuppliers } from './db/queries/drawings';
import { RevisionFrozen } from './db/queries/revision-writes';
import { listMembers } from './db/queries/teams';
import type {
	CommentRow,
	DrawingRow,
	FeatureRow,
	FindingRow,
	RevisionRow,
	Role
} from './db/schema';

/** A thread: its subject, and the revision and team it belongs to. */
export interface Thread {
	team: { id: string };
	drawing: DrawingRow;
	revision: RevisionRow;
	subject: ThreadSubject;
	/** How the trail names the thread. */
	title: string;
}

export const findingThread = (
	place: Omit<Thread, 'subject' | 'title'>,
	finding: FindingRow
): Thread => ({
	...place,
	subject: { findingId: finding.id },
	title: `${findingName(finding.number)} on revision ${place.revision.letter} of ${place.drawing.number}`
});

export const featureThread = (
	place: Omit<Thread, 'subject' | 'title'>,
	feature: FeatureRow
): Thread => ({
	...place,
	subject: { featureId: feature.id },
	title: `feature ${feature.balloon}${feature.label ? ` (${feature.label})` : ''} on revision ${place.revision.letter} of ${place.drawing.number}`
});

export type CommentRefusal = {
	ok: false;
	status: 403 | 409;
	code: 'forbidden' | 'too_late' | 'frozen';
	message: string;
};
export type CommentOutcome = { ok: true; comment: CommentJson } | CommentRefusal;

const placeOf = (thread: Thread): ThreadPlace => ({
	teamId: thread.team.id,
	drawingId: thread.drawing.id,
	revisionId: thread.revision.id,
	title: thread.title
});

/** Writes a comment; an approved or superseded revision refuses it (409 `frozen`). */
async function save(...args: Parameters<typeof saveComment>) {
	try {
		return { ok: true as const, row: await saveComment(...args) };
	} catch (err) {
		if (!(err instanceof RevisionFrozen)) throw err;
		const { letter, state } = err.revision;
		return {
			ok: false as const,
			status: 409 as const,
			code: 'frozen' as const,
			message: `Revision ${letter} is ${state}: its threads take no more comments.`
		};
	}
}

function commentJson(row: CommentRow, members: readonly Mentionable[]): CommentJson {
	return {
		id: row.id,
		body: row.body,
		html: renderComment(row.body, members).html,
		authorId: row.authorId ?? null,
		createdAt: row.createdAt.toISOString(),
		editedAt: row.editedAt?.toISOString() ?? null
	};
}

/** The thread's comments, oldest first. */
export async function commentsOf(db: Db, thread: Thread) {
	const [rows, members] = await Promise.all([
		listComments(db, thread.subject),
		listMembers(db, thread.team.id)
	]);
	return rows.map((row) => commentJson(row, members));
}

export async function addComment(
	db: Db,
	asker: { user: Actor; role: Role },
	thread: Thread,
	body: string
): Promise<CommentOutcome> {
	if (!can(asker.role, 'raiseFindings') && !isVisibleToSuppliers(thread.revision.state)) {
		return {
			ok: false,
			status: 403,
			code: 'forbidden',
			message: `Your role (${roleLabels[asker.role]}) comments on released revisions only`
		};
	}
	const members = await listMembers(db, thread.team.id);
	const { mentions } = renderComment(body, members);
	const saved = await save(
		db,
		asker.user,
		placeOf(thread),
		{ subject: thread.subject },
		{ body, mentions }
	);
	if (!saved.ok) return saved;
	return { ok: true, comment: commentJson(saved.row, members) };
}

/** The author's own comment, within ten minutes of posting it. */
export async function editComment(
	db: Db,
	user: Actor,
	thread: Thread,
	comment: CommentRow,
	body: string
): Promise<CommentOutcome> {
	if (comment.authorId !== user.id) {
		return {
			ok: false,
			status: 403,
			code: 'forbidden',
			message: 'Only its author edits a comment'
		};
	}
	if (!canStillEdit(comment.createdAt)) {
		return {
			ok: false,
			status: 409,
			code: 'too_late',
			message: `A comment is edited within ${commentEditMinutes} minutes of posting it: write a new one`
		};
	}
	const members = await listMembers(db, thread.team.id);
	const { mentions } = renderComment(body, members);
	const saved = await save(db, user, placeOf(thread), { comment }, { body, mentions });
	if (!saved.ok) return saved;
	return { ok: true, comment: commentJson(saved.row, members) };
}
