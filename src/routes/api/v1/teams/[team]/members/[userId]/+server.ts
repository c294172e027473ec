import { error, json } from '@sveltejs/kit';
import { roleInput } from '$lib/schemas/teams';
import { isUuid, readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { changeRole, LastAdmin, removeMember } from '$lib/server/db/queries/teams';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = async ({ params, request }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	const { role } = await readJson(request, roleInput);
	try {
		const updated = isUuid(params.userId)
			? await changeRole(db, user, team.id, params.userId, role)
			: null;
		if (!updated) error(404, { message: 'No such member', code: 'not_found' });
		return json({ userId: updated.userId, role: updated.role });
	} catch (err) {
		if (err instanceof LastAdmin) error(409, { message: err.message, code: 'last_admin' });
		throw err;
	}
};

export const DELETE: RequestHandler = async ({ params }) => {
	const { user, team } = await requireMember(params.team, 'manageTeam');
	try {
		const removed = isUuid(params.userId)
			? await removeMember(db, user, team.id, params.userId)
			: false;
		if (!removed) error(404, { message: 'No such member', code: 'not_found' });
		return new Response(null, { status: 204 });
	} catch (err) {
		if (err instanceof LastAdmin) error(409, { message: err.message, code: 'last_admin' });
		throw err;
	}
};
