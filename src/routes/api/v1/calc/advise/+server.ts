import { json } from '@sveltejs/kit';
import { calcAdvise } from '$lib/calc-api';
import { readJson } from '$lib/server/api-input';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) =>
	json(calcAdvise(await readJson(request)));
