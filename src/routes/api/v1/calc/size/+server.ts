import { json } from '@sveltejs/kit';
import { calcSize, readJson } from '$lib/calc-api';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = ({ url }) =>
	json(calcSize(Object.fromEntries(url.searchParams), 'query'));

export const POST: RequestHandler = async ({ request }) =>
	json(calcSize(await readJson(request), 'body'));
