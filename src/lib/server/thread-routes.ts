/*
 * The JSON routes of a thread, the same for findings and features:
 * `…/{findings|features}/{id}/comments` (GET, POST `{body}`) and `…/comments/{commentId}`
 * (PATCH `{body}`, your own comment within ten minutes).
 */
import { json, type RequestEvent } from '@sveltejs/kit';
import { commentInput } from '$lib/schemas/findings';
import { refuse } from './api';
import { isUuid, readJson } from './api-input';
import { addComment, commentsOf, editComment, featureThread, findingThread } from './comments';
import type { Capability } from './capabilities';
import { db } from './db';
import { getComment } from './db/queries/comments';
import { notFound, requireFeature, requireFinding } from './drawings';

type ThreadParams = { team: string; number: string; letter: string; id: string };

async function requireThread(
	kind: 'finding' | 'feature',
	params: ThreadParams,
	capability: Capability
) {
	if (kind === 'finding') {
		const { place, finding } = await requireFinding(params, capability);
		return { place, thread: findingThread(place, finding) };
	}
	const { place, feature } = await requireFeature(params, capability);
	return { place, thread: featureThread(place, feature) };
}

/** GET and POST of `…/{kind}s/{id}/comments`. */
export function threadRoutes(kind: 'finding' | 'feature') {
	return {
		GET: async ({ params }: RequestEvent<ThreadParams>) => {
			const { thread } = await requireThread(kind, params, 'view');
			return json(await commentsOf(db, thread));
		},
		POST: async ({ params, request }: RequestEvent<ThreadParams>) => {
			const { place, thread } = await requireThread(kind, params, 'commentReleased');
			const { body } = await readJson(request, commentInput);
			const asker = { user: place.user, role: place.membership.role };
			const outcome = await addComment(db, asker, thread, body);
			if (!outcome.ok) refuse(outcome);
			return json(outcome.comment, { status: 201 });
		}
	};
}

/** PATCH of `…/{kind}s/{id}/comments/{commentId}`. */
export function commentRoutes(kind: 'finding' | 'feature') {
	return {
		PATCH: async ({ params, request }: RequestEvent<ThreadParams & { commentId: string }>) => {
			const { place, thread } = await requireThread(kind, params, 'commentReleased');
			const comment = isUuid(params.commentId)
				? await getComment(db, thread.subject, params.commentId)
				: null;
			if (!comment) notFound();
			const { body } = await readJson(request, commentInput);
			const outcome = await editComment(db, place.user, thread, comment, body);
			if (!outcome.ok) refuse(outcome);
			return json(outcome.comment);
		}
	};
}
