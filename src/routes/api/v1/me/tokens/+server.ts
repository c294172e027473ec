import { error, json } from '@sveltejs/kit';
import { apiTokenInput } from '$lib/schemas/teams';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { createApiToken, listApiTokens } from '$lib/server/db/queries/api-tokens';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async () => {
	const user = requireUser();
	return json(await listApiTokens(db, user.id));
};

/** The token itself is in this answer only; Checkplate keeps a hash. */
export const POST: RequestHandler = async ({ request, locals }) => {
	const user = requireUser();
	// A leaked token must not be able to mint tokens that outlive its own revocation.
	if (locals.viaApiToken) {
		error(403, {
			message: 'An API token cannot create tokens: sign in and create one on your account page.',
			code: 'forbidden'
		});
	}
	const input = await readJson(request, apiTokenInput);
	const expiresAt = new Date(Date.now() + input.expiresInDays * 86_400_000);
	const { token, row } = await createApiToken(db, user, { name: input.name, expiresAt });
	return json({ id: row.id, name: row.name, expiresAt: row.expiresAt, token }, { status: 201 });
};
