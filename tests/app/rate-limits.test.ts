import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from '../e2e/global-setup';
import { tempDir } from '../integration/harness';
import { linkIn, unique, waitForMail } from '../shared';
import { Client } from './client';

/**
 * An app behind a proxy, as the README's configuration table describes: the client's address
 * is the last entry of X-Forwarded-For (adapter-node's ADDRESS_HEADER and XFF_DEPTH), so each
 * test client can come from an address of its own (RFC 5737 documentation addresses).
 */
let app: StartedApp;
const data = tempDir('checkplate-limits-');
let nextAddress = 1;
const newAddress = () => `198.51.100.${nextAddress++}`;
const from = (address = newAddress()) =>
	new Client({ base: app.baseUrl, headers: { 'x-forwarded-for': `10.9.9.9, ${address}` } });
const pause = (ms: number) => new Promise((done) => setTimeout(done, ms));

beforeAll(async () => {
	app = await startApp(data.dir, {
		SEED_DEMO: '0',
		ADDRESS_HEADER: 'X-Forwarded-For',
		XFF_DEPTH: '1'
	});
});
afterAll(async () => {
	await app?.stop();
	data.remove();
});

async function verifiedUser(client: Client) {
	const email = `limits-${unique()}@example.test`;
	const password = 'pump housing bore 18';
	await client.submit('/signup', { name: 'Lim Its', email, password });
	const mail = await waitForMail(email, /Confirm your e-mail/, 15_000, data.dir);
	await client.confirmAddress(linkIn(mail, '/verify'));
	return { email, password };
}

/**
 * A form post as a script would send it straight to Auth.js's own route (@auth/sveltekit turns
 * the library's CSRF token off: our same-origin check stands in for it, and a script names our
 * origin).
 */
const authRoute = (client: Client, path: string, fields: Record<string, string>) =>
	client.post(path, fields);

describe('failed sign-ins', () => {
	it('make the next try on the account wait, twice as long each time, not lock it', async () => {
		const { email, password } = await verifiedUser(from());
		// Five wrong guesses, each from an address of its own: counted on the account.
		for (let i = 0; i < 5; i++) {
			expect(await from().signIn(email, `wrong guess ${i}`)).toMatchObject({ status: 401 });
		}
		const owner = from();
		const sixth = await owner.signInResponse(email, password);
		expect(sixth.status).toBe(429);
		expect(sixth.headers.get('retry-after')).toBe('1');
		expect(await sixth.text()).toContain('e-mailed sign-in link works meanwhile');
		expect((await owner.me()).status).toBe(401);

		await pause(1100);
		expect(await from().signIn(email, 'one more guess')).toMatchObject({ status: 401 });
		const waiting = await from().signInResponse(email, password);
		expect(waiting.status).toBe(429);
		expect(waiting.headers.get('retry-after')).toBe('2');

		await pause(2100);
		expect(await owner.signIn(email, password)).toMatchObject({ type: 'redirect' });
		expect((await owner.me()).status).toBe(200);
	});

	it('from one address past its free failures wait, on any account; other addresses do not', async () => {
		const { email, password } = await verifiedUser(from());
		const sprayer = newAddress();
		for (let i = 0; i < 20; i++) {
			const guess = await from(sprayer).signIn(`nobody-${unique()}@example.test`, 'password1');
			expect(guess).toMatchObject({ status: 401 });
		}
		const refused = await from(sprayer).signInResponse(email, password);
		expect(refused.status).toBe(429);
		expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(await from().signIn(email, password)).toMatchObject({ type: 'redirect' });
	});

	it("wait too when posted straight to the auth library's callback route", async () => {
		const { email, password } = await verifiedUser(from());
		const attacker = from();
		for (let i = 0; i < 5; i++) {
			const guess = await authRoute(attacker, '/auth/callback/credentials', {
				email,
				password: `straight guess ${i}`
			});
			expect(guess.status).toBe(302);
			expect(guess.headers.get('location')).toContain('error=CredentialsSignin');
		}
		const sixth = await authRoute(attacker, '/auth/callback/credentials', { email, password });
		expect(sixth.status).toBe(429);
		expect(sixth.headers.get('retry-after')).toBe('1');
		expect(sixth.headers.getSetCookie().join()).not.toContain('session-token');
	});
});

describe('requests that send mail', () => {
	it('e-mailed sign-in links: three an address a day, then a wait, also on the library route', async () => {
		const { email } = await verifiedUser(from());
		for (let i = 0; i < 2; i++) {
			expect(await from().submit('/signin?/link', { email })).toMatchObject({ type: 'redirect' });
		}
		const third = await authRoute(from(), '/auth/signin/nodemailer', { email });
		expect(third.status).toBe(302);
		const fourth = await authRoute(from(), '/auth/signin/nodemailer', { email });
		expect(fourth.status).toBe(429);
		expect(fourth.headers.get('retry-after')).toBe('60');
		const form = await from().submit('/signin?/link', { email });
		expect(form).toMatchObject({ type: 'failure', status: 429 });
	});

	it('sign-up and reset: three a mailbox, then 429 with Retry-After, known address or not', async () => {
		for (const email of [`fresh-${unique()}@example.test`, (await verifiedUser(from())).email]) {
			const signUps = [];
			for (let i = 0; i < 4; i++) {
				signUps.push(
					await from().submit('/signup', {
						name: 'Mail Bomb',
						email,
						password: 'some long phrase 1'
					})
				);
			}
			// A confirmed address has had one sign-up already.
			const free = signUps.findIndex((r) => r.type === 'failure');
			expect(free).toBeGreaterThanOrEqual(2);
			expect(signUps[free]).toMatchObject({ status: 429 });
			expect(signUps[free].data).toContain('Too many sign-ups');
		}
		const email = `reset-${unique()}@example.test`;
		for (let i = 0; i < 3; i++) {
			expect(await from().submit('/reset', { email })).toMatchObject({ type: 'redirect' });
		}
		const response = await from().post('/reset', { email });
		expect(response.status).toBe(429);
		expect(response.headers.get('retry-after')).toBe('60');
	});

	it('invitations: thirty a day for one inviter, then 429 rate_limited with Retry-After', async () => {
		const admin = from();
		const { email, password } = await verifiedUser(admin);
		await admin.signIn(email, password);
		const slug = `invites-${unique()}`;
		expect((await admin.api('POST', '/teams', { name: 'Invite shop', slug })).status).toBe(201);
		for (let i = 0; i < 30; i++) {
			const invited = await admin.api('POST', `/teams/${slug}/members`, {
				email: `guest-${i}-${unique()}@example.test`,
				role: 'checker'
			});
			expect(invited.status).toBe(202);
		}
		const refused = await admin.api('POST', `/teams/${slug}/invitations`, {
			email: `one-too-many-${unique()}@example.test`,
			role: 'checker'
		});
		expect(refused.status).toBe(429);
		expect(refused.headers.get('retry-after')).toBe('60');
		expect((await refused.json()).error).toMatchObject({ code: 'rate_limited', retryAfter: 60 });
	});
});
