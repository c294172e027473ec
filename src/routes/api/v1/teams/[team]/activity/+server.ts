import { json } from '@sveltejs/kit';
import { activityQuery } from '$lib/schemas/teams';
import { readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { listTeamActivity } from '$lib/server/db/queries/activity';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params, url }) => {
	const { team } = await requireMember(params.team, 'viewUnreleased');
	const { before, limit } = readQuery(url, activityQuery);
	return json(await listTeamActivity(db, team.id, { before, limit }));
};
