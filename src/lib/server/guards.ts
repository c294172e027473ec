import { error, redirect } from '@sveltejs/kit';
import { getRequestEvent } from '$app/server';
import type { CurrentUser } from './auth';
import { can, roleLabels, type Capability } from './capabilities';
import { db } from './db';
import { getMembership, getTeamBySlug } from './db/queries/teams';

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

/**
 * The one guard for team objects: the asker must be a member (anyone else gets 404, so other
 * teams' objects do not even show they exist) whose role has the capability (else 403).
 */
export async function requireMember(teamSlug: string, capability: Capability) {
	const user = requireUser();
	const team = await getTeamBySlug(db, teamSlug);
	const membership = team ? await getMembership(db, team.id, user.id) : null;
	if (!team || !membership) error(404, { message: 'Not found', code: 'not_found' });
	if (!can(membership.role, capability)) {
		error(403, {
			message: `Your role in ${team.name} (${roleLabels[membership.role]}) does not allow this`,
			code: 'forbidden'
		});
	}
	return { user, team, membership };
}
