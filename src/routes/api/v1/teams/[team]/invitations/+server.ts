import { json } from '@sveltejs/kit';
import { memberInput } from '$lib/schemas/teams';
import { refuse } from '$lib/server/api';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { listOpenInvitations } from '$lib/server/db/queries/invitations';
import { requireMember } from '$lib/server/guards';
import { invite } from '$lib/server/teams';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { team } = await requireMember(params.team, 'manageTeam');
	return json(await listOpenInvitations(db, team.id));
};

export const POST: RequestHandler = async ({ params, request, url }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const input = await readJson(request, memberInput);
	const outcome = await invite(db, user, team, input, url.origin);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.invitation, { status: 201 });
};
