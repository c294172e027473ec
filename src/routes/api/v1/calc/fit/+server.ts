import { json } from '@sveltejs/kit';
import { calcFit, readJson } from '$lib/calc-api';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => json(calcFit(await readJson(request)));
