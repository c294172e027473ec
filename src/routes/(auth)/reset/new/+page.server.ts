import { fail, redirect } from '@sveltejs/kit';
import { resetInput } from '$lib/schemas/auth';
import { db } from '$lib/server/db';
import { resetPassword } from '$lib/server/accounts';
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
		// The link proves the address: the new password replaces any other, and every session and
		// API token from before ends (one transaction with using the link).
		const passwordHash = await hashPassword(form.data.password);
		const used = await resetPassword(db, form.data.token, passwordHash);
		if (!used.ok) {
			return fail(400, {
				values: form.values,
				message:
					used.reason === 'expired'
						? 'That link has expired. Ask for a new one.'
						: 'That link is not valid or was already used. Ask for a new one.'
			});
		}
		redirect(303, '/signin?reset=1');
	}
};
