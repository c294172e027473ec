// The board in headless Chromium against the built app, each figure beside its yardstick from
// the same run: time to the first sheet against pdf.js alone drawing it; frame times while
// panning and zooming with 2,000 markers against a naive Konva layer that redraws every marker
// each frame; the sharp region at 800 % against pdf.js alone drawing that region. Run with
// `npm run bench:board` after `npm run build`. Prints figures, then one line of JSON.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import type { Marker } from '../src/lib/board/markers';
import { regionRender } from '../src/lib/board/view';
import { settled, uploadBoardDrawing, waitForSheet } from '../tests/e2e/board-drawing';
import { launchBrowser, signIn } from '../tests/e2e/browser';
import { openPdfjsAlone, renderAlone, servedPdfjs } from '../tests/e2e/pdfjs-alone';
import { startApp } from '../tests/e2e/global-setup';
import { naivePage } from './board-naive';

const runs = Number(process.env.BENCH_RUNS || 5);
const markerCount = 2000;
const buildDir = process.env.BUILD_DIR || 'build';
if (!existsSync(`${buildDir}/handler.js`)) throw new Error('No build: run `npm run build` first');

const dir = mkdtempSync(join(tmpdir(), 'checkplate-bench-board-'));
const server = await startApp(dir);
const { baseUrl } = server;

