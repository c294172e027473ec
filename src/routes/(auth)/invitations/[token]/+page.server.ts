import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { newPassword } from '$lib/schemas/auth';
import { signInWith } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { acceptInvitation, findInvitation } from '$lib/server/db/queries/invitations';
import { createUser, getUserByEmail, getUserById, proveEmail } from '$lib/server/db/queries/users';
import { parseForm } from '$lib/server/forms';
import { hashPassword } from '$lib/server/passwords';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, locals }) => {
	const found = await findInvitation(db, params.token);
	if (!found.ok) return { state: found.reason };
	const { invitation, teamName } = found;
	// An account nobody has proven the address of yet is joined from the link like a new one.
	const hasAccount = Boolean((await getUserByEmail(db, invitation.email))?.emailVerified);
	return {
		state: 'open' as const,
		teamName,
		email: invitation.email,
		role: invitation.role,
		hasAccount,
		signedInAs: locals.user?.email ?? null
	};
};

export const actions: Actions = {
	/** A signed-in user accepts for their own account. */
	accept: async ({ params, locals }) => {
		if (!locals.user) redirect(303, `/signin?redirectTo=/invitations/${params.token}`);
		const result = await acceptInvitation(db, params.token, locals.user);
		if (!result.ok) return fail(410, { message: 'This invitation can no longer be used.' });
		redirect(303, `/teams/${result.teamSlug}`);
	},
	/** Someone new signs up from the link: holding it proves the address, so no second mail. */
	join: async (event) => {
		const found = await findInvitation(db, event.params.token);
		if (!found.ok) return fail(410, { message: 'This invitation can no longer be used.' });
		const form = await parseForm(
			event.request,
			z.object({
				name: z.string().trim().min(1, { error: 'Enter your name' }).max(120),
				password: newPassword
			}),
			['name']
		);
		if (!form.ok) return form.failure;
		const passwordHash = await hashPassword(form.data.password);
		const pending = await getUserByEmail(db, found.invitation.email);
		if (pending?.emailVerified)
			return fail(409, { message: 'An account with this address exists: sign in to accept.' });
		// An unproven sign-up on this address may be anyone's: the link proves it, so this name and
		// password replace that sign-up's and whatever it held ends.
		if (pending) await proveEmail(db, pending.id, { passwordHash, name: form.data.name });
		const user =
			(pending && (await getUserById(db, pending.id))) ||
			(await createUser(db, {
				name: form.data.name,
				email: found.invitation.email,
				passwordHash,
				emailVerified: new Date()
			}));
		if (!user)
			return fail(409, { message: 'An account with this address exists: sign in to accept.' });
		const result = await acceptInvitation(db, event.params.token, user);
		if (!result.ok) return fail(410, { message: 'This invitation can no longer be used.' });
		await signInWith(event, 'credentials', { email: user.email, password: form.data.password });
		redirect(303, `/teams/${result.teamSlug}`);
	}
};
