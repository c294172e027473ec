import { fail, redirect } from '@sveltejs/kit';
import { signInLinkInput, signInInput } from '$lib/schemas/auth';
import { signInWith, spendSignInLink } from '$lib/server/auth';
import { parseForm, tooManyAttempts } from '$lib/server/forms';
import { safeRedirect } from '$lib/server/redirects';
import type { Actions, PageServerLoad } from './$types';

const messages = {
	invalid: 'That e-mail address and password do not match an account.',
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
		if (outcome.ok === false && outcome.code === 'rate_limited') {
			const what = 'Too many attempts on this account or from your network.';
			const link = 'An e-mailed sign-in link works meanwhile.';
			return tooManyAttempts(event, outcome.retryAfter, form.values, `${what} ${link}`);
		}
		if (!outcome.ok) return fail(401, { values: form.values, message: messages[outcome.code] });
		redirect(303, safeRedirect(event.url.searchParams.get('redirectTo'), event.url.origin));
	},
	link: async (event) => {
		const form = await parseForm(event.request, signInLinkInput, ['email']);
		if (!form.ok) return form.failure;
		const wait = await spendSignInLink(form.data.email, event.getClientAddress());
		if (wait > 0)
			return tooManyAttempts(event, wait, form.values, 'Too many sign-in links asked for.');
		await signInWith(event, 'nodemailer', { email: form.data.email });
		redirect(303, '/signin?sent=1');
	}
};
