import { error, json } from '@sveltejs/kit';
import { revisionPatch } from '$lib/schemas/drawings';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { publicRevision, updateRevision } from '$lib/server/db/queries/drawings';
import { requireRevision } from '$lib/server/drawings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { revision } = await requireRevision(params.team, params.number, params.letter, 'view');
	return json(publicRevision(revision));
};

/**
 * The reason for the change can be corrected, and the revision's settings edited while it is
 * not frozen; states change through transitions.
 */
export const PATCH: RequestHandler = async ({ params, request }) => {
	const { user, drawing, revision } = await requireRevision(
		params.team,
		params.number,
		params.letter,
		'author'
	);
	const input = await readJson(request, revisionPatch);
	const { version, ...changes } = input;
	const updated = await updateRevision(db, user, drawing, revision, version, changes);
	if (!updated.ok && updated.code === 'frozen') {
		error(409, {
			message: `Revision ${revision.letter} is ${updated.current.state}: its settings are frozen.`,
			code: 'frozen',
			current: publicRevision(updated.current)
		});
	}
	if (!updated.ok) {
		error(409, {
			message: 'Someone changed this revision since you loaded it: your edit was not applied.',
			code: 'stale',
			current: publicRevision(updated.current)
		});
	}
	return json(publicRevision(updated.revision));
};
