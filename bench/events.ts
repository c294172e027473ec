// Live events under load, against the built app: 200 open event streams on one revision while
// 50 changes a second go in for 10 s (comments on the threads of the revision's features: a
// change whose own write is cheap, so the figure is the events' path, not the feature service's
// per-answer rulebook run). Delivery latency is from a change's request leaving to its `change`
// event arriving on each stream; the app's memory is sampled throughout. The
// yardstick, in the same run: a bare node:http server holding the same 200 streams, told over
// HTTP at the same rate to write one frame to all of them (no database, no access checks).
// Run with `npm run bench:events` after `npm run build`. Prints figures, then one line of JSON.
// Linux only (/proc for memory).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startApp } from '../tests/e2e/global-setup';
import { twoSheetPdf } from '../tests/fixtures/pdfs';
import { apiTokenFor } from './api-token';
import { rssBytes } from './memory';

const streams = Number(process.env.BENCH_STREAMS || 200);
const rate = Number(process.env.BENCH_RATE || 50);
const seconds = Number(process.env.BENCH_SECONDS || 10);
const writes = rate * seconds;
const buildDir = process.env.BUILD_DIR || 'build';
if (!existsSync(`${buildDir}/handler.js`)) throw new Error('No build: run `npm run build` first');

const MiB = 1024 * 1024;
const percentile = (values: number[], p: number) => {
	if (values.length === 0) return NaN;
	const sorted = [...values].sort((a, b) => a - b);
	return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
};
const ms = (value: number) => Math.round(value * 10) / 10;
const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

/**
 * Opens `count` SSE streams on `url`; `onFrame(key, at)` for each `change` frame, keyed by what
 * `keyOf` reads from its data. Resolves once every stream answered.
 */
async function openStreams(
	count: number,
	url: string,
	headers: Record<string, string>,
	keyOf: (data: string) => string,
	onFrame: (key: string, at: number) => void
) {
	const controller = new AbortController();
	const opened: Promise<void>[] = [];
	for (let i = 0; i < count; i++) {
		opened.push(
			(async () => {
				const response = await fetch(url, { headers, signal: controller.signal });
				if (!response.ok) throw new Error(`stream: ${response.status}`);
				const reader = response.body!.getReader();
				const decoder = new TextDecoder();
				let buffer = '';
				void (async () => {
					try {
						for (;;) {
							const { done, value } = await reader.read();
							if (done) return;
							const at = performance.now();
							buffer += decoder.decode(value, { stream: true });
							let cut: number;
							while ((cut = buffer.indexOf('\n\n')) >= 0) {
								const frame = buffer.slice(0, cut);
								buffer = buffer.slice(cut + 2);
								const data = /^data: (.*)$/m.exec(frame)?.[1];
								if (data && frame.startsWith('event: change')) onFrame(keyOf(data), at);
							}
						}
					} catch {
						// aborted at the end
					}
				})();
			})()
		);
	}
	await Promise.all(opened);
	return () => controller.abort();
}

/** Sends `writes` requests at `rate` a second; `send(i)` makes the i-th and resolves when answered. */
async function paced(send: (i: number) => Promise<void>) {
	const start = performance.now();
	const pending: Promise<void>[] = [];
	for (let i = 0; i < writes; i++) {
		const due = start + (i * 1000) / rate;
		const wait = due - performance.now();
		if (wait > 0) await sleep(wait);
		pending.push(send(i));
	}
	await Promise.all(pending);
	return performance.now() - start;
}

/** Samples a process's resident memory every 100 ms; `stop` gives the peak. */
function sampleMemory(pid: number) {
	let peak = rssBytes(pid);
	const timer = setInterval(() => (peak = Math.max(peak, rssBytes(pid))), 100);
	return () => {
		clearInterval(timer);
		return Math.max(peak, rssBytes(pid));
	};
}

interface Run {
	latencies: number[];
	expected: number;
	writeMs: number[];
	baseline: number;
	peak: number;
	elapsed: number;
}

