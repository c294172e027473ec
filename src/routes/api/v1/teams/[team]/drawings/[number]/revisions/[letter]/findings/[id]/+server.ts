import { json } from '@sveltejs/kit';
import { findingPatch } from '$lib/schemas/findings';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireFinding } from '$lib/server/drawings';
import { changeFinding, findingOf } from '$lib/server/findings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { finding } = await requireFinding(params, 'view');
	return json(await findingOf(db, finding));
};

/** Every role that sees the revision may ask; the service checks what their role may change. */
export const PATCH: RequestHandler = async ({ params, request }) => {
	const { place, finding } = await requireFinding(params, 'view');
	const patch = await readJson(request, findingPatch);
	const asker = { user: place.user, role: place.membership.role };
	const outcome = await changeFinding(db, asker, place, finding, patch);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.finding);
};
