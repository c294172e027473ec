import { readdirSync } from 'node:fs';
import type { Page } from 'playwright-core';

/** pdf.js's two files as the built app serves them (the very bytes the board loads). */
export function servedPdfjs() {
	const assets = `${process.env.BUILD_DIR || 'build'}/client/_app/immutable/assets`;
	const files = readdirSync(assets);
	const find = (pattern: RegExp) => {
		const name = files.find((file) => pattern.test(file));
		if (!name) throw new Error(`pdf.js is not in ${assets}: build the app first`);
		return `/_app/immutable/assets/${name}`;
	};
	return {
		library: find(/^pdf\.min\.[\w-]+\.mjs$/),
		worker: find(/^pdf\.worker\.min\.[\w-]+\.mjs$/)
	};
}

/** The yardstick page: pdf.js alone, same options as the board, nothing else on the page. */
const yardstickHtml = (files: { library: string; worker: string }) => `<!doctype html>
<html><head><meta charset="utf-8"><style>body{margin:0;background:#e9ecf0}canvas{display:block}</style></head>
<body><canvas id="sheet"></canvas>
<script type="module">
import * as pdfjs from '${files.library}';
pdfjs.GlobalWorkerOptions.workerSrc = '${files.worker}';
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

/**
 * Opens the yardstick page at `alonePath` + `name` on the app's own origin (so the PDF route
 * sees the cookie). Only the page itself is answered by the test; pdf.js comes from the app, and
 * nothing else is intercepted, so its requests go as fast as the board's.
 */
export async function openPdfjsAlone(target: Page, baseUrl: string, name: string) {
	const html = yardstickHtml(servedPdfjs());
	const url = `${baseUrl}${alonePath}${name}`;
	await target.route(url, (route) => route.fulfill({ contentType: 'text/html', body: html }), {
		times: 1
	});
	await target.goto(url);
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
