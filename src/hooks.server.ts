import { join, resolve } from 'node:path';
import { json, text, type Handle, type HandleServerError, type ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { env } from '$env/dynamic/private';
import { apiErrors } from '$lib/server/api';
import {
	authHandle,
	signInWait,
	spendSignInLink,
	userFromSession,
	type CurrentUser
} from '$lib/server/auth';
import { bodyLimit } from '$lib/server/body-limit';
import { startLive } from '$lib/server/live-events';
import { config } from '$lib/server/config';
import { db, startDatabase } from '$lib/server/db';
import { userForApiToken } from '$lib/server/db/queries/api-tokens';
import { demoPassword, demoPeople, seedsDemo } from '$lib/server/demo/people';
import { startOutboxWorker } from '$lib/server/mail/worker';
import { preparePdfCheck } from '$lib/server/pdf';
import { getStorage } from '$lib/server/services';

/**
 * An unhandled rejection is a bug (every promise on a request's path must be handled), but it
 * must not stop the server for everyone: log it loudly instead of Node's default exit. The app
 * tests fail when this line appears (tests/app/unhandled.ts), so no such bug hides there.
 */
function logUnhandledRejections() {
	const key = Symbol.for('checkplate.unhandledRejection');
	const marked = process as unknown as Record<symbol, boolean>;
	if (marked[key]) return;
	marked[key] = true;
	process.on('unhandledRejection', (reason) => {
		console.error('[checkplate] UNHANDLED REJECTION (a bug: please report it)', reason);
	});
}

export const init: ServerInit = async () => {
	logUnhandledRejections();
	const database = await startDatabase();
	await database.migrate();
	if (seedsDemo(env)) {
		const password = demoPassword(config.dataDir, env.DEMO_PASSWORD);
		// The seed brings the PDF generator and its fonts: load it only when seeding.
		const { seedDemo } = await import('$lib/server/demo/seed');
		await seedDemo(db, password, getStorage(), config.uploadTempDir);
		// Where to read the password, never the password: logs travel further than a data dir.
		const where = env.DEMO_PASSWORD
			? 'the DEMO_PASSWORD setting'
			: join(resolve(config.dataDir), 'demo-password');
		console.log(
			`[checkplate] demo users ${demoPeople.map((p) => p.email).join(', ')} — password in ${where}`
		);
	}
	startOutboxWorker();
	await startLive(database);
	await preparePdfCheck(config.pdfLimits);
};

const securityHeaders: Handle = async ({ event, resolve }) => {
	let response = await resolve(event);
	// A `Response.redirect` (the auth library answers failed sign-ins with one) cannot be changed.
	if (!canSetHeaders(response)) {
		response = new Response(response.body, response);
	}
	response.headers.set('Referrer-Policy', 'same-origin');
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('X-Frame-Options', 'DENY');
	// Only where the public origin is https (ORIGIN): a plain-http local start must stay reachable.
	if (event.url.protocol === 'https:') {
		response.headers.set('Strict-Transport-Security', 'max-age=31536000');
	}
	return response;
};

function canSetHeaders(response: Response) {
	try {
		response.headers.set('x-content-type-options', 'nosniff');
		return true;
	} catch {
		return false;
	}
}

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const bearerOf = (request: Request) =>
	/^Bearer\s+(\S+)$/i.exec(request.headers.get('authorization') ?? '')?.[1] ?? null;

const formTypes = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];

/** The user a valid personal API token names, looked up once per request (only on `/api/`). */
const apiTokenUsers = new WeakMap<Request, CurrentUser>();

/**
 * Cross-site protection (SvelteKit's own check is off, see svelte.config.js). An unsafe request
 * must come from our own page (`Origin` is ours, or `Sec-Fetch-Site: same-origin`) when it
 * carries the session cookie, and always when its body is one a browser sends cross-site
 * without asking first (form, multipart, plain text). Only a valid personal token on `/api/`
 * is exempt: a script sends no `Origin`. JSON without the cookie passes, so the public
 * calculations (`/api/v1/calc/…`) stay open to other sites' scripts, as the API promises.
 */
