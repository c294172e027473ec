import { redirect } from '@sveltejs/kit';
import { resetRequestInput } from '$lib/schemas/auth';
import { requestPasswordReset } from '$lib/server/accounts';
import { attemptKeys } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { spendAttempt } from '$lib/server/db/queries/attempts';
import { parseForm, tooManyAttempts } from '$lib/server/forms';
import { nudgeOutbox } from '$lib/server/mail/worker';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => ({ sent: url.searchParams.has('sent') });

export const actions: Actions = {
	default: async (event) => {
		const form = await parseForm(event.request, resetRequestInput, ['email']);
		if (!form.ok) return form.failure;
		const keys = attemptKeys(form.data.email, event.getClientAddress());
		// Counted per address asked for whether it has an account or not: the answer tells nothing.
		const wait = await spendAttempt(db, 'reset', keys);
		if (wait > 0)
			return tooManyAttempts(event, wait, form.values, 'Too many reset links asked for.');
		await requestPasswordReset(db, form.data.email, event.url.origin);
		nudgeOutbox();
		redirect(303, '/reset?sent=1');
	}
};
