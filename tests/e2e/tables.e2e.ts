import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { settled } from './board-drawing';
import { launchBrowser, signIn } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;
let context: BrowserContext;
let page: Page;

/** Screenshots to look at by hand (PNG under /tmp). */
const shot = (name: string) => page.screenshot({ path: `/tmp/h20ui-${name}.png`, fullPage: true });

beforeAll(async () => {
	browser = await launchBrowser();
	context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
	page = await context.newPage();
	await signIn(page, baseUrl, 'checker@example.test');
});

afterAll(async () => {
	await browser?.close();
});

describe("a revision's features and fits tables", () => {
	it('the checker pairs Ø12 H7 on the bushing drawing with Ø12 g6 on the shaft drawing', async () => {
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1003/revisions/A/tables`);
		const features = page.getByRole('table', { name: 'Features' });
		await features.getByRole('row', { name: /Ø12 H7/ }).waitFor();
		await features
			.getByRole('row', { name: /Ø12 H7/ })
			.getByRole('button', { name: /Pair #\d+ Bore with/ })
			.click();
		await page.getByRole('dialog', { name: /Pair KF-1003 A #\d+ Bore with/ }).waitFor();
		// The dialog's title turns to "Fit saved" once the fit is added.
		const dialog = page.getByRole('dialog');
		const search = dialog.getByRole('combobox', { name: 'Shaft or pin that goes in' });
		await search.fill('KF-1002 g6');
		await dialog.getByRole('option', { name: /KF-1002 A #\d+ Journal/ }).waitFor();
		await search.press('Enter');
		await expect(dialog.getByTestId('fit-other-picked').textContent()).resolves.toContain(
			'Journal'
		);
		await dialog.getByLabel('The fit is meant as').selectOption('running');
		await dialog.getByRole('button', { name: 'Add fit' }).click();
		const view = dialog.getByTestId('fit-view');
		await view.waitFor();
		// ISO 286-2:2010, tables 2 and 17: H7 over 10 to 18 mm is 0/+0.018, g6 −0.006/−0.017, so
		// 0.006 at MMC and 0.035 at LMC.
		await expect(view.getByTestId('min-clearance').textContent()).resolves.toBe('0.006');
		await expect(view.getByTestId('max-clearance').textContent()).resolves.toBe('0.035');
		await expect(view.getByTestId('classification').textContent()).resolves.toContain('clearance');
		const diagram = view.getByTestId('fit-diagram').locator('svg');
		await expect(diagram.getAttribute('role')).resolves.toBe('img');
		expect((await diagram.boundingBox())!.width).toBeGreaterThan(200);
		await shot('fit-dialog');
		await dialog.getByRole('button', { name: 'Done' }).click();

		// The new fit is in the fits table; the shaft drawing lists it read-only.
		const fits = page.getByRole('table', { name: 'Fits' });
		await fits
			.getByRole('row', { name: /Journal.*0\.006.*0\.035/ })
			.first()
			.waitFor();
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1002/revisions/A/tables`);
		await page
			.getByRole('table', { name: 'Fits' })
			.getByRole('row', { name: /Journal.*read-only/ })
			.first()
			.click();
		await page.getByTestId('fit-read-only').waitFor();
		expect(await page.getByRole('button', { name: 'Edit fit' }).count()).toBe(0);
	});

	it("counts each feature's open findings", async () => {
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1002/revisions/A/tables`);
		const table = page.getByRole('table', { name: 'Features' });
		const column = await table
			.getByRole('columnheader')
			.allTextContents()
			.then((h) => h.findIndex((t) => t.includes('Open findings')));
		expect(column).toBeGreaterThan(0);
		const cell = (label: RegExp) =>
			table.getByRole('row', { name: label }).locator('td').nth(column).textContent();
		// The demo's KF-1002 F-1 (answered) is about the keyway; the journal has none open.
		await expect(cell(/Keyway width/)).resolves.toBe('1');
		await expect(cell(/Journal/)).resolves.toBe('0');
	});

	it('filters the features table and flies the board to the row picked by keyboard', async () => {
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1001/revisions/A/tables`);
		const table = page.getByRole('table', { name: 'Features' });
		await table.getByRole('row', { name: /Slot width/ }).waitFor();
		const all = await table.locator('tbody tr').count();
		expect(all).toBeGreaterThan(2);
		// Sorting: the limits column in order of exact value, then the other way.
		const limits = table.getByRole('columnheader', { name: 'Limits' });
		const firstLabel = () => table.locator('tbody tr').first().locator('td').nth(1).textContent();
		await limits.getByRole('button').click();
		await expect(limits.getAttribute('aria-sort')).resolves.toBe('ascending');
		await expect(firstLabel()).resolves.toBe('Dowel holes'); // Ø6 H7: 6.000 – 6.012
		await limits.getByRole('button').click();
		await expect(firstLabel()).resolves.toBe('Bushing bore'); // Ø18 H7: 18.000 – 18.018
		await page.getByPlaceholder('Filter features').fill('dowel');
		await expect(table.locator('tbody tr').count()).resolves.toBe(1);
		await expect(page.getByTestId('table-count').first().textContent()).resolves.toMatch(
			new RegExp(`1 of ${all} rows match`)
		);
		await shot('features-filtered');
		// Keyboard: down arrow from the filter box into the rows, then Enter on the row.
		await page.getByPlaceholder('Filter features').press('ArrowDown');
		await expect(page.evaluate(() => document.activeElement?.textContent ?? '')).resolves.toContain(
			'Dowel holes'
		);
		await page.keyboard.press('Enter');
		await page.waitForURL(/\/revisions\/A\?/);
		const url = new URL(page.url());
		expect(url.searchParams.get('sheet')).toBe('1');
		expect(url.searchParams.get('zoom')).toBe('200');
		expect(url.searchParams.get('show')).toMatch(/^feature-[0-9a-f-]{36}$/);
		expect(url.searchParams.get('centre')).toMatch(/^0\.\d{5},0\.\d{5}$/);
		const facts = await settled(page);
		// The board opened on the feature's sheet at 200 % or closer with its marker selected (where
		// the marker sits in the view is the board's to decide, beside its side panel).
		expect(facts.zoomPercent).toBeGreaterThanOrEqual(199);
		const selected = await page.evaluate(
			() =>
				(document.querySelector('[data-board]') as HTMLElement & { board: { selected: string } })
					.board.selected
		);
		expect(selected).toBe(url.searchParams.get('show'));
		expect(facts.sheet).toBe(1);
		await shot('board-from-table');
	});
});

