import { describe, expect, it } from 'vitest';
import { baseUrl, Client } from './client';

const kb = 1024;

/** A body sent without a declared length (chunked), as a streaming client sends it. */
function chunked(bytes: number, chunk = 64 * kb) {
	let sent = 0;
	return new ReadableStream<Uint8Array>({
		pull(controller) {
			if (sent >= bytes) return controller.close();
			const size = Math.min(chunk, bytes - sent);
			sent += size;
			controller.enqueue(new Uint8Array(size).fill(0x20));
		}
	});
}

describe('request bodies are small everywhere but the upload', () => {
	it('refuses a 5 MB JSON body to the public calculator with 413 before reading it', async () => {
		const body = JSON.stringify({ callout: 'Ø25 H7', notes: 'x'.repeat(5 * kb * kb) });
		const response = await fetch(new URL('/api/v1/calc/size', baseUrl), {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body
		});
		expect(response.status).toBe(413);
		expect((await response.json()).error).toMatchObject({ code: 'too_large' });
	});

	it('refuses a chunked body of unknown length once it passes the limit', async () => {
		const response = await fetch(new URL('/api/v1/calc/fit', baseUrl), {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: chunked(3 * kb * kb),
			duplex: 'half'
		} as RequestInit);
		expect(response.status).toBe(413);
		expect((await response.json()).error.code).toBe('too_large');
	});

	it('refuses an oversized form post to a page, and still reads small chunked bodies', async () => {
		const form = await fetch(new URL('/signin?/password', baseUrl), {
			method: 'POST',
			headers: {
				origin: new URL(baseUrl).origin,
				'content-type': 'application/x-www-form-urlencoded'
			},
			body: `email=a%40example.test&password=${'p'.repeat(2 * kb * kb)}`
		});
		expect(form.status).toBe(413);

		const small = new TextEncoder().encode(
			JSON.stringify({ callout: 'Ø25 H7', units: 'mm', standard: 'iso' })
		);
		const answer = await fetch(new URL('/api/v1/calc/size', baseUrl), {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: new ReadableStream({
				start(controller) {
					controller.enqueue(small);
					controller.close();
				}
			}),
			duplex: 'half'
		} as RequestInit);
		expect(answer.status).toBe(200);
		// ISO 286-2:2010, table 2: H7 over 18 to 30 mm is +0.021/0
		expect(await answer.json()).toMatchObject({ lower: '25.000', upper: '25.021' });
	});
});

describe('bad query values and unknown API paths', () => {
	it('answers 400 invalid for ?limit=-1 and other bad activity queries, never 500', async () => {
		const drafter = new Client();
		await drafter.signIn('drafter@example.test');
		for (const query of ['limit=-1', 'limit=abc', 'limit=100000', 'before=1e300', 'before=-5']) {
			const response = await drafter.get(`/api/v1/teams/kestrel/activity?${query}`);
			expect(response.status, query).toBe(400);
			expect((await response.json()).error.code, query).toBe('invalid');
		}
		const good = await drafter.get('/api/v1/teams/kestrel/activity?limit=2');
		expect(good.status).toBe(200);
		expect((await good.json()).length).toBeLessThanOrEqual(2);
		expect((await drafter.get('/teams/kestrel/activity?before=1e300')).status).toBe(400);
	});

	it('answers an unknown path under /api/v1 with a short JSON not_found', async () => {
		const response = await fetch(new URL('/api/v1/no/such/thing', baseUrl));
		expect(response.status).toBe(404);
		expect(response.headers.get('content-type')).toContain('application/json');
		const body = await response.json();
		expect(body).toEqual({
			error: { code: 'not_found', message: 'No such API path: GET /api/v1/no/such/thing' }
		});
	});
});
