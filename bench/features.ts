// The features table with 5,000 features on one revision, in headless Chromium against the built
// app, each figure beside its yardstick from the same run: the table's first render and a filter
// keystroke against the same rows as a plain HTML table (every row in the page, a naive filter
// that hides rows); GET …/features over HTTP, and in-process the service that answers it
// (values and rulebook per feature) against the raw query underneath. Run with
// `npm run bench:features` after `npm run build`. Prints figures, then one line of JSON.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { eq } from 'drizzle-orm';
import { uploadBoardDrawing } from '../tests/e2e/board-drawing';
import { launchBrowser, signIn } from '../tests/e2e/browser';
import { startApp } from '../tests/e2e/global-setup';
import type { FeatureJson } from '../src/lib/features';
import { featureTableRow, type FeatureTableRow } from '../src/lib/tables';

const runs = Number(process.env.BENCH_RUNS || 5);
const count = 5000;
const buildDir = process.env.BUILD_DIR || 'build';
if (!existsSync(`${buildDir}/handler.js`)) throw new Error('No build: run `npm run build` first');

const median = (values: number[]) => {
	const sorted = [...values].sort((a, b) => a - b);
	return sorted[Math.floor((sorted.length - 1) / 2)];
};
const ms = (value: number) => Math.round(value * 10) / 10;

/** 5,000 features of several kinds, with ISO 286 codes, plain sizes and ± tolerances. */
function featuresCsv() {
	const lines = ['label,kind,internal,callout,quantity'];
	for (let i = 0; i < count; i++) {
		const d = 3 + (i % 117);
		const kinds = [
			['Bore', 'bore', `Ø${d} H7`],
			['Pin', 'pin', `Ø${d} g6`],
			['Width', 'width', `${d} ±0.1`],
			['Hole', 'hole', `Ø${d}.5 +0.05/0`]
		] as const;
		const [label, kind, callout] = kinds[i % kinds.length];
		lines.push(`${label} ${i + 1},${kind},,${callout},${1 + (i % 4)}`);
	}
	return lines.join('\n');
}

/** The yardstick: the same rows and columns as a plain table, every row in the page. */
function plainPage(rows: FeatureTableRow[]) {
	const escape = (text: string) => text.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
	const cells = (r: FeatureTableRow) =>
		[
			r.balloon,
			r.label,
			r.callout,
			r.lower === null ? '' : `${r.lower} – ${r.upper}`,
			r.mmc ?? '',
			r.lmc ?? '',
			r.envelope === null ? '' : r.envelope ? 'applies' : 'no',
			r.quantity,
			r.location ? `sheet ${r.location.sheet}` : 'not placed',
			''
		]
			.map((v) => `<td>${escape(String(v))}</td>`)
			.join('');
	return `<!doctype html><html><head><meta charset="utf-8"><title>plain</title></head><body>
<input type="search" id="filter"><table><thead><tr><th>Balloon</th><th>Label</th><th>Callout</th>
<th>Limits</th><th>MMC</th><th>LMC</th><th>Envelope</th><th>Qty</th><th>Sheet</th><th>Findings</th></tr></thead>
<tbody>${rows.map((r) => `<tr>${cells(r)}</tr>`).join('')}</tbody></table>
<script>
const rows = [...document.querySelectorAll('tbody tr')];
document.getElementById('filter').addEventListener('input', (e) => {
	const q = e.target.value.toLowerCase();
	for (const tr of rows) tr.hidden = !tr.textContent.toLowerCase().includes(q);
});
performance.mark('table:Features');
</script></body></html>`;
}

/** From the HTML's last byte to the table mounted, and from navigation start. */
async function firstRender(page: Page, url: string) {
	await page.goto(url);
	await page.waitForFunction(() => performance.getEntriesByName('table:Features').length > 0);
	return page.evaluate(() => {
		const mark = performance.getEntriesByName('table:Features')[0].startTime;
		const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
		return { client: mark - nav.responseEnd, total: mark };
	});
}

/** One keystroke's filter: input event to the next frame painted. */
async function keystroke(page: Page, selector: string, text: string) {
	return page.evaluate(
		async ({ selector, text }) => {
			const input = document.querySelector(selector) as HTMLInputElement;
			const start = performance.now();
			input.value = text;
			input.dispatchEvent(new Event('input', { bubbles: true }));
			await new Promise((done) => requestAnimationFrame(() => setTimeout(done, 0)));
			return performance.now() - start;
		},
		{ selector, text }
	);
}

