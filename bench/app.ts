import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { freePort } from '../tests/e2e/global-setup';

/**
 * Starts the built app the way `npm start` does, on a free loopback port with its data in
 * `dir`; resolves once it prints its URL. `stop()` ends it and waits.
 */
export async function startApp(dir: string, env: Record<string, string> = {}) {
	const port = await freePort();
	const app = spawn(process.execPath, ['scripts/start.js'], {
		env: {
			...process.env,
			DATA_DIR: join(dir, 'data'),
			PORT: String(port),
			HOST: '127.0.0.1',
			DATABASE_URL: '',
			S3_ENDPOINT: '',
			SMTP_URL: '',
			...env
		},
		stdio: ['ignore', 'pipe', 'inherit']
	});
	let output = '';
	const baseUrl = await new Promise<string>((resolve, reject) => {
		app.stdout!.on('data', (chunk: Buffer) => {
			output += chunk.toString();
			const match = /running at (http:\/\/\S+)/.exec(output);
			if (match) resolve(match[1]);
		});
		app.once('exit', (code) => reject(new Error(`app exited ${code}\n${output}`)));
	});
	return {
		app,
		baseUrl,
		output: () => output,
		async stop() {
			app.kill('SIGINT');
			await new Promise((done) => app.once('exit', done));
		}
	};
}
