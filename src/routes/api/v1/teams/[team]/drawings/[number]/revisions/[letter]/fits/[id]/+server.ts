import { json } from '@sveltejs/kit';
import { deleteQuery } from '$lib/schemas/features';
import { fitPatch } from '$lib/schemas/fits';
import { refuse } from '$lib/server/api';
import { readJson, readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { notFound, requireFit } from '$lib/server/drawings';
import { editFit, removeFit, visibleFitOf } from '$lib/server/fits';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { place, fit } = await requireFit(params, 'view');
	const answer = await visibleFitOf(db, place, fit);
	if (!answer) notFound();
	return json(answer);
};

export const PATCH: RequestHandler = async ({ params, request }) => {
	const { place, fit } = await requireFit(params, 'editFeatures');
	const patch = await readJson(request, fitPatch);
	const outcome = await editFit(db, place.user, place, fit, patch);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.fit);
};

export const DELETE: RequestHandler = async ({ params, url }) => {
	const { place, fit } = await requireFit(params, 'editFeatures');
	const { version } = readQuery(url, deleteQuery);
	const outcome = await removeFit(db, place.user, place, fit, version);
	if (!outcome.ok) refuse(outcome);
	return new Response(null, { status: 204 });
};
