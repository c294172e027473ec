import { afterAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from '../e2e/global-setup';
import { tempDir } from '../integration/harness';
import { Client } from './client';

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
