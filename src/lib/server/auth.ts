import { Auth, raw, skipCSRFCheck, type AuthConfig } from '@auth/core';
import type { Adapter } from '@auth/core/adapters';
import { CredentialsSignin } from '@auth/core/errors';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { SvelteKitAuth } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { getRequestEvent } from '$app/server';
import { dev } from '$app/environment';
import { env } from '$env/dynamic/private';
import type { RequestEvent } from '@sveltejs/kit';
import { config as settings } from './config';
import { db } from './db';
import { accounts, users, verificationTokens } from './db/schema';
import { attemptWait, clearAttempts, recordAttempt, spendAttempt } from './db/queries/attempts';
import type { Actor } from './db/queries/activity';
import { getUserByEmail, getUserById, normaliseEmail, proveEmail } from './db/queries/users';
import { queueMail } from './mail/outbox';
import { signInLinkMail } from './mail/templates';
import { nudgeOutbox } from './mail/worker';
import { verifyPassword } from './passwords';
import { signInInput } from '$lib/schemas/auth';

export class TooManyAttempts extends CredentialsSignin {
	code = 'rate_limited';
	constructor(readonly retryAfter: number) {
		super();
	}
}
export class EmailNotVerified extends CredentialsSignin {
	code = 'unverified';
}

export const attemptKeys = (email: string, address: string) => [
	`account:${normaliseEmail(email)}`,
	`address:${address}`
];

/** An e-mailed sign-in link counts against its address and the asking client's: seconds to wait. */
export async function spendSignInLink(email: string, address: string) {
	return spendAttempt(db, 'link', attemptKeys(email, address));
}

/** Seconds before the next password sign-in on this account from this address may be tried. */
export async function signInWait(email: string, address: string) {
	return attemptWait(db, 'sign-in', attemptKeys(email, address));
}

function clientAddress() {
	try {
		return getRequestEvent().getClientAddress();
	} catch {
		return 'unknown';
	}
}

let authConfig: AuthConfig | undefined;

async function buildConfig(): Promise<AuthConfig> {
	if (authConfig) return authConfig;
	authConfig = {
		trustHost: dev || env.AUTH_TRUST_HOST === 'true',
		secret: env.AUTH_SECRET,
		basePath: '/auth',
		// Our tables add columns (password hash, session generation) the adapter's types do not know.
		adapter: (DrizzleAdapter as (db: unknown, schema: unknown) => Adapter)(db, {
			usersTable: users,
			accountsTable: accounts,
			verificationTokensTable: verificationTokens
		}),
		// The adapter would switch to database sessions, which Credentials cannot use.
		session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
		logger: {
			// A wrong password is an expected outcome, shown on the form; keep the log for faults.
			error(err) {
				if (err instanceof CredentialsSignin || err.name === 'CredentialsSignin') return;
				console.error('[auth]', err);
			}
		},
		pages: { signIn: '/signin', verifyRequest: '/signin?sent=1', error: '/signin' },
		providers: [
			Credentials({
				credentials: { email: {}, password: {} },
				async authorize(credentials) {
					const parsed = signInInput.safeParse(credentials);
					if (!parsed.success) return null;
					const { email, password } = parsed.data;
					const keys = attemptKeys(email, clientAddress());
					// During the wait the password is not even compared: a guess then tells nothing.
					const wait = await attemptWait(db, 'sign-in', keys);
					if (wait > 0) throw new TooManyAttempts(wait);
					const user = await getUserByEmail(db, email);
					if (!(await verifyPassword(password, user?.passwordHash))) {
						await recordAttempt(db, 'sign-in', keys);
						return null;
					}
					if (!user!.emailVerified) throw new EmailNotVerified();
					await clearAttempts(db, 'sign-in', `account:${email}`);
					return { id: user!.id, name: user!.name, email: user!.email };
				}
			}),
			Nodemailer({
				server: settings.smtpUrl,
				from: settings.mailFrom,
				// A link in a mailbox is a key to the account: short-lived.
				maxAge: 15 * 60,
				// Our outbox sends it (and retries); nothing goes to an address without an account,
				// while the page says the same thing either way.
				async sendVerificationRequest({ identifier, url }) {
					const user = await getUserByEmail(db, identifier);
					if (!user) return;
					await queueMail(db, signInLinkMail(user.email, url));
					nudgeOutbox();
				}
			})
		],
		callbacks: {
			// A sign-in link proves the address. Anyone could have signed up with it before and set
			// the password: on the first proof that password, every session and API token ends.
			async signIn({ user, account }) {
				if (account?.type !== 'email' || !user.email) return true;
				const row = await getUserByEmail(db, user.email);
				if (row && !row.emailVerified) await proveEmail(db, row.id, { passwordHash: null });
				return true;
			},
			async jwt({ token, user }) {
				if (user?.id) {
					const row = await getUserById(db, user.id);
					token.uid = user.id;
					token.gen = row?.sessionGeneration ?? 0;
				}
				return token;
			},
			async session({ session, token }) {
				if (typeof token.uid === 'string') {
					session.user.id = token.uid;
					(session as { generation?: number }).generation = Number(token.gen ?? 0);
				}
				return session;
			}
		}
	};
	return authConfig;
}