const dir = mkdtempSync(join(tmpdir(), 'checkplate-bench-features-'));
const server = await startApp(dir);
const { baseUrl } = server;
const browser = await launchBrowser();
const figures: Record<string, number> = {};
let revisionPath = '';
try {
	const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
	// 5,000 rows take a while on a busy machine: no request or page step gives up early.
	context.setDefaultTimeout(600_000);
	context.setDefaultNavigationTimeout(600_000);
	const page = await context.newPage();
	await signIn(page, baseUrl, 'drafter@example.test');
	const boardPath = await uploadBoardDrawing(page, baseUrl, 'BENCH-F', 50);
	revisionPath = boardPath;
	const api = `${baseUrl}/api/v1${boardPath}`;
	const importStart = performance.now();
	const imported = await page.request.post(`${api}/features/import`, {
		headers: { origin: new URL(baseUrl).origin },
		timeout: 0,
		multipart: {
			file: { name: 'features.csv', mimeType: 'text/csv', buffer: Buffer.from(featuresCsv()) }
		}
	});
	if (imported.status() !== 201) throw new Error(`import: ${imported.status()}`);
	const importMs = performance.now() - importStart;

	// ---- GET …/features over HTTP (warm-up first).
	const gets: number[] = [];
	let answer: FeatureJson[] = [];
	for (let run = 0; run <= runs; run++) {
		const start = performance.now();
		const response = await page.request.get(`${api}/features`, { timeout: 0 });
		answer = await response.json();
		if (run > 0) gets.push(performance.now() - start);
	}
	if (answer.length !== count) throw new Error(`expected ${count} features, got ${answer.length}`);

	// ---- First render and a filter keystroke: our table against the plain one, alternating.
	const plainHtml = plainPage(answer.map(featureTableRow));
	await page.route(`${baseUrl}/__plain/**`, (route) =>
		route.fulfill({ contentType: 'text/html', body: plainHtml })
	);
	const ours = { client: [] as number[], total: [] as number[], key: [] as number[] };
	const plain = { client: [] as number[], total: [] as number[], key: [] as number[] };
	const search = '[data-table="Features"] input[type="search"]';
	for (let run = 0; run <= runs; run++) {
		const o = await firstRender(page, `${baseUrl}${boardPath}/tables`);
		const oKey = [await keystroke(page, search, 'H'), await keystroke(page, search, 'H7')];
		const p = await firstRender(page, `${baseUrl}/__plain/features.html`);
		const pKey = [await keystroke(page, '#filter', 'H'), await keystroke(page, '#filter', 'H7')];
		if (run === 0) continue;
		ours.client.push(o.client);
		ours.total.push(o.total);
		ours.key.push(...oKey);
		plain.client.push(p.client);
		plain.total.push(p.total);
		plain.key.push(...pKey);
	}
	Object.assign(figures, {
		tableFirstRender: ms(median(ours.client)),
		plainFirstRender: ms(median(plain.client)),
		tablePageTotal: ms(median(ours.total)),
		plainPageTotal: ms(median(plain.total)),
		tableKeystroke: ms(median(ours.key)),
		plainKeystroke: ms(median(plain.key)),
		getFeatures: ms(median(gets)),
		importCsv: ms(importMs)
	});
} finally {
	await browser.close();
	await server.stop();
}

// ---- In process, on the app's data: the service behind GET …/features against its raw query.
const { openPglite } = await import('../src/lib/server/db/connect');
const { drawings, revisions, teams } = await import('../src/lib/server/db/schema');
const { listFeatures } = await import('../src/lib/server/db/queries/features');
const { featuresOf } = await import('../src/lib/server/features');
const database = await openPglite(dir);
try {
	const [place] = await database.db
		.select({ team: teams, drawing: drawings, revision: revisions })
		.from(revisions)
		.innerJoin(drawings, eq(drawings.id, revisions.drawingId))
		.innerJoin(teams, eq(teams.id, drawings.teamId))
		.where(eq(drawings.number, 'BENCH-F'));
	const service: number[] = [];
	const raw: number[] = [];
	for (let run = 0; run <= runs; run++) {
		let start = performance.now();
		await listFeatures(database.db, place.revision.id);
		if (run > 0) raw.push(performance.now() - start);
		start = performance.now();
		await featuresOf(database.db, place);
		if (run > 0) service.push(performance.now() - start);
	}
	figures.featuresService = ms(median(service));
	figures.rawQuery = ms(median(raw));
} finally {
	await database.close();
	rmSync(dir, { recursive: true, force: true });
}

console.log(`features table, ${count} features on ${revisionPath}, median of ${runs} runs`);
console.log(
	`  first render (HTML received → table mounted): ${figures.tableFirstRender} ms; plain table of every row ${figures.plainFirstRender} ms`
);
console.log(
	`  page total (navigation → table mounted): ${figures.tablePageTotal} ms; plain ${figures.plainPageTotal} ms`
);
console.log(
	`  filter keystroke (input → next frame): ${figures.tableKeystroke} ms; plain ${figures.plainKeystroke} ms`
);
console.log(`  GET …/features over HTTP: ${figures.getFeatures} ms`);
console.log(`  POST …/features/import of the ${count} rows (once): ${figures.importCsv} ms`);
console.log(
	`  in process: the service (values, rulebook) ${figures.featuresService} ms; raw query ${figures.rawQuery} ms`
);
console.log(JSON.stringify({ bench: 'features', features: count, runs, ...figures }));
