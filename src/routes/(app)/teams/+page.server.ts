import { redirect } from '@sveltejs/kit';
import { teamInput } from '$lib/schemas/teams';
import { db } from '$lib/server/db';
import { createTeam, listTeamsOf, SlugTaken } from '$lib/server/db/queries/teams';
import { parseForm, refuseForm } from '$lib/server/forms';
import { requireUser } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const user = requireUser();
	return { teams: await listTeamsOf(db, user.id) };
};

export const actions: Actions = {
	create: async ({ request }) => {
		const user = requireUser();
		const form = await parseForm(request, teamInput, ['name', 'slug']);
		if (!form.ok) return form.failure;
		try {
			const team = await createTeam(db, user, form.data);
			redirect(303, `/teams/${team.slug}`);
		} catch (err) {
			if (!(err instanceof SlugTaken)) throw err;
			return refuseForm(409, { slug: ['That address is taken'] }, form.values);
		}
	}
};
