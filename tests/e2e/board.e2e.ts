import { writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { regionRender } from '../../src/lib/board/view';
import type { Marker } from '../../src/lib/board/markers';
import { a0, boardTargets } from '../fixtures/pdfs';
import { boardFacts as facts, settled, uploadBoardDrawing } from './board-drawing';
import { artifactsDir, launchBrowser, screenshot, signIn, watchOutsideRequests } from './browser';
import { openPdfjsAlone, renderAlone } from './pdfjs-alone';
import { colourCentre, comparePngs } from './pixels';

const baseUrl = inject('baseUrl');
const size = { width: 1280, height: 900 };
let browser: Browser;
let context: BrowserContext;
let boardPath: string;
let fileUrl: string;

async function addMarkers(page: Page, markers: Marker[]) {
	await page.evaluate((markers) => {
		const root = document.querySelector('[data-board]') as HTMLElement & {
			board: { addMarkers: (m: Marker[]) => void };
		};
		root.board.addMarkers(markers);
	}, markers);
	// Drawn on the next animation frame.
	await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => done(null))));
}

/** The board's sheet canvas as a PNG (the marker layer and its overlays included). */
async function sheetShot(page: Page, name: string) {
	const png = await page.locator('[data-board-viewport]').screenshot();
	writeFileSync(`${artifactsDir}/${name}.png`, png);
	return png;
}

// The blue squares of the test sheets, on the displayed page. By hand: sheet 1 is upright, so
// x = X / width and y = 1 − Y / height; sheet 2 is turned 90° clockwise inside its crop box,
// which carries the crop box's top-left corner (x0, y1) to the top-right of the display.
const target1 = { x: boardTargets.sheet1.x / a0.width, y: 1 - boardTargets.sheet1.y / a0.height };
const crop = boardTargets.sheet2Crop;
const target2 = {
	x: 1 - (crop.y1 - boardTargets.sheet2.y) / (crop.y1 - crop.y0),
	y: (boardTargets.sheet2.x - crop.x0) / (crop.x1 - crop.x0)
};
const blue: [number, number, number] = [0, 0, 255];
const critical: [number, number, number] = [0xb4, 0x23, 0x18];

beforeAll(async () => {
	browser = await launchBrowser();
	context = await browser.newContext({ viewport: size, deviceScaleFactor: 1 });
	const page = await context.newPage();
	await signIn(page, baseUrl, 'drafter@example.test');
	const number = `BRD-${Date.now() % 100000}`;
	boardPath = await uploadBoardDrawing(page, baseUrl, number);
	fileUrl = `/api/v1/teams/kestrel/drawings/${number}/revisions/A/file`;
	await page.close();
});
afterAll(async () => {
	await browser?.close();
});

