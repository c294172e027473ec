import { error, json } from '@sveltejs/kit';
import { teamPatch } from '$lib/schemas/teams';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { getTeamBySlug, updateTeamSettings } from '$lib/server/db/queries/teams';
import { requireMember } from '$lib/server/guards';
import { teamSettingsOf } from '$lib/server/teams';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { team } = await requireMember(params.team, 'view');
	return json(teamSettingsOf(team));
};

/**
 * The team's settings: self-approval, the rulebook's severities for the team and the capability
 * grade LIM-06 reads. The team's revisions that are not frozen are re-checked at once.
 */
export const PATCH: RequestHandler = async ({ params, request }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const { version, ...changes } = await readJson(request, teamPatch);
	const updated = await updateTeamSettings(db, user, team.id, changes, version);
	if (!updated) {
		error(409, {
			message: 'Someone changed the team settings since you loaded them: yours were not applied.',
			code: 'stale',
			current: teamSettingsOf((await getTeamBySlug(db, team.slug))!)
		});
	}
	return json(teamSettingsOf(updated));
};