const sameOrigin: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	if (!unsafeMethods.has(request.method)) return resolve(event);
	const bearer = url.pathname.startsWith('/api/') ? bearerOf(request) : null;
	if (bearer) {
		const user = await userForApiToken(db, bearer);
		if (user) {
			apiTokenUsers.set(request, { id: user.id, name: user.name, email: user.email });
			return resolve(event);
		}
	}
	const type = request.headers.get('content-type')?.split(';')[0].trim().toLowerCase() ?? '';
	const withSession = event.cookies.getAll().some((c) => c.name.includes('authjs.session-token'));
	const ours =
		request.headers.get('origin') === url.origin ||
		request.headers.get('sec-fetch-site') === 'same-origin';
	if (!ours && (withSession || formTypes.includes(type))) {
		const message = `Cross-site ${request.method} requests are refused`;
		return url.pathname.startsWith('/api/') || request.headers.get('accept') === 'application/json'
			? json({ error: { code: 'forbidden', message } }, { status: 403 })
			: text(message, { status: 403 });
	}
	return resolve(event);
};

const loopbackHosts = /^(localhost|127(?:\.\d{1,3}){3}|\[::1\])(?::\d+)?$/i;

/**
 * A page opened through another loopback name than the public origin (ORIGIN) — 127.0.0.1
 * when `npm start` printed localhost — would sign in and then lose its session cookie on the
 * way back, silently showing the sign-in page again. Such a page view is sent to the same path
 * on the public origin instead. Only loopback names: a proxy's own host names are left alone.
 */
const publicOrigin: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	const host = request.headers.get('host') ?? '';
	if (
		(request.method === 'GET' || request.method === 'HEAD') &&
		host !== url.host &&
		loopbackHosts.test(host) &&
		loopbackHosts.test(url.host) &&
		request.headers.get('accept')?.includes('text/html')
	) {
		return new Response(null, {
			status: 307,
			headers: { location: `${url.origin}${url.pathname}${url.search}` }
		});
	}
	return resolve(event);
};

/** A 429 with the wait in Retry-After, as JSON or text after what the client asked for. */
function tooManyRequests(request: Request, retryAfter: number) {
	const message = `Too many attempts: try again in ${retryAfter} s`;
	const headers = { 'retry-after': String(retryAfter) };
	return request.headers.get('accept')?.includes('application/json')
		? json({ error: { code: 'rate_limited', message, retryAfter } }, { status: 429, headers })
		: text(message, { status: 429, headers });
}

/**
 * The auth library's own routes take a sign-in or send a link without our form actions:
 * the same limits hold there. A password sign-in waiting out its delay is answered 429 before
 * the password is looked at (the library's authorize records failures); each sign-in link
 * request counts.
 */
const authRouteLimits: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	if (request.method !== 'POST' || !url.pathname.startsWith('/auth/')) return resolve(event);
	const link = url.pathname.startsWith('/auth/signin/');
	if (!link && !url.pathname.startsWith('/auth/callback/credentials')) return resolve(event);
	const form = await request
		.clone()
		.formData()
		.catch(() => null);
	const email = String(form?.get('email') ?? '');
	const address = event.getClientAddress();
	const wait = link ? await spendSignInLink(email, address) : await signInWait(email, address);
	return wait > 0 ? tooManyRequests(request, wait) : resolve(event);
};

const currentUser: Handle = async ({ event, resolve }) => {
	const bearer = event.url.pathname.startsWith('/api/') ? bearerOf(event.request) : null;
	event.locals.viaApiToken = Boolean(bearer);
	if (bearer) {
		const known = apiTokenUsers.get(event.request);
		const user = known ?? (await userForApiToken(db, bearer));
		event.locals.user = user ? { id: user.id, name: user.name, email: user.email } : null;
	} else {
		event.locals.user = await userFromSession(event);
	}
	return resolve(event);
};

export const handle = sequence(
	securityHeaders,
	publicOrigin,
	apiErrors,
	bodyLimit,
	sameOrigin,
	authRouteLimits,
	authHandle,
	currentUser
);

export const handleError: HandleServerError = ({ error, event, status }) => {
	const errorId = crypto.randomUUID();
	if (status !== 404) {
		console.error(`[${errorId}] ${event.request.method} ${event.url.pathname}`, error);
	}
	return { message: status === 404 ? 'Not found' : 'Something went wrong on our side', errorId };
};
