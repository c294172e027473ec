import { json } from '@sveltejs/kit';
import { transitionInput } from '$lib/schemas/transitions';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { transitionRevision, transitionsOf } from '$lib/server/transitions';
import type { RequestHandler } from './$types';

/** The revision's history: every move, oldest first, with who, when and why. */
export const GET: RequestHandler = async ({ params }) => {
	const { revision } = await requireRevision(params.team, params.number, params.letter, 'view');
	return json(await transitionsOf(db, revision.id));
};

/** One move of the review loop `{to, message}`; the service checks role, machine and gates. */
export const POST: RequestHandler = async ({ params, request }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const input = await readJson(request, transitionInput);
	const asker = { user: place.user, role: place.membership.role };
	const outcome = await transitionRevision(db, asker, place, input);
	if (!outcome.ok) refuse(outcome);
	return json({ ...outcome.transition, revision: outcome.revision }, { status: 201 });
};
