import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
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

let app: ChildProcess | undefined;
let dataDir: string | undefined;

/** Starts the built app the way `npm start` does, on a free port with a temporary data dir. */
export default async function setup(project: TestProject) {
	dataDir = mkdtempSync(join(tmpdir(), 'checkplate-e2e-'));
	const port = await freePort();
	app = spawn(process.execPath, ['scripts/start.js'], {
		env: {
			...process.env,
			DATA_DIR: dataDir,
			PORT: String(port),
			HOST: '127.0.0.1',
			DATABASE_URL: '',
			S3_ENDPOINT: '',
			SMTP_URL: '',
			DEMO_PASSWORD: demoPassword,
			MAX_UPLOAD_MB: '20'
		},
		stdio: ['ignore', 'pipe', 'inherit']
	});
	let output = '';
	const baseUrl = await new Promise<string>((resolve, reject) => {
		const timer = setTimeout(() => reject(new Error(`app did not start:\n${output}`)), 180_000);
		app!.stdout!.on('data', (chunk: Buffer) => {
			output += chunk.toString();
			const match = /running at (http:\/\/\S+)/.exec(output);
			if (match) {
				clearTimeout(timer);
				resolve(match[1]);
			}
		});
		app!.once('exit', (code) => reject(new Error(`app exited with ${code}:\n${output}`)));
	});
	project.provide('baseUrl', baseUrl);
	project.provide('dataDir', dataDir);

	return async () => {
		if (app && app.exitCode === null) {
			app.kill('SIGINT');
			await new Promise((done) => app!.once('exit', done));
		}
		if (dataDir) rmSync(dataDir, { recursive: true, force: true });
	};
}
