import { error } from '@sveltejs/kit';
import { isUuid } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { revokeApiToken } from '$lib/server/db/queries/api-tokens';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const DELETE: RequestHandler = async ({ params }) => {
	const user = requireUser();
	const ok = isUuid(params.id) && (await revokeApiToken(db, user, params.id));
	if (!ok) error(404, { message: 'No such token', code: 'not_found' });
	return new Response(null, { status: 204 });
};
