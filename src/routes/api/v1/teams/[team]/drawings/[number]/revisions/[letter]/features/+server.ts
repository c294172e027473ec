import { json } from '@sveltejs/kit';
import { featureInput } from '$lib/schemas/features';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { addFeature, featuresOf } from '$lib/server/features';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	return json(await featuresOf(db, place));
};

export const POST: RequestHandler = async ({ params, request }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'editFeatures');
	const input = await readJson(request, featureInput);
	const outcome = await addFeature(db, place.user, place, input);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.feature, { status: 201 });
};
