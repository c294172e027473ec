import { redirect } from '@sveltejs/kit';
import { changePasswordInput } from '$lib/schemas/auth';
import { attemptKeys, signInWith, signOutHere } from '$lib/server/auth';
import { attemptWait, recordAttempt } from '$lib/server/db/queries/attempts';
import { db } from '$lib/server/db';
import {
	endAllSessions,
	endSessions,
	getUserById,
	setPassword
} from '$lib/server/db/queries/users';
import { parseForm, refuseForm, tryAgainIn } from '$lib/server/forms';
import { requireUser } from '$lib/server/guards';
import { hashPassword, verifyPassword } from '$lib/server/passwords';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const user = requireUser();
	return { account: user };
};

export const actions: Actions = {
	password: async (event) => {
		const user = requireUser();
		const form = await parseForm(event.request, changePasswordInput);
		if (!form.ok) return form.failure;
		// A wrong current password is a sign-in guess: it counts against the same limit.
		const keys = attemptKeys(user.email, event.getClientAddress());
		const wait = await attemptWait(db, 'sign-in', keys);
		if (wait > 0) {
			event.setHeaders({ 'retry-after': String(wait) });
			return refuseForm(429, { currentPassword: [`Too many attempts. ${tryAgainIn(wait)}`] }, {});
		}
		const row = await getUserById(db, user.id);
		if (!(await verifyPassword(form.data.currentPassword, row?.passwordHash))) {
			await recordAttempt(db, 'sign-in', keys);
			return refuseForm(400, { currentPassword: ['That is not your current password'] }, {});
		}
		// Other devices are signed out; this one signs in again with the new password.
		await setPassword(db, user.id, await hashPassword(form.data.password));
		await signInWith(event, 'credentials', { email: user.email, password: form.data.password });
		return { changed: true };
	},
	everywhere: async (event) => {
		const user = requireUser();
		await endAllSessions(db, user.id);
		signOutHere(event);
		redirect(303, '/signin');
	},
	signout: async (event) => {
		// The session token is a signed cookie: only a new generation makes a copy of it useless.
		if (event.locals.user) await endSessions(db, event.locals.user.id);
		signOutHere(event);
		redirect(303, '/signin');
	}
};
