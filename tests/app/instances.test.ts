import { spawn, type ChildProcess } from 'node:child_process';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findPostgresBin, startPostgres } from '../../scripts/postgres.js';
import { demoPassword } from '../e2e/browser';
import { freePort } from '../e2e/global-setup';
import { startFakes, tempDir } from '../integration/harness';

const authSecret = 'one-secret-shared-by-every-instance-0123456789';

interface Instance {
	url: string;
	process: ChildProcess;
	output: () => string;
}

/** The built app as a deployment runs it (`node build`), on the shared database and services. */
async function startInstance(env: Record<string, string>): Promise<Instance> {
	const port = await freePort();
	const url = `http://127.0.0.1:${port}`;
	const data = tempDir('checkplate-instance-');
	const child = spawn(process.execPath, [`${process.env.BUILD_DIR || 'build'}/index.js`], {
		env: {
			...process.env,
			...env,
			PORT: String(port),
			HOST: '127.0.0.1',
			ORIGIN: url,
			DATA_DIR: data.dir,
			AUTH_TRUST_HOST: 'true'
		},
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let output = '';
	child.stdout!.on('data', (chunk: Buffer) => (output += chunk));
	child.stderr!.on('data', (chunk: Buffer) => (output += chunk));
	child.once('exit', data.remove);
	for (let i = 0; i < 600; i++) {
		if (child.exitCode !== null) throw new Error(`instance exited:\n${output}`);
		const ready = await fetch(url).then(
			(response) => response.ok,
			() => false
		);
		if (ready) return { url, process: child, output: () => output };
		await new Promise((done) => setTimeout(done, 100));
	}
	child.kill('SIGKILL');
	throw new Error(`instance did not start:\n${output}`);
}

/** One browser: one cookie jar, whichever instance the load balancer sends it to. */
class Browser {
	cookies = new Map<string, string>();

	private keep(response: Response) {
		for (const line of response.headers.getSetCookie()) {
			const [pair] = line.split(';');
			const index = pair.indexOf('=');
			const value = pair.slice(index + 1).trim();
			if (value) this.cookies.set(pair.slice(0, index).trim(), value);
			else this.cookies.delete(pair.slice(0, index).trim());
		}
		return response;
	}

	private headers(instance: Instance) {
		const cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
		return { cookie, origin: instance.url };
	}

	async signIn(instance: Instance, email: string) {
		const response = await fetch(`${instance.url}/signin?/password`, {
			method: 'POST',
			headers: {
				...this.headers(instance),
				'content-type': 'application/x-www-form-urlencoded',
				accept: 'application/json',
				'x-sveltekit-action': 'true'
			},
			body: new URLSearchParams({ email, password: demoPassword }),
			redirect: 'manual'
		});
		this.keep(response);
		return (await response.json()) as { type: string; status?: number };
	}

	async api(instance: Instance, method: string, path: string, body?: unknown) {
		const headers: Record<string, string> = this.headers(instance);
		if (body !== undefined) headers['content-type'] = 'application/json';
		const response = await fetch(`${instance.url}/api/v1${path}`, {
			method,
			headers,
			body: body === undefined ? undefined : JSON.stringify(body)
		});
		return this.keep(response);
	}
}

const postgresBin = findPostgresBin();
const stops: (() => unknown)[] = [];
let shared: Record<string, string>;
let serverUrl: string;
let one: Instance;
let two: Instance;

describe.skipIf(!postgresBin)('two app instances on one PostgreSQL server', () => {
	beforeAll(async () => {
		const server = await startPostgres();
		stops.push(server.stop);
		const fakes = await startFakes();
		stops.push(fakes.stop);
		serverUrl = server.serverUrl;
		shared = {
			DATABASE_URL: server.url,
			AUTH_SECRET: authSecret,
			SEED_DEMO: '1',
			DEMO_PASSWORD: demoPassword,
			S3_ENDPOINT: fakes.storageSettings.endpoint,
			S3_BUCKET: fakes.storageSettings.bucket,
			S3_ACCESS_KEY_ID: fakes.storageSettings.accessKeyId,
			S3_SECRET_ACCESS_KEY: fakes.storageSettings.secretAccessKey,
			SMTP_URL: fakes.smtpUrl
		};
		// Started together: both migrate and seed the same empty database at once.
		const started = await Promise.allSettled([startInstance(shared), startInstance(shared)]);
		for (const result of started) {
			if (result.status === 'fulfilled') stops.push(() => stopInstance(result.value));
		}
		for (const result of started) if (result.status === 'rejected') throw result.reason;
		[one, two] = started.map((result) => (result as PromiseFulfilledResult<Instance>).value);
	});

	afterAll(async () => {
		for (const stop of stops.splice(0).reverse()) await stop();
	});

	it('both start on an empty database and seed the demo team once', async () => {
		const admin = new Browser();
		expect((await admin.signIn(one, 'admin@example.test')).type).toBe('redirect');
		const members = (await (await admin.api(two, 'GET', '/teams/kestrel/members')).json()) as {
			email: string;
			role: string;
		}[];
		expect(members.map((m) => `${m.email} ${m.role}`).sort()).toEqual([
			'admin@example.test admin',
			'checker@example.test checker',
			'drafter@example.test drafter',
			'quality@example.test quality'
		]);
	});

	it('never writes the demo password to its logs, only where it is set', () => {
		for (const instance of [one, two]) {
			expect(instance.output()).not.toContain(demoPassword);
		}
		expect(one.output() + two.output()).toContain('password in the DEMO_PASSWORD setting');
	});

	it('seeds no demo users on a PostgreSQL server unless SEED_DEMO=1', async () => {
		const admin = new pg.Client({ connectionString: `${serverUrl}/postgres` });
		await admin.connect();
		await admin.query('CREATE DATABASE without_demo');
		await admin.end();
		const plain = await startInstance({
			...shared,
			DATABASE_URL: `${serverUrl}/without_demo`,
			SEED_DEMO: ''
		});
		stops.push(() => stopInstance(plain));
		expect(plain.output()).not.toContain('demo users');
		const refused = await new Browser().signIn(plain, 'admin@example.test');
		expect(refused).toMatchObject({ type: 'failure', status: 401 });
	});

	it('recognises on one instance a sign-in made through the other', async () => {
		const drafter = new Browser();
		expect((await drafter.api(two, 'GET', '/me')).status).toBe(401);
		expect((await drafter.signIn(one, 'drafter@example.test')).type).toBe('redirect');
		const me = await drafter.api(two, 'GET', '/me');
		expect(me.status).toBe(200);
		expect((await me.json()).email).toBe('drafter@example.test');
	});

	it("delivers on one instance's board stream the changes made through the other", async () => {
		const drafter = new Browser();
		await drafter.signIn(one, 'drafter@example.test');
		const revision = '/teams/kestrel/drawings/KF-2001/revisions/A';
		const stream = await drafter.api(two, 'GET', `${revision}/events`);
		expect(stream.status).toBe(200);
		expect(stream.headers.get('content-type')).toContain('text/event-stream');
		const [feature] = (await (await drafter.api(one, 'GET', `${revision}/features`)).json()) as {
			id: string;
			version: number;
		}[];
		const edited = await drafter.api(one, 'PATCH', `${revision}/features/${feature.id}`, {
			version: feature.version,
			notes: 'Edited through the first instance'
		});
		expect(edited.status).toBe(200);
		const reader = stream.body!.getReader();
		let text = '';
		const deadline = Date.now() + 10_000;
		while (!text.includes(feature.id) && Date.now() < deadline) {
			const { value, done } = await reader.read();
			if (done) break;
			text += new TextDecoder().decode(value);
		}
		await reader.cancel();
		expect(text).toMatch(/event: change\nid: \d+\ndata: \{"type":"feature","action":"update"/);
		expect(text).toContain(`"id":"${feature.id}","version":${feature.version + 1}`);
	});

	it('enforces on one instance a role change made through the other, at once', async () => {
		const admin = new Browser();
		const quality = new Browser();
		await admin.signIn(one, 'admin@example.test');
		await quality.signIn(two, 'quality@example.test');
		const members = (await (await admin.api(one, 'GET', '/teams/kestrel/members')).json()) as {
			userId: string;
			email: string;
		}[];
		const qualityId = members.find((m) => m.email === 'quality@example.test')!.userId;
		const setRole = (role: string) =>
			admin.api(one, 'PATCH', `/teams/kestrel/members/${qualityId}`, { role });

		// PRODUCT.md §2: supplier quality may not read the activity trail; a checker may.
		expect((await quality.api(two, 'GET', '/teams/kestrel/activity')).status).toBe(403);
		expect((await setRole('checker')).status).toBe(200);
		expect((await quality.api(two, 'GET', '/teams/kestrel/activity')).status).toBe(200);
		expect((await setRole('quality')).status).toBe(200);
		expect((await quality.api(two, 'GET', '/teams/kestrel/activity')).status).toBe(403);
	});
});

async function stopInstance(instance: Instance) {
	if (instance.process.exitCode !== null) return;
	instance.process.kill('SIGTERM');
	await new Promise((done) => instance.process.once('exit', done));
}
