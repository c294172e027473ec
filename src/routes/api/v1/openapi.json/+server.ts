import { json } from '@sveltejs/kit';
import { openApiDocument } from '$lib/server/openapi';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ url }) => json(openApiDocument(url.origin));
