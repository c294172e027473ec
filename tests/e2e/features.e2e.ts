import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { Marker } from '../../src/lib/board/markers';
import { settled } from './board-drawing';
import { launchBrowser, screenshot, signIn } from './browser';

const baseUrl = inject('baseUrl');
const boardPath = '/teams/kestrel/drawings/KF-1003/revisions/A';
let browser: Browser;
let page: Page;

type BoardHandle = HTMLElement & {
	board: { markers: Marker[]; toScreen: (p: { x: number; y: number }) => { x: number; y: number } };
};

/** A feature marker's centre on the screen, and its location on the sheet. */
async function markerOf(page: Page, balloon: string) {
	const found = await page.evaluate((label) => {
		const board = (document.querySelector('[data-board]') as BoardHandle).board;
		const marker = board.markers.find((m) => m.label === label && m.id.startsWith('feature-'));
		return marker ? { location: marker.location, at: board.toScreen(marker.location) } : null;
	}, balloon);
	if (!found) throw new Error(`no marker ${balloon}`);
	const box = (await page.locator('[data-board-viewport]').boundingBox())!;
	return { location: found.location, x: box.x + found.at.x, y: box.y + found.at.y };
}

const panel = () => page.locator('[data-feature-panel]');
const value = (label: string) => panel().locator(`[data-value="${label}"]`);

beforeAll(async () => {
	browser = await launchBrowser();
	page = await browser.newPage({ viewport: { width: 1400, height: 950 }, deviceScaleFactor: 1 });
	await signIn(page, baseUrl, 'checker@example.test');
});
afterAll(async () => {
	await browser?.close();
});

describe('features on the board', () => {
	let balloon = '';

	it('places Ø12 H7 on the bushing drawing and shows its limits', async () => {
		await page.goto(`${baseUrl}${boardPath}`);
		await settled(page);
		await page.getByRole('button', { name: 'Place feature' }).click();
		await page.locator('[data-board-placing]').waitFor();
		const box = (await page.locator('[data-board-viewport]').boundingBox())!;
		// An empty stretch of the sheet, left of the section view.
		await page.mouse.click(box.x + box.width * 0.22, box.y + box.height * 0.72);
		await panel().getByRole('heading', { name: 'New feature' }).waitFor();

		const callout = page.getByLabel('Callout, as written on the drawing');
		await callout.fill('Ø12 ±0.1x');
		const error = page.getByTestId('feature-callout-error');
		// The parser's message under the field, the stray "x" (the 9th character) marked.
		await expect.poll(() => error.locator('mark').textContent()).toBe('x');
		expect(await error.textContent()).toContain('character 9');
		await screenshot(page, 'feature-callout-error');

		await callout.fill('Ø12 H7');
		await expect.poll(() => error.count()).toBe(0);
		await page.getByLabel('Label', { exact: true }).fill('Test bore');
		await page.getByRole('button', { name: 'Add feature' }).click();
		await panel()
			.getByRole('heading', { name: /^Balloon \d+$/ })
			.waitFor();
		balloon = (await panel()
			.getByRole('heading', { name: /^Balloon/ })
			.textContent())!.replace('Balloon ', '');
		// ISO 286-2:2010, table 2 (H7 over 10 to 18 mm: IT7 = 18 µm, lower deviation 0).
		expect(await value('Lower limit').textContent()).toBe('12.000');
		expect(await value('Upper limit').textContent()).toBe('12.018');
		expect(await value('MMC').textContent()).toBe('12.000');
		expect(await panel().getByTestId('caution').textContent()).toContain('advisory');
	});

	it('adds a position frame at MMC to datum A and shows the virtual condition', async () => {
		await page.getByRole('button', { name: 'Add a feature control frame' }).click();
		await page.getByLabel('Tolerance').fill('0.02');
		await page.getByLabel('Material condition').selectOption('mmc');
		await page.getByLabel('primary datum of frame 1').fill('A');
		const frame = panel().locator('[data-control-editor="0"] [data-control-frame]');
		expect(await frame.textContent()).toMatch(/⌖\s*⌀0\.02 Ⓜ\s*A/);
		await page.getByRole('button', { name: 'Save changes' }).click();
		await panel().locator('[data-computed-control="0"]').waitFor();
		// A hole at MMC: VC = MMC − t = 12.000 − 0.020; RC = LMC + t + T = 12.018 + 0.020 + 0.018
		// (ASME Y14.5-2018 virtual and resultant condition, as PRODUCT.md §4 states them; recalled).
		expect(await value('Virtual condition').textContent()).toBe('11.980');
		expect(await value('Resultant condition').textContent()).toBe('12.056');
		await screenshot(page, 'feature-computed');
	});

	it('moves the marker by dragging it, and it stays moved after a reload', async () => {
		const before = await markerOf(page, balloon);
		await page.mouse.move(before.x, before.y);
		await page.mouse.down();
		await page.mouse.move(before.x + 40, before.y + 10, { steps: 5 });
		await page.mouse.move(before.x + 80, before.y + 20, { steps: 5 });
		const saved = page.waitForResponse(
			(r) => r.request().method() === 'PATCH' && r.url().includes('/features/')
		);
		await page.mouse.up();
		expect((await saved).status()).toBe(200);
		await page.reload();
		await settled(page);
		const after = await markerOf(page, balloon);
		expect(after.location.x).toBeGreaterThan(before.location.x + 0.01);
		expect(after.location.y).toBeGreaterThan(before.location.y);
	});

	it('deletes the feature after a confirmation', async () => {
		// The link kept the moved marker selected (`?show=`); from the list otherwise.
		const heading = panel().getByRole('heading', { name: `Balloon ${balloon}` });
		if ((await heading.count()) === 0) {
			await page
				.getByRole('list', { name: 'Placed features' })
				.getByRole('button', { name: /Test bore/ })
				.click();
		}
		await heading.waitFor();
		await panel().getByRole('button', { name: 'Delete…' }).click();
		const dialog = page.getByRole('dialog', { name: `Delete balloon ${balloon}?` });
		await dialog.waitFor();
		await dialog.getByRole('button', { name: 'Delete' }).click();
		await page.getByText(`Balloon ${balloon} deleted.`).waitFor();
		expect(
			await page.getByRole('list', { name: 'Placed features' }).getByText('Test bore').count()
		).toBe(0);
	});
});
