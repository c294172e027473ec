import { error, json } from '@sveltejs/kit';
import { drawingPatch } from '$lib/schemas/drawings';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import {
	listRevisions,
	publicDrawing,
	publicRevision,
	StaleEdit,
	updateDrawing
} from '$lib/server/db/queries/drawings';
import { requireDrawing } from '$lib/server/drawings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { drawing, releasedOnly } = await requireDrawing(params.team, params.number, 'view');
	const revisions = await listRevisions(db, drawing.id, { releasedOnly });
	return json({
		...publicDrawing(drawing),
		revisions: revisions.map((r) => publicRevision(r.revision))
	});
};

export const PATCH: RequestHandler = async ({ params, request }) => {
	const { user, drawing } = await requireDrawing(params.team, params.number, 'author');
	const { version, ...changes } = await readJson(request, drawingPatch);
	try {
		return json(publicDrawing(await updateDrawing(db, user, drawing, version, changes)));
	} catch (err) {
		if (err instanceof StaleEdit) {
			error(409, {
				message: `${err.message}: your edit was not applied. Here is the current drawing.`,
				code: 'stale',
				current: publicDrawing(err.current)
			});
		}
		throw err;
	}
};
