import { fail, redirect } from '@sveltejs/kit';
import { resetInput } from '$lib/schemas/auth';
import { db } from '$lib/server/db';
import { consumeUserToken } from '$lib/server/db/queries/tokens';
import { proveEmail } from '$lib/server/db/queries/users';
import { parseForm } from '$lib/server/forms';
import { hashPassword } from '$lib/server/passwords';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => ({
	token: url.searchParams.get('token') ?? ''
});

export const actions: Actions = {
	default: async ({ request }) => {
		const form = await parseForm(request, resetInput, ['token']);
		if (!form.ok) return form.failure;
		const used = await consumeUserToken(db, form.data.token, 'reset-password');
		if (!used.ok) {
			return fail(400, {
				values: form.values,
				message:
					used.reason === 'expired'
						? 'That link has expired. Ask for a new one.'
						: 'That link is not valid or was already used. Ask for a new one.'
			});
		}
		// The link proves the address: the new password replaces any other, and every session and
		// API token from before ends.
		await proveEmail(db, used.userId, { passwordHash: await hashPassword(form.data.password) });
		redirect(303, '/signin?reset=1');
	}
};
