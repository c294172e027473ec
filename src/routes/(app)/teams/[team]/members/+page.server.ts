import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { memberInput, roleInput, teamSettingsInput } from '$lib/schemas/teams';
import { db } from '$lib/server/db';
import {
	approveInvitation,
	listOpenInvitations,
	revokeInvitation
} from '$lib/server/db/queries/invitations';
import {
	changeRole,
	LastAdmin,
	listMembers,
	removeMember,
	updateTeamSettings
} from '$lib/server/db/queries/teams';
import { parseForm, tooManyAttempts } from '$lib/server/forms';
import { requireMember } from '$lib/server/guards';
import { invite } from '$lib/server/teams';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { team } = await requireMember(params.team, 'manageTeam');
	return {
		members: await listMembers(db, team.id),
		invitations: await listOpenInvitations(db, team.id),
		allowSelfApproval: team.allowSelfApproval
	};
};

const userIdInput = z.object({ userId: z.uuid() });

async function guarded<T>(work: () => Promise<T>) {
	try {
		return await work();
	} catch (err) {
		if (err instanceof LastAdmin) return fail(409, { message: err.message });
		throw err;
	}
}

export const actions: Actions = {
	invite: async (event) => {
		const { user, team } = await requireMember(event.params.team, 'manageTeam');
		const form = await parseForm(event.request, memberInput, ['email', 'role']);
		if (!form.ok) return form.failure;
		const outcome = await invite(db, user, team, form.data, event.url.origin);
		if (!outcome.ok)
			return tooManyAttempts(event, outcome.retryAfter, form.values, 'Too many invitations sent.');
		return { notice: `Invitation sent to ${form.data.email}.` };
	},
	role: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = await parseForm(request, roleInput.extend(userIdInput.shape));
		if (!form.ok) return form.failure;
		return guarded(async () => {
			await changeRole(db, user, team.id, form.data.userId, form.data.role);
			return { notice: 'Role changed.' };
		});
	},
	remove: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = await parseForm(request, userIdInput);
		if (!form.ok) return form.failure;
		return guarded(async () => {
			await removeMember(db, user, team.id, form.data.userId);
			return { notice: 'Member removed.' };
		});
	},
	revoke: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = await parseForm(request, z.object({ id: z.uuid() }));
		if (!form.ok) return form.failure;
		await revokeInvitation(db, user, team.id, form.data.id);
		return { notice: 'Invitation withdrawn.' };
	},
	/** Lets the account that asked join on an invitation sent to another address. */
	approve: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = await parseForm(request, z.object({ id: z.uuid() }));
		if (!form.ok) return form.failure;
		const approved = await approveInvitation(db, user, team.id, form.data.id);
		if (!approved) return fail(410, { message: 'That invitation is no longer open.' });
		return { notice: 'Approved: they are a member now.' };
	},
	settings: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = await parseForm(request, teamSettingsInput);
		if (!form.ok) return form.failure;
		await updateTeamSettings(db, user, team.id, {
			allowSelfApproval: form.data.allowSelfApproval ?? false
		});
		return { notice: 'Settings saved.' };
	}
};
