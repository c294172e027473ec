import { error } from '@sveltejs/kit';
import { config } from '$lib/server/config';
import { listCaughtMail } from '$lib/server/mail/caught';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const directory = config.mailFakeDir;
	// Only while the local mail fake is in use: with a real SMTP server there is nothing to show.
	if (!directory) error(404, 'Not found');
	return { messages: await listCaughtMail(directory) };
};
