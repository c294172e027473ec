import { request as httpRequest } from 'node:http';
import { beforeAll, describe, expect, it } from 'vitest';
import { twoSheetPdf } from '../fixtures/pdfs';
import { unique } from '../shared';
import { baseUrl, bearerCall, Client, leftovers } from './client';

let token = '';
let path = '';
const boundary = '----checkplate-test-boundary';
const head = (name = 'drawing.pdf') =>
	Buffer.from(
		`--${boundary}\r\nContent-Disposition: form-data; name="reason"\r\n\r\nAttack\r\n` +
			`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\n` +
			'Content-Type: application/pdf\r\n\r\n'
	);
const tail = Buffer.from(`\r\n--${boundary}--\r\n`);

beforeAll(async () => {
	const drafter = new Client();
	await drafter.signIn('drafter@example.test');
	token = (await (await drafter.api('POST', '/me/tokens', { name: 'abuse' })).json()).token;
	const number = `T-${unique()}`.toUpperCase();
	const created = await drafter.api('POST', '/teams/kestrel/drawings', {
		number,
		title: 'Abused plate',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
	});
	expect(created.status).toBe(201);
	path = `/api/v1/teams/kestrel/drawings/${number}/revisions`;
});

/** Waits (bounded) until the app has cleaned up after a broken request. */
async function settledTo(expected: { objects: number; temp: number }) {
	for (let i = 0; i < 100; i++) {
		const now = leftovers();
		if (now.objects === expected.objects && now.temp === expected.temp) return now;
		await new Promise((done) => setTimeout(done, 100));
	}
	return leftovers();
}

/**
 * A raw multipart POST: `write` sends the body as it likes; answers the status and body, or
 * `aborted` when the test cut the connection.
 */
function rawPost(
	write: (req: ReturnType<typeof httpRequest>) => Promise<void>,
	headers: Record<string, string | number> = {}
) {
	const url = new URL(path, baseUrl);
	return new Promise<{ status: number; body: string } | 'aborted'>((resolve, reject) => {
		const req = httpRequest(url, {
			method: 'POST',
			headers: {
				authorization: `Bearer ${token}`,
				'content-type': `multipart/form-data; boundary=${boundary}`,
				...headers
			}
		});
		req.on('response', (response) => {
			let body = '';
			response.on('data', (chunk: Buffer) => (body += chunk));
			response.on('end', () => resolve({ status: response.statusCode!, body }));
			response.on('error', reject);
		});
		req.on('error', (err) => (req.destroyed ? resolve('aborted') : reject(err)));
		write(req).catch(reject);
	});
}

/** Writes a chunk, waiting while the connection is full; returns early once it closed. */
function send(req: ReturnType<typeof httpRequest>, chunk: Buffer) {
	if (req.write(chunk)) return Promise.resolve();
	return new Promise<void>((done) => {
		const finish = () => {
			req.off('drain', finish);
			req.off('close', finish);
			done();
		};
		req.on('drain', finish);
		req.on('close', finish);
	});
}

const alive = async () => (await bearerCall(token, 'GET', '/me')).status;

describe('a broken upload never stops the server', () => {
	it('refuses a multipart body that ends before its closing boundary', async () => {
		const before = leftovers();
		const pdf = Buffer.from(await twoSheetPdf('CUT'));
		const body = Buffer.concat([head(), pdf.subarray(0, pdf.length / 2)]);
		const answer = await rawPost(
			async (req) => {
				req.end(body);
			},
			{ 'content-length': body.length }
		);
		expect(answer).not.toBe('aborted');
		if (answer === 'aborted') return;
		expect(answer.status).toBe(400);
		expect(JSON.parse(answer.body).error).toMatchObject({ code: 'invalid' });
		expect(JSON.parse(answer.body).error.message).toMatch(/ended before it was complete/);
		expect(await alive()).toBe(200);
		expect(await settledTo(before)).toEqual(before);
	});

	it('survives a client that goes away mid-file, past the first storage part', async () => {
		const before = leftovers();
		const answer = await rawPost(async (req) => {
			req.write(head());
			const chunk = Buffer.alloc(1024 * 1024, 0x25);
			for (let i = 0; i < 10; i++) await send(req, chunk);
			await new Promise((done) => setTimeout(done, 300));
			req.destroy();
		});
		expect(answer).toBe('aborted');
		expect(await alive()).toBe(200);
		expect(await settledTo(before)).toEqual(before);
	});

	it('refuses a stream over the upload limit with 413 and keeps nothing of it', async () => {
		const before = leftovers();
		// The test app's MAX_UPLOAD_MB is 20 (tests/e2e/global-setup.ts); sent without a length.
		const answer = await rawPost(async (req) => {
			req.write(head());
			const chunk = Buffer.alloc(1024 * 1024, 0x25);
			for (let i = 0; i < 24 && !req.destroyed; i++) await send(req, chunk);
			if (!req.destroyed) req.end(tail);
		});
		expect(answer).toMatchObject({ status: 413 });
		if (answer !== 'aborted') expect(JSON.parse(answer.body).error.code).toBe('too_large');
		expect(await alive()).toBe(200);
		expect(await settledTo(before)).toEqual(before);
	});

	it('then takes a good upload as usual', async () => {
		const before = leftovers();
		const bytes = await twoSheetPdf('AFTER-ABUSE');
		const form = new FormData();
		form.set('file', new Blob([bytes as BlobPart], { type: 'application/pdf' }), 'good.pdf');
		const response = await fetch(new URL(path, baseUrl), {
			method: 'POST',
			headers: { authorization: `Bearer ${token}` },
			body: form
		});
		expect(response.status).toBe(201);
		expect((await response.json()).pages).toBe(2);
		expect(leftovers().temp).toBe(before.temp);
		expect(leftovers().objects).toBeGreaterThan(before.objects);
	});
});
