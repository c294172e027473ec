import { activityQuery } from '$lib/schemas/teams';
import { readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { listTeamActivity } from '$lib/server/db/queries/activity';
import { requireMember } from '$lib/server/guards';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, url }) => {
	const { team } = await requireMember(params.team, 'viewUnreleased');
	const { before } = readQuery(url, activityQuery.pick({ before: true }));
	return { entries: await listTeamActivity(db, team.id, { before, limit: 100 }) };
};
