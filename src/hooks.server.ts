import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { env } from '$env/dynamic/private';
import { apiErrors } from '$lib/server/api';
import { authHandle, userFromSession } from '$lib/server/auth';
import { config } from '$lib/server/config';
import { startDatabase } from '$lib/server/db';
import { demoPassword, demoPeople, seedDemo } from '$lib/server/demo/seed';
import { startOutboxWorker } from '$lib/server/mail/worker';

export const init: ServerInit = async () => {
	const database = await startDatabase();
	await database.migrate();
	if (env.SEED_DEMO !== '0') {
		const password = demoPassword(config.dataDir, env.DEMO_PASSWORD);
		await seedDemo(database.db, password);
		console.log(
			`[checkplate] demo users ${demoPeople.map((p) => p.email).join(', ')} — password: ${password}`
		);
	}
	startOutboxWorker();
};

const securityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('Referrer-Policy', 'same-origin');
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('X-Frame-Options', 'DENY');
	return response;
};

const currentUser: Handle = async ({ event, resolve }) => {
	event.locals.user = await userFromSession(event);
	return resolve(event);
};

export const handle = sequence(securityHeaders, apiErrors, authHandle, currentUser);

export const handleError: HandleServerError = ({ error, event, status }) => {
	const errorId = crypto.randomUUID();
	if (status !== 404) {
		console.error(`[${errorId}] ${event.request.method} ${event.url.pathname}`, error);
	}
	return { message: status === 404 ? 'Not found' : 'Something went wrong on our side', errorId };
};
