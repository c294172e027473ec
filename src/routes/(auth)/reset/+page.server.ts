import { redirect } from '@sveltejs/kit';
import { resetRequestInput } from '$lib/schemas/auth';
import { requestPasswordReset } from '$lib/server/accounts';
import { attemptKeys } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { isRateLimited, recordAttempt } from '$lib/server/db/queries/attempts';
import { parseForm } from '$lib/server/forms';
import { nudgeOutbox } from '$lib/server/mail/worker';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => ({ sent: url.searchParams.has('sent') });

export const actions: Actions = {
	default: async (event) => {
		const form = await parseForm(event.request, resetRequestInput, ['email']);
		if (!form.ok) return form.failure;
		const keys = attemptKeys(form.data.email, event.getClientAddress());
		// Over the limit the page answers as usual and simply sends nothing.
		if (!(await isRateLimited(db, 'reset', keys))) {
			await recordAttempt(db, 'reset', keys);
			await requestPasswordReset(db, form.data.email, event.url.origin);
			nudgeOutbox();
		}
		redirect(303, '/reset?sent=1');
	}
};
