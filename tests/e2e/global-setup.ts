import { spawn, type ChildProcess } from 'node:child_process';
import { appendFileSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { demoPassword } from './browser';

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
		dataDir: string;
	}
}

export function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const server = createServer();
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			const { port } = server.address() as { port: number };
			server.close(() => resolve(port));
		});
	});
}

export interface StartedApp {
	baseUrl: string;
	process: ChildProcess;
	/** Everything the app printed so far. */
	output: () => string;
	stop: () => Promise<void>;
}

/**
 * Starts the built app the way `npm start` does, on a free port, with `env` over the test
 * defaults (stand-ins for every service, the demo password, a 20 MB upload limit).
 */
export async function startApp(dataDir: string, env: Record<string, string> = {}) {
	const port = await freePort();
	const child = spawn(process.execPath, ['scripts/start.js'], {
		env: {
			...process.env,
			DATA_DIR: dataDir,
			PORT: String(port),
			HOST: '127.0.0.1',
			DATABASE_URL: '',
			S3_ENDPOINT: '',
			SMTP_URL: '',
			DEMO_PASSWORD: demoPassword,
			MAX_UPLOAD_MB: '20',
			...env
		},
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let output = '';
	// Also kept in a file, which tests/app/unhandled.ts reads after each test file.
	const log = join(dataDir, 'app.log');
	child.stderr!.on('data', (chunk: Buffer) => {
		output += chunk.toString();
		appendFileSync(log, chunk);
		process.stderr.write(chunk);
	});
	const baseUrl = await new Promise<string>((resolve, reject) => {
		const timer = setTimeout(() => reject(new Error(`app did not start:\n${output}`)), 180_000);
		child.stdout!.on('data', (chunk: Buffer) => {
			output += chunk.toString();
			appendFileSync(log, chunk);
			const match = /running at (https?:\/\/\S+)/.exec(output);
			if (match) {
				clearTimeout(timer);
				// A public https origin (ORIGIN) is a proxy's; the app itself answers plain http here.
				resolve(match[1].startsWith('https:') ? `http://127.0.0.1:${port}` : match[1]);
			}
		});
		child.once('exit', (code) => reject(new Error(`app exited with ${code}:\n${output}`)));
	});
	const stop = async () => {
		if (child.exitCode !== null) return;
		child.kill('SIGINT');
		await new Promise((done) => child.once('exit', done));
	};
	return { baseUrl, process: child, output: () => output, stop } satisfies StartedApp;
}

let app: StartedApp | undefined;
let dataDir: string | undefined;

/** Starts the built app the way `npm start` does, on a free port with a temporary data dir. */
export default async function setup(project: TestProject) {
	dataDir = mkdtempSync(join(tmpdir(), 'checkplate-e2e-'));
	app = await startApp(dataDir);
	project.provide('baseUrl', app.baseUrl);
	project.provide('dataDir', dataDir);

	return async () => {
		await app?.stop();
		if (dataDir) rmSync(dataDir, { recursive: true, force: true });
	};
}
