import { error } from '@sveltejs/kit';
import { config } from '$lib/server/config';
import { listCaughtMail } from '$lib/server/mail/caught';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const directory = config.mailFakeDir;
	// Only while the local mail fake is in use (with a real SMTP server there is nothing to show)
	// and only while nobody beyond this machine can ask: the mail holds sign-in and reset links.
	if (!directory || !config.listensOnLoopbackOnly) error(404, 'Not found');
	return { messages: await listCaughtMail(directory) };
};
