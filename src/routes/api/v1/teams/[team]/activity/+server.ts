import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { listTeamActivity } from '$lib/server/db/queries/activity';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params, url }) => {
	const { team } = await requireMember(params.team, 'viewUnreleased');
	const before = Number(url.searchParams.get('before')) || undefined;
	const limit = Number(url.searchParams.get('limit')) || undefined;
	return json(await listTeamActivity(db, team.id, { before, limit }));
};
