import { json } from '@sveltejs/kit';
import { memberInput } from '$lib/schemas/teams';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { listMembers } from '$lib/server/db/queries/teams';
import { requireMember } from '$lib/server/guards';
import { invite } from '$lib/server/teams';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { team } = await requireMember(params.team, 'view');
	return json(await listMembers(db, team.id));
};

/** `{email, role}`: always an invitation to accept (202), whether the address has an account or not. */
export const POST: RequestHandler = async ({ params, request, url }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const input = await readJson(request, memberInput);
	const outcome = await invite(db, user, team, input, url.origin);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.invitation, { status: 202 });
};
