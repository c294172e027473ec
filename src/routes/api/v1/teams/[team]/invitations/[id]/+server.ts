import { error } from '@sveltejs/kit';
import { isUuid } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { revokeInvitation } from '$lib/server/db/queries/invitations';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const DELETE: RequestHandler = async ({ params }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const ok = isUuid(params.id) && (await revokeInvitation(db, user, team.id, params.id));
	if (!ok) error(404, { message: 'No such open invitation', code: 'not_found' });
	return new Response(null, { status: 204 });
};
