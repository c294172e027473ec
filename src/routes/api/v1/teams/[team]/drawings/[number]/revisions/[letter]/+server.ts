import { error, json } from '@sveltejs/kit';
import { revisionPatch } from '$lib/schemas/drawings';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { publicRevision, updateRevisionReason } from '$lib/server/db/queries/drawings';
import { requireRevision } from '$lib/server/drawings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { revision } = await requireRevision(params.team, params.number, params.letter, 'view');
	return json(publicRevision(revision));
};

/** The reason for the change can be corrected; states change through transitions. */
export const PATCH: RequestHandler = async ({ params, request }) => {
	const { user, drawing, revision } = await requireRevision(
		params.team,
		params.number,
		params.letter,
		'author'
	);
	const input = await readJson(request, revisionPatch);
	const updated = await updateRevisionReason(
		db,
		user,
		drawing,
		revision,
		input.version,
		input.reason
	);
	if (!updated.ok) {
		error(409, {
			message: 'Someone changed this revision since you loaded it: your edit was not applied.',
			code: 'stale',
			current: publicRevision(updated.current)
		});
	}
	return json(publicRevision(updated.revision));
};
