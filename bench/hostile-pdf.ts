// A 1.5 MB PDF of 20,000 pages uploaded while another client keeps asking: how soon the upload
// is refused, and how long the other client's requests take meanwhile, against the same requests
// on an idle app (the yardstick, measured in the same run). A second app with the page limit
// lifted shows the worst case: the worker walks the pages until its time limit while the app
// keeps answering. Run with `npm run bench:hostile-pdf` (needs a build).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { manyPagePdf } from '../tests/fixtures/pdfs';
import { demoPassword } from '../tests/e2e/browser';
import { startApp } from '../tests/e2e/global-setup';
import { apiTokenFor } from './api-token';

const pages = 20_000;
const pdf = manyPagePdf(pages);
const probe = `/api/v1/calc/size?callout=${encodeURIComponent('Ø25 H7')}&units=mm&standard=iso`;

/** Latencies (ms) of the probe, one after another, until `until` settles (or `count` done). */
async function probeWhile(baseUrl: string, until: Promise<unknown> | null, count = 40) {
	let done = false;
	void until?.finally(() => (done = true));
	const latencies: number[] = [];
	while (until ? !done : latencies.length < count) {
		const started = performance.now();
		const response = await fetch(baseUrl + probe);
		await response.arrayBuffer();
		if (!response.ok) throw new Error(`probe answered ${response.status}`);
		latencies.push(performance.now() - started);
	}
	return latencies;
}

async function run(env: Record<string, string>) {
	const dir = mkdtempSync(join(tmpdir(), 'checkplate-bench-'));
	const app = await startApp(dir, env);
	try {
		const token = await apiTokenFor(app.baseUrl, 'drafter@example.test', demoPassword);
		const auth = { authorization: `Bearer ${token}` };
		const number = `BENCH-${Date.now()}`;
		await fetch(`${app.baseUrl}/api/v1/teams/kestrel/drawings`, {
			method: 'POST',
			headers: { ...auth, 'content-type': 'application/json' },
			body: JSON.stringify({ number, title: 'Bench', units: 'mm', standard: 'iso-8015' })
		});
		const idle = await probeWhile(app.baseUrl, null);
		const form = new FormData();
		form.set('file', new Blob([pdf as BlobPart], { type: 'application/pdf' }), 'many.pdf');
		const started = performance.now();
		const upload = fetch(`${app.baseUrl}/api/v1/teams/kestrel/drawings/${number}/revisions`, {
			method: 'POST',
			headers: auth,
			body: form
		}).then(async (response) => ({
			status: response.status,
			body: (await response.json()) as { error?: { code: string } },
			seconds: (performance.now() - started) / 1000
		}));
		const busy = await probeWhile(app.baseUrl, upload);
		return { ...(await upload), idle, busy };
	} finally {
		await app.stop();
		rmSync(dir, { recursive: true, force: true });
	}
}

const max = (values: number[]) => Math.max(...values);
const median = (values: number[]) =>
	[...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

const limited = await run({ SEED_DEMO: '1' });
const unlimited = await run({ SEED_DEMO: '1', MAX_PDF_PAGES: '100000', PDF_CHECK_SECONDS: '20' });

console.log(`a PDF of ${pages.toLocaleString('en')} pages, ${(pdf.length / 1e6).toFixed(2)} MB`);
for (const [label, result] of [
	['page limit 1,000 (default)', limited],
	['page limit lifted, 20 s check limit', unlimited]
] as const) {
	console.log(
		`  ${label}: ${result.status} ${result.body.error?.code ?? ''} after ${result.seconds.toFixed(2)} s`
	);
	console.log(
		`    other client, idle app:  median ${median(result.idle).toFixed(1)} ms, max ${max(result.idle).toFixed(1)} ms (${result.idle.length} requests)`
	);
	console.log(
		`    other client, meanwhile: median ${median(result.busy).toFixed(1)} ms, max ${max(result.busy).toFixed(1)} ms (${result.busy.length} requests)`
	);
}
console.log(
	JSON.stringify({
		pages,
		bytes: pdf.length,
		refusedSeconds: limited.seconds,
		refusedCode: limited.body.error?.code,
		refusedMaxOtherMs: max(limited.busy),
		idleMaxOtherMs: max(limited.idle),
		liftedSeconds: unlimited.seconds,
		liftedCode: unlimited.body.error?.code,
		liftedMaxOtherMs: max(unlimited.busy),
		liftedMedianOtherMs: median(unlimited.busy)
	})
);
