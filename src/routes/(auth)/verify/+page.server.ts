import { redirect } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { consumeUserToken } from '$lib/server/db/queries/tokens';
import { proveEmail } from '$lib/server/db/queries/users';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const result = token ? await consumeUserToken(db, token, 'verify-email') : null;
	if (result?.ok) {
		// The newest sign-up's password stays (older links ended); sessions and tokens end.
		await proveEmail(db, result.userId);
		redirect(303, '/signin?verified=1');
	}
	return { reason: result?.reason ?? 'invalid' };
};