/** Waits until every frame arrived (or 10 s passed). */
async function drained(latencies: number[], expected: number) {
	for (const deadline = Date.now() + 10_000; latencies.length < expected && Date.now() < deadline;)
		await sleep(50);
}

// ---- The app.
const dir = mkdtempSync(join(tmpdir(), 'checkplate-bench-events-'));
const server = await startApp(dir, { DEMO_PASSWORD: 'bench-password-1' });
const { baseUrl } = server;
const appPid = Number(
	spawnSync('pgrep', ['-P', String(server.process.pid), '-f', 'index.js'], {
		encoding: 'utf8'
	}).stdout.trim()
);
let bare: ReturnType<typeof spawn> | undefined;
let app: Run;
let yardstick: Run;
try {
	const token = await apiTokenFor(baseUrl, 'drafter@example.test', 'bench-password-1');
	const auth = { authorization: `Bearer ${token}` };
	const api = async (method: string, path: string, body?: unknown) => {
		const response = await fetch(`${baseUrl}/api/v1${path}`, {
			method,
			headers: {
				...auth,
				...(body === undefined || body instanceof FormData
					? {}
					: { 'content-type': 'application/json' })
			},
			body: body instanceof FormData ? body : body === undefined ? undefined : JSON.stringify(body)
		});
		if (!response.ok)
			throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`);
		return response.status === 204 ? null : response.json();
	};
	await api('POST', '/teams/kestrel/drawings', {
		number: 'BENCH-E',
		title: 'Live events bench',
		units: 'mm',
		standard: 'iso-8015'
	});
	const form = new FormData();
	form.set(
		'file',
		new Blob([(await twoSheetPdf('BENCH-E')) as BlobPart], { type: 'application/pdf' })
	);
	await api('POST', '/teams/kestrel/drawings/BENCH-E/revisions', form);
	const revision = '/teams/kestrel/drawings/BENCH-E/revisions/A';
	// A few features whose threads take the comments.
	const features: { id: string }[] = [];
	for (let i = 0; i < 10; i++) {
		features.push(
			await api('POST', `${revision}/features`, {
				kind: 'bore',
				label: `Bore ${i + 1}`,
				callout: `Ø${6 + i} H7`
			})
		);
	}

	// Each stream's arrival times by the changed item's id; joined with the send times after.
	const received = new Map<string, number[]>();
	let frames = 0;
	const baseline = rssBytes(appPid);
	const stopMemory = sampleMemory(appPid);
	const close = await openStreams(
		streams,
		`${baseUrl}/api/v1${revision}/events`,
		auth,
		(data) => (JSON.parse(data) as { id: string }).id,
		(key, at) => {
			frames++;
			received.set(key, [...(received.get(key) ?? []), at]);
		}
	);
	const writeMs: number[] = [];
	const sent: { id: string; at: number }[] = [];
	let refused = 0;
	const elapsed = await paced(async (i) => {
		const feature = features[i % features.length];
		const start = performance.now();
		try {
			const comment = await api('POST', `${revision}/features/${feature.id}/comments`, {
				body: `Change ${i}: check the chamfer.`
			});
			sent.push({ id: comment.id, at: start });
		} catch {
			refused++;
		}
		writeMs.push(performance.now() - start);
	});
	if (refused > 0) console.log(`  ${refused} changes refused`);
	for (const deadline = Date.now() + 10_000; frames < writes * streams && Date.now() < deadline;)
		await sleep(50);
	const peak = stopMemory();
	close();
	const latencies = sent.flatMap(({ id, at }) => (received.get(id) ?? []).map((t) => t - at));
	app = { latencies, expected: writes * streams, writeMs, baseline, peak, elapsed };

	// ---- The yardstick: bare node:http, the same streams and rate, no database.
	const script = `
		const http = require('node:http');
		const clients = new Set();
		const server = http.createServer((req, res) => {
			if (req.url === '/events') {
				res.writeHead(200, { 'content-type': 'text/event-stream', 'cache-control': 'no-store' });
				res.write(': live\\n\\n');
				clients.add(res);
				req.on('close', () => clients.delete(res));
				return;
			}
			let body = '';
			req.on('data', (c) => (body += c));
			req.on('end', () => {
				const { seq } = JSON.parse(body);
				const frame = 'event: change\\nid: ' + seq + '\\ndata: {"seq":' + seq + '}\\n\\n';
				for (const c of clients) c.write(frame);
				res.end('{}');
			});
		});
		server.listen(0, '127.0.0.1', () => console.log(server.address().port));`;
	bare = spawn(process.execPath, ['-e', script], { stdio: ['ignore', 'pipe', 'inherit'] });
	const port = await new Promise<number>((done) =>
		bare!.stdout!.once('data', (chunk: Buffer) => done(Number(chunk.toString().trim())))
	);
	const bareUrl = `http://127.0.0.1:${port}`;
	const bareSent = new Map<string, number>();
	const bareLatencies: number[] = [];
	const bareBaseline = rssBytes(bare.pid!);
	const stopBareMemory = sampleMemory(bare.pid!);
	const closeBare = await openStreams(
		streams,
		`${bareUrl}/events`,
		{},
		(data) => String((JSON.parse(data) as { seq: number }).seq),
		(key, at) => {
			const from = bareSent.get(key);
			if (from !== undefined) bareLatencies.push(at - from);
		}
	);
	const bareWriteMs: number[] = [];
	const bareElapsed = await paced(async (i) => {
		const start = performance.now();
		bareSent.set(String(i), start);
		const response = await fetch(`${bareUrl}/write`, {
			method: 'POST',
			body: JSON.stringify({ seq: i })
		});
		await response.text();
		bareWriteMs.push(performance.now() - start);
	});
	await drained(bareLatencies, writes * streams);
	const barePeak = stopBareMemory();
	closeBare();
	yardstick = {
		latencies: bareLatencies,
		expected: writes * streams,
		writeMs: bareWriteMs,
		baseline: bareBaseline,
		peak: barePeak,
		elapsed: bareElapsed
	};
} finally {
	bare?.kill();
	await server.stop();
	rmSync(dir, { recursive: true, force: true });
}

const line = (name: string, run: Run) =>
	`  ${name.padEnd(10)} delivered ${run.latencies.length}/${run.expected}   latency p50 ${ms(percentile(run.latencies, 50))} ms  p95 ${ms(percentile(run.latencies, 95))} ms  max ${ms(Math.max(...run.latencies))} ms   write p50 ${ms(percentile(run.writeMs, 50))} ms  p95 ${ms(percentile(run.writeMs, 95))} ms   ${writes} writes in ${ms(run.elapsed / 1000)} s   memory ${(run.baseline / MiB).toFixed(0)} → peak ${(run.peak / MiB).toFixed(0)} MiB`;
console.log(
	`Live events: ${streams} streams on one revision, ${rate} changes/s for ${seconds} s (${writes} changes, ${writes * streams} deliveries)`
);
console.log(line('app', app));
console.log(line('bare http', yardstick));
const p95 = percentile(app.latencies, 95);
console.log(
	`  delivery p95 ${ms(p95)} ms (target ≤ 1000 ms); against bare writes ${(p95 / percentile(yardstick.latencies, 95)).toFixed(1)}×`
);
console.log(
	JSON.stringify({
		streams,
		changesPerSecond: rate,
		seconds,
		delivered: app.latencies.length,
		expected: app.expected,
		deliveryP50Ms: ms(percentile(app.latencies, 50)),
		deliveryP95Ms: ms(p95),
		writeP95Ms: ms(percentile(app.writeMs, 95)),
		baselineRssMiB: Math.round(app.baseline / MiB),
		peakRssMiB: Math.round(app.peak / MiB),
		bareDeliveryP50Ms: ms(percentile(yardstick.latencies, 50)),
		bareDeliveryP95Ms: ms(percentile(yardstick.latencies, 95)),
		barePeakRssMiB: Math.round(yardstick.peak / MiB)
	})
);
