import { redirect } from '@sveltejs/kit';
import { signUpInput } from '$lib/schemas/auth';
import { signUp } from '$lib/server/accounts';
import { db } from '$lib/server/db';
import { parseForm } from '$lib/server/forms';
import { nudgeOutbox } from '$lib/server/mail/worker';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	if (locals.user) redirect(303, '/');
	return { sent: url.searchParams.has('sent') };
};

export const actions: Actions = {
	default: async ({ request, url }) => {
		const form = await parseForm(request, signUpInput, ['name', 'email']);
		if (!form.ok) return form.failure;
		await signUp(db, form.data, url.origin);
		nudgeOutbox();
		redirect(303, '/signup?sent=1');
	}
};
