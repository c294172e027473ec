import { error, json } from '@sveltejs/kit';
import { teamInput } from '$lib/schemas/teams';
import { readJson } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { createTeam, listTeamsOf, SlugTaken } from '$lib/server/db/queries/teams';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async () => {
	const user = requireUser();
	return json(await listTeamsOf(db, user.id));
};

export const POST: RequestHandler = async ({ request }) => {
	const user = requireUser();
	const input = await readJson(request, teamInput);
	try {
		const team = await createTeam(db, user, input);
		return json({ id: team.id, slug: team.slug, name: team.name, role: 'admin' }, { status: 201 });
	} catch (err) {
		if (err instanceof SlugTaken) error(409, { message: err.message, code: 'slug_taken' });
		throw err;
	}
};
