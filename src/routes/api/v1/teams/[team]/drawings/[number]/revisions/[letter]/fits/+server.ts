import { json } from '@sveltejs/kit';
import { fitCreate } from '$lib/schemas/fits';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { addFit, fitsOf } from '$lib/server/fits';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	return json(await fitsOf(db, place));
};

export const POST: RequestHandler = async ({ params, request }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'editFeatures');
	const input = await readJson(request, fitCreate);
	const outcome = await addFit(db, place.user, place, input);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.fit, { status: 201 });
};
