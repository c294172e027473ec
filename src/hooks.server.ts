import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { startDatabase } from '$lib/server/db';

export const init: ServerInit = async () => {
	const database = await startDatabase();
	await database.migrate();
};

const securityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('Referrer-Policy', 'same-origin');
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('X-Frame-Options', 'DENY');
	return response;
};

export const handle = sequence(securityHeaders);

export const handleError: HandleServerError = ({ error, event, status }) => {
	const errorId = crypto.randomUUID();
	if (status !== 404)
		console.error(`[${errorId}] ${event.request.method} ${event.url.pathname}`, error);
	return { message: status === 404 ? 'Not found' : 'Something went wrong on our side', errorId };
};
