import { z } from 'zod';
import { apiTokenInput } from '$lib/schemas/teams';
import { db } from '$lib/server/db';
import { createApiToken, listApiTokens, revokeApiToken } from '$lib/server/db/queries/api-tokens';
import { parseForm } from '$lib/server/forms';
import { requireUser } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const user = requireUser();
	return { tokens: await listApiTokens(db, user.id) };
};

export const actions: Actions = {
	create: async ({ request }) => {
		const user = requireUser();
		const form = await parseForm(request, apiTokenInput, ['name']);
		if (!form.ok) return form.failure;
		const expiresAt = new Date(Date.now() + form.data.expiresInDays * 86_400_000);
		const { token, row } = await createApiToken(db, user, { name: form.data.name, expiresAt });
		return { created: { name: row.name, token } };
	},
	revoke: async ({ request }) => {
		const user = requireUser();
		const form = await parseForm(request, z.object({ id: z.uuid() }));
		if (!form.ok) return form.failure;
		await revokeApiToken(db, user, form.data.id);
		return { revoked: true };
	}
};
