import { redirect } from '@sveltejs/kit';
import { signUpInput } from '$lib/schemas/auth';
import { signUp } from '$lib/server/accounts';
import { attemptKeys } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { spendAttempt } from '$lib/server/db/queries/attempts';
import { parseForm, tooManyAttempts } from '$lib/server/forms';
import { nudgeOutbox } from '$lib/server/mail/worker';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	if (locals.user) redirect(303, '/');
	return { sent: url.searchParams.has('sent') };
};

export const actions: Actions = {
	default: async (event) => {
		const { request, url } = event;
		const form = await parseForm(request, signUpInput, ['name', 'email']);
		if (!form.ok) return form.failure;
		// Each sign-up mails the address: counted per address and per client, known or not.
		const keys = attemptKeys(form.data.email, event.getClientAddress());
		const wait = await spendAttempt(db, 'sign-up', keys);
		if (wait > 0) return tooManyAttempts(event, wait, form.values, 'Too many sign-ups.');
		await signUp(db, form.data, url.origin);
		nudgeOutbox();
		redirect(303, '/signup?sent=1');
	}
};