describe('the board', () => {
	it('draws the whole A0 sheet and 800 % as pdf.js alone draws the same region', async () => {
		const page = await context.newPage();
		const outside = watchOutsideRequests(page, baseUrl);
		await page.goto(`${baseUrl}${boardPath}`);
		await page
			.getByRole('status')
			.filter({ hasText: /Opening the drawing|Drawing sheet/ })
			.or(page.locator('[data-board-sheet]'))
			.first()
			.waitFor();
		const fit = await settled(page);
		await screenshot(page, 'board-fit');
		expect(fit.zoomPercent).toBeLessThan(30);
		const box = (await page.locator('[data-board-viewport]').boundingBox())!;
		const alone = await context.newPage();
		await openPdfjsAlone(alone, baseUrl, 'region.html');

		// Whole sheet: the picture is drawn at this scale and placed on whole pixels.
		const fitRegion = regionRender(fit.view, fit.page, fit.viewport, 1);
		const pageBox = {
			x: Math.round(fitRegion.offsetX),
			y: Math.round(fitRegion.offsetY),
			width: Math.floor(fit.page.width * fitRegion.scale),
			height: Math.floor(fit.page.height * fitRegion.scale)
		};
		await renderAlone(alone, {
			...fitRegion,
			url: fileUrl,
			sheet: 1,
			offsetX: pageBox.x,
			offsetY: pageBox.y,
			cssWidth: fit.viewport.width,
			cssHeight: fit.viewport.height
		});
		const clip = { ...pageBox, width: pageBox.width - 1, height: pageBox.height - 1 };
		const ours = await page.screenshot({ clip: { ...clip, x: box.x + clip.x, y: box.y + clip.y } });
		const theirs = await alone.screenshot({ clip });
		writeFileSync(`${artifactsDir}/board-fit-sheet.png`, ours);
		writeFileSync(`${artifactsDir}/board-fit-pdfjs-alone.png`, theirs);
		const wholeSheet = await comparePngs(page, ours, theirs);
		expect(wholeSheet.sameSize).toBe(true);
		expect(wholeSheet.differing).toBeLessThan(0.01);

		// 800 %, around the blue square: the sharp viewport replaces the picture.
		await page.goto(`${baseUrl}${boardPath}?zoom=800&centre=0.3,0.22`);
		const close = await settled(page);
		expect(close.zoomPercent).toBe(800);
		const region = regionRender(close.view, close.page, close.viewport, 1);
		await renderAlone(alone, {
			...region,
			url: fileUrl,
			sheet: 1,
			cssWidth: close.viewport.width,
			cssHeight: close.viewport.height
		});
		const sharp = await sheetShot(page, 'board-800');
		const sharpAlone = await alone.locator('canvas').screenshot();
		writeFileSync(`${artifactsDir}/board-800-pdfjs-alone.png`, sharpAlone);
		const atEight = await comparePngs(page, sharp, sharpAlone);
		expect(atEight.sameSize).toBe(true);
		expect(atEight.differing).toBeLessThan(0.002);
		expect(outside).toEqual([]);
		await alone.close();
		await page.close();
	});

	it('puts a marker on the right pixel at both zooms and on the turned, cropped sheet', async () => {
		const page = await context.newPage();
		const cases = [
			{ sheet: 1, target: target1, query: '' },
			// Off-centre on purpose, so the view's offset is part of what is checked.
			{
				sheet: 1,
				target: target1,
				query: `&zoom=800&centre=${target1.x + 0.004},${target1.y - 0.003}`
			},
			{ sheet: 2, target: target2, query: '' },
			{
				sheet: 2,
				target: target2,
				query: `&zoom=800&centre=${target2.x - 0.003},${target2.y + 0.004}`
			}
		];
		for (const [index, { sheet, target, query }] of cases.entries()) {
			await page.goto(`${baseUrl}${boardPath}?sheet=${sheet}${query}`);
			const shown = await settled(page);
			expect(shown.sheet).toBe(sheet);
			const square = await colourCentre(page, await sheetShot(page, `board-target-${index}`), blue);
			expect(square).not.toBeNull();
			await addMarkers(page, [
				{ id: 'target', label: '', tone: 'critical', location: { sheet, ...target } }
			]);
			const marker = await colourCentre(
				page,
				await sheetShot(page, `board-marker-${index}`),
				critical,
				24
			);
			expect(marker).not.toBeNull();
			expect(Math.abs(marker!.x - square!.x)).toBeLessThan(1.5);
			expect(Math.abs(marker!.y - square!.y)).toBeLessThan(1.5);
		}
		await page.close();
	});

	it('keeps the view in the URL: a link restores it, back and forward step through it', async () => {
		const page = await context.newPage();
		await page.goto(`${baseUrl}${boardPath}?sheet=2&zoom=250&centre=0.3,0.6`);
		let view = await settled(page);
		expect(view).toMatchObject({ sheet: 2, zoomPercent: 250 });
		expect(view.view.centre).toEqual({ x: 0.3, y: 0.6 });
		await expect(page.locator('[data-board-zoom]').textContent()).resolves.toBe('250 %');

		await page.locator('[data-board-viewport]').focus();
		await page.keyboard.press('+');
		await page.waitForURL(/zoom=312\.5/);
		const link = page.url();
		await page.goto(link);
		view = await settled(page);
		expect(view.zoomPercent).toBe(313);
		expect(view.view.centre.x).toBeCloseTo(0.3, 5);

		await page.getByRole('button', { name: 'Sheet 1', exact: true }).click();
		await page.waitForURL(/sheet=1/);
		expect((await settled(page)).sheet).toBe(1);
		await page.goBack();
		await page.waitForURL(/sheet=2/);
		view = await settled(page);
		expect(view).toMatchObject({ sheet: 2, zoomPercent: 313 });
		await page.goForward();
		await page.waitForURL(/sheet=1/);
		expect((await settled(page)).sheet).toBe(1);

		await page.goto(`${baseUrl}${boardPath}?sheet=7&zoom=lots`);
		await page.getByText('Part of this link was not understood').waitFor();
		expect((await settled(page)).sheet).toBe(1);
		await page.close();
	});

	it('moves with the keyboard, wheel and drag, and between markers with the keyboard', async () => {
		const page = await context.newPage();
		await page.goto(`${baseUrl}${boardPath}`);
		const fit = await settled(page);
		await page.locator('[data-board-viewport]').focus();
		await page.keyboard.press('+');
		expect((await facts(page)).view.zoom).toBeCloseTo(fit.view.zoom * 1.25, 9);
		await page.keyboard.press('-');
		await page.keyboard.press('-');
		expect((await facts(page)).view.zoom).toBeCloseTo(fit.view.zoom * 0.8, 9);
		await page.keyboard.press('0');
		await page.keyboard.press('+');
		await page.keyboard.press('ArrowRight');
		let now = await facts(page);
		expect(now.view.centre.x).toBeGreaterThan(0.5);
		expect(now.view.centre.y).toBe(0.5);
		await page.keyboard.press('ArrowDown');
		expect((await facts(page)).view.centre.y).toBeGreaterThan(0.5);
		await page.keyboard.press('PageDown');
		expect((await facts(page)).sheet).toBe(2);
		await page.keyboard.press('PageUp');
		now = await settled(page);
		expect(now.sheet).toBe(1);

		// The wheel zooms around the pointer: the page point under it stays there.
		await page.goto(`${baseUrl}${boardPath}?zoom=100&centre=${target1.x},${target1.y}`);
		now = await settled(page);
		const box = (await page.locator('[data-board-viewport]').boundingBox())!;
		const before = (await colourCentre(page, await sheetShot(page, 'board-wheel-0'), blue))!;
		const pointer = { x: Math.round(before.x) + 40, y: Math.round(before.y) - 30 };
		await page.mouse.move(box.x + pointer.x, box.y + pointer.y);
		for (let i = 0; i < 3; i++) await page.mouse.wheel(0, -200);
		const wheeled = await settled(page);
		const grown = wheeled.view.zoom / now.view.zoom;
		expect(grown).toBeGreaterThan(2);
		const after = (await colourCentre(page, await sheetShot(page, 'board-wheel-1'), blue))!;
		// The page point under the pointer stays there; the square's centre keeps its offset × zoom.
		expect(after.x).toBeCloseTo(pointer.x + (before.x - pointer.x) * grown, 0);
		expect(after.y).toBeCloseTo(pointer.y + (before.y - pointer.y) * grown, 0);

		// Dragging the sheet moves it with the pointer.
		await page.mouse.move(box.x + 300, box.y + 300);
		await page.mouse.down();
		await page.mouse.move(box.x + 400, box.y + 350, { steps: 5 });
		await page.mouse.up();
		const dragged = (await colourCentre(page, await sheetShot(page, 'board-drag'), blue))!;
		expect(dragged.x - after.x).toBeCloseTo(100, 0);
		expect(dragged.y - after.y).toBeCloseTo(50, 0);

		// Markers: hover shows the tooltip, arrows move the focus, Enter selects, drag moves.
		const at = await page.evaluate(() => {
			const b = (
				document.querySelector('[data-board]') as HTMLElement & {
					board: { toPage: (p: { x: number; y: number }) => { x: number; y: number } };
				}
			).board;
			return [
				b.toPage({ x: 200, y: 200 }),
				b.toPage({ x: 500, y: 200 }),
				b.toPage({ x: 300, y: 400 })
			];
		});
		await addMarkers(page, [
			{ id: 'feature-1', label: '1', title: 'Ø18 H7 bore', location: { sheet: 1, ...at[0] } },
			{
				id: 'feature-2',
				label: '2',
				title: '40 ±0.1 width',
				location: { sheet: 1, ...at[1] },
				movable: true
			},
			{
				id: 'finding-3',
				label: 'F-3',
				title: 'No limits',
				tone: 'major',
				location: { sheet: 1, ...at[2], w: 0.02, h: 0.01 },
				outline: 'cloud'
			}
		]);
		await page.mouse.move(box.x + 200, box.y + 200);
		await page.getByRole('tooltip').getByText('Ø18 H7 bore').waitFor();
		await sheetShot(page, 'board-markers');
		await page.locator('[data-board-markers]').focus();
		await page.keyboard.press('ArrowRight');
		await expect(page.getByRole('option').textContent()).resolves.toContain('Ø18 H7 bore');
		await page.keyboard.press('ArrowRight');
		await expect(page.getByRole('option').textContent()).resolves.toContain('40 ±0.1 width');
		await page.keyboard.press('Enter');
		await expect(page.getByRole('option').getAttribute('aria-selected')).resolves.toBe('true');
		await page.keyboard.press('ArrowRight');
		await expect(page.getByRole('option').textContent()).resolves.toContain('No limits');

		await page.mouse.move(box.x + 500, box.y + 200);
		await page.mouse.down();
		await page.mouse.move(box.x + 560, box.y + 260, { steps: 4 });
		await page.mouse.up();
		const moved = await page.evaluate(() => {
			const b = (
				document.querySelector('[data-board]') as HTMLElement & {
					board: {
						markers: Marker[];
						toScreen: (p: { x: number; y: number }) => { x: number; y: number };
					};
				}
			).board;
			return b.toScreen(b.markers.find((m) => m.id === 'feature-2')!.location);
		});
		expect(moved.x).toBeCloseTo(560, 0);
		expect(moved.y).toBeCloseTo(260, 0);
		await page.close();
	});

	it('says so when the drawing cannot be fetched, and offers the download', async () => {
		const page = await context.newPage();
		await page.route(`${baseUrl}${fileUrl}`, (route) =>
			route.fulfill({ status: 404, body: 'gone' })
		);
		await page.goto(`${baseUrl}${boardPath}`);
		const alert = page.getByRole('alert');
		await alert.getByText(/could not be fetched/).waitFor();
		await alert.getByRole('link', { name: 'download the PDF' }).waitFor();
		await screenshot(page, 'board-unreadable');
		await page.close();
	});
});
