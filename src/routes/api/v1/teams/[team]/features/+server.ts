import { json } from '@sveltejs/kit';
import { featureSearchQuery } from '$lib/schemas/features';
import { readQuery } from '$lib/server/api-input';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import { searchFeatures } from '$lib/server/db/queries/features';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

/** Features of any drawing of the team, found by drawing number, label, callout or balloon. */
export const GET: RequestHandler = async ({ params, url }) => {
	const { team, membership } = await requireMember(params.team, 'view');
	const search = readQuery(url, featureSearchQuery);
	const releasedOnly = !can(membership.role, 'viewUnreleased');
	return json(await searchFeatures(db, team.id, { ...search, releasedOnly }));
};
