import { afterAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from '../e2e/global-setup';
import { tempDir } from '../integration/harness';
import { Client } from './client';

describe('caught mail at /dev/mail', () => {
	let wide: StartedApp | undefined;
	const data = tempDir('checkplate-wide-');
	afterAll(async () => {
		await wide?.stop();
		data.remove();
	});

	it('is shown while the app listens on loopback alone (the test app: HOST=127.0.0.1)', async () => {
		const page = await new Client().get('/dev/mail');
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Caught mail');
	});

	it('answers 404 when the app listens beyond this machine, and start says so loudly', async () => {
		// Listens on every interface; the test asks on loopback only.
		wide = await startApp(data.dir, { HOST: '0.0.0.0', SEED_DEMO: '0' });
		const port = new URL(wide.baseUrl).port;
		const page = await fetch(`http://127.0.0.1:${port}/dev/mail`);
		expect(page.status).toBe(404);
		expect(await page.text()).not.toContain('Caught mail');
		expect(wide.output()).toMatch(/caught mail\s+!! cannot be read at \/dev\/mail here/);
		// The rest of the app still answers.
		expect((await fetch(`http://127.0.0.1:${port}/signin`)).status).toBe(200);
	});
});
