import { json } from '@sveltejs/kit';
import { calcSize } from '$lib/calc-api';
import { readJson } from '$lib/server/api-input';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ url }) =>
	json(calcSize(Object.fromEntries(url.searchParams), 'query'));

export const POST: RequestHandler = async ({ request }) =>
	json(calcSize(await readJson(request), 'body'));
