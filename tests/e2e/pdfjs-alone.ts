import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';

const require = createRequire(import.meta.url);
const pdfjsBuild = join(dirname(require.resolve('pdfjs-dist/package.json')), 'build');

/** The yardstick page: pdf.js alone, same options as the board, nothing else on the page. */
const html = `<!doctype html>
<html><head><meta charset="utf-8"><style>body{margin:0;background:#e9ecf0}canvas{display:block}</style></head>
<body><canvas id="sheet"></canvas>
<script type="module">
import * as pdfjs from './pdf.mjs';
pdfjs.GlobalWorkerOptions.workerSrc = new URL('./pdf.worker.mjs', location.href).href;
const options = { isEvalSupported: false, disableAutoFetch: true, disableStream: true };
const query = new URLSearchParams(location.search);
let document;
async function open(url) {
	document ??= await pdfjs.getDocument({ url, ...options }).promise;
	return document;
}
/** Draws a region of a sheet exactly as asked: scale and offset in device pixels. */
window.renderRegion = async (request) => {
	const page = await (await open(request.url)).getPage(request.sheet);
	const canvas = window.document.getElementById('sheet');
	canvas.width = request.width;
	canvas.height = request.height;
	canvas.style.width = request.cssWidth + 'px';
	canvas.style.height = request.cssHeight + 'px';
	const viewport = page.getViewport({ scale: request.scale, offsetX: request.offsetX, offsetY: request.offsetY });
	const started = performance.now();
	await page.render({ canvas, viewport, background: '#ffffff' }).promise;
	return performance.now() - started;
};
// ?file=…&fit=W,H: open and draw sheet 1 whole into a W × H CSS-pixel box at once, as a bare
// pdf.js page would, and mark when it is drawn.
if (query.get('file')) {
	const [boxWidth, boxHeight] = query.get('fit').split(',').map(Number);
	const page = await (await open(query.get('file'))).getPage(1);
	const base = page.getViewport({ scale: 1 });
	const css = Math.min(boxWidth / base.width, boxHeight / base.height);
	const ratio = window.devicePixelRatio || 1;
	await window.renderRegion({
		url: query.get('file'), sheet: 1, scale: css * ratio, offsetX: 0, offsetY: 0,
		width: Math.floor(base.width * css * ratio), height: Math.floor(base.height * css * ratio),
		cssWidth: base.width * css, cssHeight: base.height * css
	});
	performance.mark('alone:first-sheet');
}
window.aloneReady = true;
</script></body></html>`;

export const alonePath = '/__pdfjs-alone/';

/** Serves the yardstick page and pdf.js from the app's own origin (so the PDF route sees the cookie). */
export async function routePdfjsAlone(context: BrowserContext, baseUrl: string) {
	await context.route(`${baseUrl}${alonePath}**`, async (route) => {
		const name = new URL(route.request().url()).pathname.slice(alonePath.length);
		if (name === 'pdf.mjs' || name === 'pdf.worker.mjs') {
			const file = name === 'pdf.mjs' ? 'pdf.min.mjs' : 'pdf.worker.min.mjs';
			await route.fulfill({
				contentType: 'text/javascript',
				body: readFileSync(join(pdfjsBuild, file))
			});
		} else {
			await route.fulfill({ contentType: 'text/html', body: html });
		}
	});
}

export interface RegionRequest {
	url: string;
	sheet: number;
	scale: number;
	offsetX: number;
	offsetY: number;
	width: number;
	height: number;
	cssWidth: number;
	cssHeight: number;
}

/** Draws a region with pdf.js alone in `page` (already on the yardstick page); its milliseconds. */
export async function renderAlone(page: Page, request: RegionRequest): Promise<number> {
	await page.waitForFunction(() => (window as unknown as { aloneReady?: boolean }).aloneReady);
	return page.evaluate(
		(r) =>
			(window as unknown as { renderRegion: (r: RegionRequest) => Promise<number> }).renderRegion(
				r
			),
		request
	);
}
