import { fail, redirect } from '@sveltejs/kit';
import { signInLinkInput, signInInput } from '$lib/schemas/auth';
import { attemptKeys, signInWith } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { isRateLimited, recordAttempt } from '$lib/server/db/queries/attempts';
import { parseForm } from '$lib/server/forms';
import { safeRedirect } from '$lib/server/redirects';
import type { Actions, PageServerLoad } from './$types';

const messages = {
	invalid: 'That e-mail address and password do not match an account.',
	rate_limited: 'Too many attempts. Wait a few minutes, then try again.',
	unverified:
		'Confirm your e-mail address first: use the link we sent you (sign up again to get a new one).'
};

export const load: PageServerLoad = async ({ locals, url }) => {
	if (locals.user) redirect(303, safeRedirect(url.searchParams.get('redirectTo'), url.origin));
	return {
		sent: url.searchParams.has('sent'),
		linkFailed: url.searchParams.has('error'),
		reset: url.searchParams.has('reset'),
		verified: url.searchParams.get('verified')
	};
};

export const actions: Actions = {
	password: async (event) => {
		const form = await parseForm(event.request, signInInput, ['email']);
		if (!form.ok) return form.failure;
		const outcome = await signInWith(event, 'credentials', form.data);
		if (!outcome.ok) {
			const status = outcome.code === 'rate_limited' ? 429 : 401;
			return fail(status, { values: form.values, message: messages[outcome.code] });
		}
		redirect(303, safeRedirect(event.url.searchParams.get('redirectTo'), event.url.origin));
	},
	link: async (event) => {
		const form = await parseForm(event.request, signInLinkInput, ['email']);
		if (!form.ok) return form.failure;
		const keys = [attemptKeys(form.data.email, event.getClientAddress())[1]];
		if (await isRateLimited(db, 'reset', keys)) {
			return fail(429, { values: form.values, message: messages.rate_limited });
		}
		await recordAttempt(db, 'reset', keys);
		await signInWith(event, 'nodemailer', { email: form.data.email });
		redirect(303, '/signin?sent=1');
	}
};
