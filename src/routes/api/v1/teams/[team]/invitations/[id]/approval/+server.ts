import { error } from '@sveltejs/kit';
import { isUuid } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { approveInvitation } from '$lib/server/db/queries/invitations';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

/** Lets the account waiting on an open invitation (`waitingFor`) join with the invited role. */
export const POST: RequestHandler = async ({ params }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const ok = isUuid(params.id) && (await approveInvitation(db, user, team.id, params.id));
	if (!ok) {
		error(404, {
			message: 'No open invitation with an account waiting for approval',
			code: 'not_found'
		});
	}
	return new Response(null, { status: 204 });
};
