import { request } from 'node:http';
import { afterAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from '../e2e/global-setup';
import { tempDir } from '../integration/harness';
import { baseUrl, Client } from './client';

/** A GET to the test app (on 127.0.0.1) naming another host, as a browser's address bar does. */
function getAs(host: string, path: string, accept: string) {
	const url = new URL(path, baseUrl);
	return new Promise<{ status: number; location?: string }>((done, fail) => {
		const req = request(url, { headers: { host, accept } }, (res) => {
			res.resume();
			done({ status: res.statusCode ?? 0, location: res.headers.location });
		});
		req.on('error', fail);
		req.end();
	});
}

describe('a page opened through another loopback name', () => {
	const port = new URL(baseUrl).port;

	it('is sent to the same path on the public origin, so the session cookie holds', async () => {
		const answer = await getAs(`localhost:${port}`, '/signin?redirectTo=%2Fteams', 'text/html');
		expect(answer).toEqual({
			status: 307,
			location: `${new URL(baseUrl).origin}/signin?redirectTo=%2Fteams`
		});
	});

	it('is left alone for API calls and for host names that are not loopback', async () => {
		expect((await getAs(`localhost:${port}`, '/api/v1/openapi.json', '*/*')).status).toBe(200);
		expect((await getAs('checkplate.example', '/signin', 'text/html')).status).toBe(200);
	});
});

describe('Strict-Transport-Security', () => {
	let secure: StartedApp | undefined;
	const data = tempDir('checkplate-https-');
	afterAll(async () => {
		await secure?.stop();
		data.remove();
	});

	it('is not sent where the origin is plain http (the test app)', async () => {
		const page = await new Client().get('/signin');
		expect(page.headers.get('strict-transport-security')).toBeNull();
	});

	it('is sent where the public origin is https (behind a TLS proxy)', async () => {
		secure = await startApp(data.dir, { ORIGIN: 'https://checkplate.test', SEED_DEMO: '0' });
		const page = await fetch(new URL('/signin', secure.baseUrl));
		expect(page.status).toBe(200);
		expect(page.headers.get('strict-transport-security')).toBe('max-age=31536000');
	});
});
