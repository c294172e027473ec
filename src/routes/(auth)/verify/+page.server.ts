import { fail, redirect } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { confirmAddress } from '$lib/server/accounts';
import { peekUserToken } from '$lib/server/db/queries/tokens';
import type { Actions, PageServerLoad } from './$types';

/**
 * Opening the link only shows a button: mail scanners fetch links before the reader does, and
 * a GET that used the token up would leave the reader with a dead link. The button confirms.
 */
export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const result = token ? await peekUserToken(db, token, 'verify-email') : null;
	if (result?.ok) return { token, reason: null };
	return { token: null, reason: result?.reason ?? 'invalid' };
};

export const actions: Actions = {
	default: async ({ request }) => {
		const token = (await request.formData()).get('token');
		const result = typeof token === 'string' && token ? await confirmAddress(db, token) : null;
		if (!result?.ok) return fail(400, { reason: result?.reason ?? 'invalid' });
		redirect(303, '/signin?verified=1');
	}
};