const median = (values: number[]) => percentile(values, 50);
function percentile(values: number[], p: number) {
	const sorted = [...values].sort((a, b) => a - b);
	return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

const browser = await launchBrowser();
try {
	const context = await browser.newContext({
		viewport: { width: 1280, height: 900 },
		deviceScaleFactor: 1
	});
	// Nothing is intercepted on the board's pages: interception slows every request.
	const konva = readFileSync(
		join(createRequire(import.meta.url).resolve('konva'), '../../konva.min.js')
	);
	const setup = await context.newPage();
	await signIn(setup, baseUrl, 'drafter@example.test');
	const boardPath = await uploadBoardDrawing(setup, baseUrl, 'BENCH-A0');
	const fileUrl = '/api/v1/teams/kestrel/drawings/BENCH-A0/revisions/A/file';
	await setup.close();

	// ---- Time to the first sheet (from navigation start), alternating, after one warm-up each.
	const ours: number[] = [];
	const alone: number[] = [];
	let box = { width: 0, height: 0 };
	for (let run = 0; run <= runs; run++) {
		const page = await context.newPage();
		await page.goto(`${baseUrl}${boardPath}`);
		await waitForSheet(page);
		const mark = await page.evaluate(
			() => performance.getEntriesByName('board:first-sheet')[0]?.startTime ?? NaN
		);
		box = await page.evaluate(() => {
			const element = document.querySelector('[data-board-viewport]')!;
			return { width: element.clientWidth - 24, height: element.clientHeight - 24 };
		});
		await page.close();
		const yardstick = await context.newPage();
		await openPdfjsAlone(
			yardstick,
			baseUrl,
			`first.html?file=${encodeURIComponent(fileUrl)}&fit=${box.width},${box.height}`
		);
		await yardstick.waitForFunction(() => performance.getEntriesByName('alone:first-sheet').length);
		const aloneMark = await yardstick.evaluate(
			() => performance.getEntriesByName('alone:first-sheet')[0].startTime
		);
		await yardstick.close();
		if (run > 0) {
			ours.push(mark);
			alone.push(aloneMark);
		}
	}

	// ---- Pan and zoom with 2,000 markers: the same pointer script on the board and the naive page.
	const markers = scatter(markerCount);
	const board = await context.newPage();
	await board.goto(`${baseUrl}${boardPath}`);
	await settled(board);
	await board.evaluate((markers) => {
		const root = document.querySelector('[data-board]') as HTMLElement & {
			board: { addMarkers: (m: Marker[]) => void };
		};
		root.board.addMarkers(markers);
	}, markers);
	await board.bringToFront();
	await board.evaluate(() => {
		const root = document.querySelector('[data-board]') as HTMLElement & {
			board: { drawTimes: number[] };
		};
		root.board.drawTimes.length = 0;
	});
	const boardFrames = await gestureFrames(board, '[data-board-viewport]');
	const drawTimes = await board.evaluate(
		() =>
			(document.querySelector('[data-board]') as HTMLElement & { board: { drawTimes: number[] } })
				.board.drawTimes
	);
	const drawn = await board.evaluate(
		() =>
			(document.querySelector('[data-board]') as HTMLElement & { board: { markersDrawn: number } })
				.board.markersDrawn
	);
	const naive = await context.newPage();
	await naive.route(`${baseUrl}/__naive/**`, (route) =>
		route.request().url().endsWith('konva.js')
			? route.fulfill({ contentType: 'text/javascript', body: konva })
			: route.fulfill({ contentType: 'text/html', body: naivePage(servedPdfjs()) })
	);
	await naive.goto(`${baseUrl}/__naive/index.html?file=${encodeURIComponent(fileUrl)}`);
	await naive.waitForFunction(() => (window as unknown as { naiveReady?: boolean }).naiveReady);
	await naive.evaluate((markers) => {
		(window as unknown as { addMarkers: (m: Marker[]) => void }).addMarkers(markers);
	}, markers);
	await naive.bringToFront();
	const naiveFrames = await gestureFrames(naive, '#viewport');
	await naive.close();

	// ---- The sharp region at 800 %: warm (the sheet's drawing instructions already built).
	await board.goto(`${baseUrl}${boardPath}?zoom=800&centre=0.3,0.22`);
	let view = await settled(board);
	const regionOurs: number[] = [];
	const regionAlone: number[] = [];
	const yardstick = await context.newPage();
	await openPdfjsAlone(yardstick, baseUrl, 'region.html');
	for (let run = 0; run <= runs; run++) {
		// pdf.js draws in animation-frame slices, which a page behind another one does not get.
		await board.bringToFront();
		await board.locator('[data-board-viewport]').focus();
		await board.keyboard.press(run % 2 ? 'ArrowLeft' : 'ArrowRight');
		await board.waitForFunction(
			() =>
				!(document.querySelector('[data-board]') as HTMLElement & { board: { idle: boolean } })
					.board.idle
		);
		view = await settled(board);
		const region = regionRender(view.view, view.page, view.viewport, 1);
		await yardstick.bringToFront();
		const aloneMs = await renderAlone(yardstick, {
			...region,
			url: fileUrl,
			sheet: 1,
			cssWidth: view.viewport.width,
			cssHeight: view.viewport.height
		});
		if (run > 0) {
			regionOurs.push(view.timings.sharp);
			regionAlone.push(aloneMs);
		}
	}

	const firstSheetMs = median(ours);
	const firstSheetAloneMs = median(alone);
	const panP50Ms = median(boardFrames);
	const panP95Ms = percentile(boardFrames, 95);
	const naiveP50Ms = median(naiveFrames);
	const naiveP95Ms = percentile(naiveFrames, 95);
	const regionMs = median(regionOurs);
	const regionAloneMs = median(regionAlone);
	const result = {
		firstSheetMs: round(firstSheetMs),
		firstSheetAloneMs: round(firstSheetAloneMs),
		firstSheetRatio: round(firstSheetMs / firstSheetAloneMs, 2),
		panP50Ms: round(panP50Ms),
		panP95Ms: round(panP95Ms),
		naiveP50Ms: round(naiveP50Ms),
		naiveP95Ms: round(naiveP95Ms),
		panRatioToNaive: round(panP95Ms / naiveP95Ms, 2),
		regionMs: round(regionMs),
		regionAloneMs: round(regionAloneMs),
		regionRatio: round(regionMs / regionAloneMs, 2),
		markers: markerCount,
		markersDrawnLastFrame: drawn,
		drawP95Ms: round(percentile(drawTimes, 95), 2),
		frames: boardFrames.length,
		naiveFrames: naiveFrames.length
	};
	console.log(`A0 sheet, 5,000 strokes; ${runs} runs each; Chromium headless, 1280 × 900, 1×`);
	console.log(
		`  first sheet visible   board ${result.firstSheetMs} ms   pdf.js alone ${result.firstSheetAloneMs} ms   ratio ${result.firstSheetRatio} (target ≤ 1.2)`
	);
	console.log(
		`  pan/zoom frames       board p50 ${result.panP50Ms} ms p95 ${result.panP95Ms} ms (${boardFrames.length} frames)   naive Konva p50 ${result.naiveP50Ms} ms p95 ${result.naiveP95Ms} ms (${naiveFrames.length} frames)`
	);
	console.log(
		`                        drawing work per frame p95 ${result.drawP95Ms} ms (${drawTimes.length} draws, ${drawn} markers in the last)`
	);
	console.log(
		`                        p95 ratio to naive ${result.panRatioToNaive} (target ≤ 0.3, p95 ≤ 33 ms)`
	);
	console.log(
		`  sharp region at 800 % board ${result.regionMs} ms   pdf.js alone ${result.regionAloneMs} ms   ratio ${result.regionRatio} (target ≤ 1.2)`
	);
	console.log(JSON.stringify(result));
} finally {
	await browser.close();
	await server.stop();
	rmSync(dir, { recursive: true, force: true });
}

function round(value: number, places = 1) {
	return Number(value.toFixed(places));
}

/** Markers spread over sheet 1, the same every run: points, with one area in ten. */
function scatter(count: number): Marker[] {
	let seed = 2000;
	const random = () => ((seed = (seed * 16807) % 2147483647) - 1) / 2147483646;
	return Array.from({ length: count }, (_, i) => {
		const x = 0.02 + random() * 0.9;
		const y = 0.02 + random() * 0.9;
		const area = i % 10 === 0;
		return {
			id: `bench-${i}`,
			label: String(i + 1),
			title: `Marker ${i + 1}`,
			tone: area ? 'finding' : 'feature',
			outline: area ? 'cloud' : undefined,
			location: area ? { sheet: 1, x, y, w: 0.04, h: 0.03 } : { sheet: 1, x, y }
		} satisfies Marker;
	});
}

/**
 * Drags and wheels over `selector` for a few seconds while the page records the time between
 * animation frames; returns those frame times in milliseconds.
 */
async function gestureFrames(page: Page, selector: string) {
	const area = (await page.locator(selector).boundingBox())!;
	const middle = { x: area.x + area.width / 2, y: area.y + area.height / 2 };
	// A string, not a function: tsx would wrap the inner function in a helper the page lacks.
	await page.evaluate(`(() => {
		window.recordedFrames = [];
		window.recording = true;
		let last = 0;
		const tick = (now) => {
			window.recordedFrames.push(now - last);
			last = now;
			if (window.recording) requestAnimationFrame(tick);
		};
		requestAnimationFrame((now) => {
			last = now;
			requestAnimationFrame(tick);
		});
	})()`);
	for (let round = 0; round < 3; round++) {
		await page.mouse.move(middle.x - 150, middle.y);
		await page.mouse.down();
		await page.mouse.move(middle.x + 150, middle.y + 60, { steps: 30 });
		await page.mouse.move(middle.x - 150, middle.y, { steps: 30 });
		await page.mouse.up();
		await page.mouse.move(middle.x, middle.y);
		for (let notch = 0; notch < 8; notch++) await page.mouse.wheel(0, -120);
		await page.mouse.down();
		await page.mouse.move(middle.x + 200, middle.y - 100, { steps: 30 });
		await page.mouse.move(middle.x, middle.y, { steps: 30 });
		await page.mouse.up();
		for (let notch = 0; notch < 8; notch++) await page.mouse.wheel(0, 120);
	}
	return page.evaluate(() => {
		const w = window as unknown as { recordedFrames: number[]; recording: boolean };
		w.recording = false;
		return w.recordedFrames.slice(1);
	});
}
