import { error, redirect } from '@sveltejs/kit';
import { getRequestEvent } from '$app/server';
import type { CurrentUser } from './auth';

const isApi = (pathname: string) => pathname.startsWith('/api/');

/** The signed-in user; pages send the signed-out to sign-in, the API answers 401. */
export function requireUser(): CurrentUser {
	const event = getRequestEvent();
	const user = event.locals.user;
	if (user) return user;
	if (isApi(event.url.pathname) || event.request.method !== 'GET') {
		error(401, { message: 'Sign in first', code: 'unauthenticated' });
	}
	redirect(303, `/signin?redirectTo=${encodeURIComponent(event.url.pathname + event.url.search)}`);
}
