import { json } from '@sveltejs/kit';
import { memberInput } from '$lib/schemas/teams';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { listMembers } from '$lib/server/db/queries/teams';
import { requireMember } from '$lib/server/guards';
import { addOrInvite } from '$lib/server/teams';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { team } = await requireMember(params.team, 'view');
	return json(await listMembers(db, team.id));
};

/** `{email, role}`: adds someone with an account (201), or invites them by e-mail (202). */
export const POST: RequestHandler = async ({ params, request, url }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const input = await readJson(request, memberInput);
	const result = await addOrInvite(db, user, team, input, url.origin);
	return json(result, { status: result.kind === 'member' ? 201 : 202 });
};
