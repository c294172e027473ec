import { json } from '@sveltejs/kit';
import { findingInput, findingQuery } from '$lib/schemas/findings';
import { refuse } from '$lib/server/api';
import { readJson, readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { findingsOf, raiseFinding } from '$lib/server/findings';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params, url }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const query = readQuery(url, findingQuery);
	return json(await findingsOf(db, place, query));
};

export const POST: RequestHandler = async ({ params, request }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'raiseFindings');
	const input = await readJson(request, findingInput);
	const outcome = await raiseFinding(db, place.user, place, input);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.finding, { status: 201 });
};
