// A 100 MB drawing through the app (busboy → temp file → checks → lib-storage) against the same
// bytes put straight into the bucket with lib-storage, in one run: MB/s, their ratio, and the
// peak memory growth of each process. Run with `npm run bench:upload`. Linux only (/proc).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync, createReadStream } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { bulkyPdf } from '../tests/fixtures/pdfs';
import { startApp } from '../tests/e2e/global-setup';
import { apiTokenFor } from './api-token';
import { peakGrowth, resetPeak, rssBytes } from './memory';

const megabytes = Number(process.env.BENCH_MB || 100);
const dir = mkdtempSync(join(tmpdir(), 'checkplate-bench-'));
const file = join(dir, 'big.pdf');
// A valid PDF whose bulk is one unused, incompressible stream object: its cross-reference
// table is right, as a real scanned or raster-heavy drawing's would be.
writeFileSync(file, await bulkyPdf(megabytes * 1_000_000));
const size = statSync(file).size;
const mb = size / 1_000_000;

const server = await startApp(dir, {
	DEMO_PASSWORD: 'bench-password-1',
	MAX_UPLOAD_MB: String(megabytes + 10)
});
const { process: app, baseUrl } = server;
const output = server.output();
const s3Endpoint = /S3 stand-in\s+(\S+)/.exec(output)![1];
const serverPid = Number(
	spawnSync('pgrep', ['-P', String(app.pid), '-f', 'index.js'], { encoding: 'utf8' }).stdout.trim()
);

async function json(response: Response) {
	if (!response.ok) throw new Error(`${response.status} ${await response.text()}`);
	return response.json();
}
// Sign in as the demo drafter through the API's own means: a personal token.
const token = await apiTokenFor(baseUrl, 'drafter@example.test', 'bench-password-1');
const auth = { authorization: `Bearer ${token}` };
await json(
	await fetch(`${baseUrl}/api/v1/teams/kestrel/drawings`, {
		method: 'POST',
		headers: { ...auth, 'content-type': 'application/json' },
		body: JSON.stringify({ number: 'BENCH-1', title: 'Bench', units: 'mm', standard: 'iso-8015' })
	})
);

/** The multipart body as a stream: the file is never held in memory here either. */
function multipart(boundary: string) {
	const head = `--${boundary}\r\nContent-Disposition: form-data; name="reason"\r\n\r\nbench\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.pdf"\r\nContent-Type: application/pdf\r\n\r\n`;
	const tail = `\r\n--${boundary}--\r\n`;
	async function* parts() {
		yield Buffer.from(head);
		for await (const chunk of createReadStream(file)) yield chunk as Buffer;
		yield Buffer.from(tail);
	}
	return Readable.toWeb(Readable.from(parts())) as ReadableStream;
}

const baseline = rssBytes(serverPid);
resetPeak(serverPid);
const started = performance.now();
const boundary = 'checkplate-bench-boundary';
const revision = await json(
	await fetch(`${baseUrl}/api/v1/teams/kestrel/drawings/BENCH-1/revisions`, {
		method: 'POST',
		headers: { ...auth, 'content-type': `multipart/form-data; boundary=${boundary}` },
		body: multipart(boundary),
		duplex: 'half'
	} as RequestInit)
);
const appSeconds = (performance.now() - started) / 1000;
const appGrowth = peakGrowth(serverPid, baseline);
if (revision.size !== size) throw new Error(`stored ${revision.size} bytes of ${size}`);

const raw = spawnSync(
	process.execPath,
	['--import', 'tsx', 'bench/upload-raw.ts', s3Endpoint, 'checkplate', file],
	{ encoding: 'utf8' }
);
if (raw.status !== 0) throw new Error(raw.stderr);
const rawResult = JSON.parse(raw.stdout.trim().split('\n').at(-1)!) as {
	seconds: number;
	growth: number;
};

await server.stop();
rmSync(dir, { recursive: true, force: true });

const MiB = 1024 * 1024;
const appRate = mb / appSeconds;
const rawRate = mb / rawResult.seconds;
console.log(`upload of ${mb.toFixed(1)} MB (${size} bytes)`);
console.log(
	`  through the app   ${appRate.toFixed(1)} MB/s   peak memory growth ${(appGrowth / MiB).toFixed(1)} MiB`
);
console.log(
	`  lib-storage alone ${rawRate.toFixed(1)} MB/s   peak memory growth ${(rawResult.growth / MiB).toFixed(1)} MiB`
);
console.log(`  speed ratio app/raw   ${(appRate / rawRate).toFixed(2)}   (target ≥ 0.5)`);
console.log(
	`  memory ratio app/raw  ${(appGrowth / rawResult.growth).toFixed(2)}   (target ≤ 1.2)`
);
console.log(
	JSON.stringify({
		megabytes: mb,
		appMs: appSeconds * 1000,
		rawMs: rawResult.seconds * 1000,
		speedRatio: appRate / rawRate,
		appGrowthMiB: appGrowth / MiB,
		rawGrowthMiB: rawResult.growth / MiB,
		memoryRatio: appGrowth / rawResult.growth
	})
);