describe('fits on the board', () => {
	it("pairs Ø12 H7 on the bushing drawing with Ø12 g6 on the shaft drawing from the bore's panel", async () => {
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1003/revisions/A`);
		await settled(page);
		// The bore from the side panel's list of placed features: the board flies to it.
		await page
			.getByRole('list', { name: 'Placed features' })
			.getByRole('button', { name: /Bore.*Ø12 H7/ })
			.click();
		const panel = page.locator('[data-selection-panel]');
		await panel.locator('[data-feature-panel]').waitFor();
		const fits = panel.locator('[data-revision-fits]');
		await fits.getByRole('button', { name: 'Pair with…' }).click();
		const dialog = page.getByRole('dialog', { name: /Pair KF-1003 A #\d+ Bore with/ });
		await dialog.waitFor();
		const search = dialog.getByRole('combobox', { name: 'Shaft or pin that goes in' });
		await search.fill('KF-1002 g6');
		await dialog.getByRole('option', { name: /KF-1002 A #\d+ Journal/ }).waitFor();
		await search.press('Enter');
		await dialog.getByLabel('The fit is meant as').selectOption('running');
		await dialog.getByRole('button', { name: 'Add fit' }).click();
		const view = page.getByRole('dialog').getByTestId('fit-view');
		await view.waitFor();
		// ISO 286-2:2010, tables 2 and 17: H7 over 10 to 18 mm is 0/+0.018, g6 −0.006/−0.017, so
		// 0.006 at MMC and 0.035 at LMC.
		await expect(view.getByTestId('min-clearance').textContent()).resolves.toBe('0.006');
		await expect(view.getByTestId('max-clearance').textContent()).resolves.toBe('0.035');
		const diagram = view.getByTestId('fit-diagram').locator('svg');
		expect((await diagram.boundingBox())!.width).toBeGreaterThan(200);
		await shot('board-fit-dialog');
		await page.getByRole('dialog').getByRole('button', { name: 'Done' }).click();
		// The bore's panel lists the new fit; opened, it shows the same values and the diagram.
		const listed = fits.locator('[data-fit]').filter({ hasText: /Journal.*0\.006 \/ 0\.035/ });
		await listed.first().getByRole('button').first().click();
		await listed.first().getByTestId('fit-diagram').waitFor();
		await shot('board-fit-listed');

		// On the shaft drawing's board the journal lists it read-only, linked to the bushing's board.
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1002/revisions/A`);
		await settled(page);
		const overview = page.locator('[data-revision-fits]');
		const shaftSide = overview.locator('[data-fit]').filter({ hasText: /Bore.*read-only/ });
		await shaftSide.first().getByRole('button').first().click();
		const readOnly = shaftSide.first().getByTestId('fit-read-only');
		await readOnly.waitFor();
		expect(await shaftSide.first().getByRole('button', { name: 'Edit fit' }).count()).toBe(0);
		const href = await readOnly.getByRole('link').getAttribute('href');
		expect(href).toMatch(/\/drawings\/KF-1003\/revisions\/A\?show=feature-[0-9a-f-]{36}$/);
		await shot('board-fit-read-only');
	});
});