export const { handle: authHandle } = SvelteKitAuth(async () => buildConfig());

export type SignInOutcome =
	| { ok: true }
	| { ok: false; code: 'invalid' | 'unverified' }
	| { ok: false; code: 'rate_limited'; retryAfter: number };

/** Runs an Auth.js sign-in for our own form actions, turning its errors into outcomes. */
export async function signInWith(
	event: RequestEvent,
	provider: 'credentials' | 'nodemailer',
	fields: Record<string, string>
): Promise<SignInOutcome> {
	const authConfig = await buildConfig();
	const action = provider === 'credentials' ? 'callback' : 'signin';
	const url = new URL(`/auth/${action}/${provider}`, event.url);
	const headers = new Headers(event.request.headers);
	headers.set('Content-Type', 'application/x-www-form-urlencoded');
	// Our form actions already passed the same-origin check (hooks.server.ts), which also
	// stands in for Auth.js's CSRF token on its own routes (@auth/sveltekit turns that off).
	const body = new URLSearchParams({ ...fields, callbackUrl: '/' });
	try {
		const response = await Auth(new Request(url, { method: 'POST', headers, body }), {
			...authConfig,
			raw,
			skipCSRFCheck
		});
		for (const cookie of response?.cookies ?? []) {
			event.cookies.set(cookie.name, cookie.value, { path: '/', ...cookie.options });
		}
		if (response.redirect?.includes('error=')) return { ok: false, code: 'invalid' };
		return { ok: true };
	} catch (err) {
		if (err instanceof TooManyAttempts) {
			return { ok: false, code: 'rate_limited', retryAfter: err.retryAfter };
		}
		if ((err as { code?: string }).code === 'unverified') return { ok: false, code: 'unverified' };
		if (err instanceof CredentialsSignin || (err as Error).name === 'CredentialsSignin') {
			return { ok: false, code: 'invalid' };
		}
		throw err;
	}
}

export function signOutHere(event: RequestEvent) {
	for (const name of event.cookies.getAll().map((c) => c.name)) {
		if (name.includes('authjs.session-token')) event.cookies.delete(name, { path: '/' });
	}
}

/** The signed-in user is the actor every change records. */
export type CurrentUser = Actor;

/** The signed-in user, or null when the token was revoked (generation bumped) or the user is gone. */
export async function userFromSession(event: RequestEvent): Promise<CurrentUser | null> {
	const session = (await event.locals.auth()) as
		({ user?: { id?: string }; generation?: number } & object) | null;
	const id = session?.user?.id;
	if (!id) return null;
	const user = await getUserById(db, id);
	if (!user || user.sessionGeneration !== (session.generation ?? -1)) return null;
	return { id: user.id, name: user.name, email: user.email };
}
