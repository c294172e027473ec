import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async () => {
	const user = requireUser();
	return json({ id: user.id, name: user.name, email: user.email });
};
