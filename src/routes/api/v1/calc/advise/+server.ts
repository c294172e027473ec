import { json } from '@sveltejs/kit';
import { calcAdvise, readJson } from '$lib/calc-api';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) =>
	json(calcAdvise(await readJson(request)));
