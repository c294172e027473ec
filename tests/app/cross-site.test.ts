import { describe, expect, it } from 'vitest';
import { baseUrl, bearerCall, Client, demoPassword, newVerifiedUser } from './client';

const evil = 'https://evil.example';

describe('the sign-in redirect', () => {
	it.each([
		'/\t/evil.example',
		'/\\evil.example',
		'//evil.example',
		'/\n/evil.example',
		'https://evil.example/'
	])('stays on our origin for %j', async (target) => {
		const path = `/signin?/password&redirectTo=${encodeURIComponent(target)}`;
		const signedIn = await new Client().submit(path, {
			email: 'checker@example.test',
			password: demoPassword
		});
		expect(signedIn).toMatchObject({ type: 'redirect', location: '/' });
	});

	it('keeps a path on our own origin, with its query', async () => {
		const client = new Client();
		await client.signIn('checker@example.test');
		const page = await client.get(`/signin?redirectTo=${encodeURIComponent('/teams?x=1')}`);
		expect(page.headers.get('location')).toBe('/teams?x=1');
	});
});

/** A request as another site's page would make it, with the session cookie the browser holds. */
function crossSite(
	client: Client,
	path: string,
	init: RequestInit & { headers?: Record<string, string> }
) {
	return fetch(new URL(path, baseUrl), {
		...init,
		redirect: 'manual',
		headers: {
			cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
			...init.headers
		}
	});
}

describe('cross-site requests', () => {
	it('refuse JSON with the session cookie from another origin, or with no origin at all', async () => {
		const client = new Client();
		await newVerifiedUser(client);
		const body = JSON.stringify({ name: 'Not mine' });
		const attempts: Record<string, string>[] = [
			{ origin: evil, 'content-type': 'application/json' },
			{ 'content-type': 'application/json' },
			{ 'sec-fetch-site': 'cross-site', 'content-type': 'application/json' }
		];
		for (const headers of attempts) {
			const response = await crossSite(client, '/api/v1/me/tokens', {
				method: 'POST',
				headers,
				body
			});
			expect(response.status).toBe(403);
			expect((await response.json()).error.code).toBe('forbidden');
		}
		// The same request from our own page passes (Origin, or Sec-Fetch-Site alone).
		const ours = await crossSite(client, '/api/v1/me/tokens', {
			method: 'POST',
			headers: { 'sec-fetch-site': 'same-origin', 'content-type': 'application/json' },
			body
		});
		expect(ours.status).toBe(201);
		const tokens = await (await client.api('GET', '/me/tokens')).json();
		expect(tokens.filter((t: { name: string }) => t.name === 'Not mine')).toHaveLength(1);
	});

	it('refuse a plain-text body posing as JSON (415) even from our origin', async () => {
		const client = new Client();
		await client.signIn('checker@example.test');
		const response = await crossSite(client, '/api/v1/me/tokens', {
			method: 'POST',
			headers: { origin: new URL(baseUrl).origin, 'content-type': 'text/plain' },
			body: JSON.stringify({ name: 'sneaky' })
		});
		expect(response.status).toBe(415);
		expect((await response.json()).error.code).toBe('unsupported_media_type');
	});

	it('exempt only a valid Bearer token on /api/', async () => {
		const client = new Client();
		await newVerifiedUser(client);
		const token = (await (await client.api('POST', '/me/tokens', { name: 'script' })).json()).token;
		// A script's POST with no Origin reaches the route (which finds the body incomplete).
		const script = await bearerCall(token, 'POST', '/teams', {});
		expect(script.status).toBe(400);
		expect((await script.json()).error.code).toBe('invalid');
		// A made-up token does not lift the check for the cookie beside it.
		const forged = await crossSite(client, '/api/v1/me/tokens', {
			method: 'POST',
			headers: {
				authorization: 'Bearer made-up',
				'content-type': 'application/json',
				origin: evil
			},
			body: JSON.stringify({ name: 'forged' })
		});
		expect(forged.status).toBe(403);
		// Nor does a Bearer header on a page's form action.
		const form = await crossSite(client, '/account?/signout', {
			method: 'POST',
			headers: {
				authorization: `Bearer ${token}`,
				'content-type': 'application/x-www-form-urlencoded',
				origin: evil
			},
			body: ''
		});
		expect(form.status).toBe(403);
		expect((await client.me()).status).toBe(200);
	});

	it('leave the public calculations open to other sites without a cookie', async () => {
		const response = await fetch(new URL('/api/v1/calc/fit', baseUrl), {
			method: 'POST',
			headers: { origin: evil, 'content-type': 'application/json' },
			body: JSON.stringify({
				hole: { callout: 'Ø25 H7' },
				shaft: { callout: 'Ø25 g6' },
				units: 'mm'
			})
		});
		expect(response.status).toBe(200);
	});
});

describe('signing out', () => {
	it('ends the session: a copy of its cookie no longer works', async () => {
		const client = new Client();
		await newVerifiedUser(client);
		const copy = new Client();
		copy.cookies = new Map(client.cookies);
		expect((await copy.me()).status).toBe(200);
		expect(await client.submit('/account?/signout', {})).toMatchObject({ type: 'redirect' });
		expect((await client.me()).status).toBe(401);
		expect((await copy.me()).status).toBe(401);
	});
});

describe('changing the password', () => {
	it('limits guesses at the current password like sign-in guesses', async () => {
		const client = new Client();
		const { password } = await newVerifiedUser(client);
		const change = (current: string) =>
			client.submit('/account?/password', {
				currentPassword: current,
				password: 'a new long pass 42'
			});
		let status = 0;
		for (let i = 0; i < 11 && status !== 429; i++) status = (await change(`guess ${i}`)).status;
		expect(status).toBe(429);
		// Even the right password waits now.
		expect((await change(password)).status).toBe(429);
	});

	it('refuses a new password past 72 bytes instead of cutting it', async () => {
		const client = new Client();
		const { password } = await newVerifiedUser(client);
		const result = await client.submit('/account?/password', {
			currentPassword: password,
			password: 'pump housing bore '.padEnd(73, 'x')
		});
		expect(result).toMatchObject({ type: 'failure', status: 400 });
		expect(result.data).toContain('72 bytes');
	});
});
