import { json } from '@sveltejs/kit';
import { deleteQuery, featurePatch } from '$lib/schemas/features';
import { refuse } from '$lib/server/api';
import { readJson, readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { requireFeature } from '$lib/server/drawings';
import { editFeature, featureOf, removeFeature } from '$lib/server/features';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { place, feature } = await requireFeature(params, 'view');
	return json(await featureOf(db, place, feature));
};

export const PATCH: RequestHandler = async ({ params, request }) => {
	const { place, feature } = await requireFeature(params, 'editFeatures');
	const patch = await readJson(request, featurePatch);
	const outcome = await editFeature(db, place.user, place, feature, patch);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.feature);
};

export const DELETE: RequestHandler = async ({ params, url }) => {
	const { place, feature } = await requireFeature(params, 'editFeatures');
	const { version } = readQuery(url, deleteQuery);
	const outcome = await removeFeature(db, place.user, place, feature, version);
	if (!outcome.ok) refuse(outcome);
	return new Response(null, { status: 204 });
};
