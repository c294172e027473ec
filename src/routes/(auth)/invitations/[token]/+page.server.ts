import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { newPassword } from '$lib/schemas/auth';
import { joinByInvitation } from '$lib/server/accounts';
import { signInWith } from '$lib/server/auth';
import { db } from '$lib/server/db';
import { acceptInvitation, findInvitation } from '$lib/server/db/queries/invitations';
import { getUserByEmail } from '$lib/server/db/queries/users';
import { parseForm } from '$lib/server/forms';
import { hashPassword } from '$lib/server/passwords';
import type { Actions, PageServerLoad } from './$types';

const gone = 'This invitation can no longer be used.';
const hasAccount = 'An account with this address exists: sign in to accept.';

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
		signedInAs: locals.user?.email ?? null,
		waiting: Boolean(locals.user && invitation.requestedBy === locals.user.id)
	};
};

export const actions: Actions = {
	/**
	 * A signed-in user accepts for their own account: at once when the invitation is for their
	 * address; for another address it waits for an admin of the team to approve.
	 */
	accept: async ({ params, locals }) => {
		if (!locals.user) redirect(303, `/signin?redirectTo=/invitations/${params.token}`);
		const result = await acceptInvitation(db, params.token, locals.user);
		if (!result.ok && result.reason === 'approval') {
			return { waiting: true };
		}
		if (!result.ok) return fail(410, { message: gone });
		redirect(303, `/teams/${result.teamSlug}`);
	},
	/** Someone new signs up from the link: holding it proves the address, so no second mail. */
	join: async (event) => {
		const found = await findInvitation(db, event.params.token);
		if (!found.ok) return fail(410, { message: gone });
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
		const result = await joinByInvitation(db, event.params.token, {
			name: form.data.name,
			passwordHash
		});
		if (!result.ok)
			return fail(result.reason === 'has_account' ? 409 : 410, {
				message: result.reason === 'has_account' ? hasAccount : gone
			});
		await signInWith(event, 'credentials', { email: result.email, password: form.data.password });
		redirect(303, `/teams/${result.teamSlug}`);
	}
};
