import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, watchOutsideRequests } from './browser';
import { geometricSymbols, modifierSymbols } from '../../src/lib/symbols';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

describe('app shell', () => {
	it('shows the product name, the navigation and the advisory line, from 127.0.0.1 only', async () => {
		const page = await browser.newPage();
		const outside = watchOutsideRequests(page, baseUrl);
		await page.goto(baseUrl, { waitUntil: 'networkidle' });
		await expect(page.getByRole('link', { name: 'Checkplate' }).first().isVisible()).resolves.toBe(
			true
		);
		const nav = page.getByRole('navigation', { name: 'Main' });
		expect(await nav.getByRole('link').allTextContents()).toEqual([
			'Teams',
			'Calculator',
			'Rulebook',
			'Symbols'
		]);
		expect(await page.textContent('footer')).toContain('advisory');
		await page.keyboard.press('Tab');
		expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe(
			'Skip to content'
		);
		await screenshot(page, 'app-shell');
		expect(outside).toEqual([]);
		await page.close();
	});
});

describe('/symbols', () => {
	it('draws every GD&T symbol with the shipped fonts', async () => {
		const page = await browser.newPage();
		const outside = watchOutsideRequests(page, baseUrl);
		await page.goto(`${baseUrl}/symbols`, { waitUntil: 'networkidle' });
		await page.evaluate(() => document.fonts.ready);
		for (const symbol of [...geometricSymbols, ...modifierSymbols]) {
			const glyph = page.locator(`[data-glyph="${symbol.codePoint}"]`);
			expect(await glyph.textContent()).toBe(symbol.glyph);
		}
		// Each glyph must come from a shipped face, not a system fallback: the browser reports
		// which loaded face it used only indirectly, so check that every face needed has loaded.
		const loaded = await page.evaluate(
			async (glyphs) => {
				const results: Record<string, boolean> = {};
				for (const g of glyphs)
					results[g] = await document.fonts
						.load(`16px "Checkplate Symbols"`, g)
						.then((faces) => faces.length > 0);
				return results;
			},
			[...geometricSymbols, ...modifierSymbols].map((s) => s.glyph)
		);
		for (const [glyph, ok] of Object.entries(loaded))
			expect(ok, `no shipped face for ${glyph}`).toBe(true);
		await screenshot(page, 'symbols');
		expect(outside).toEqual([]);
		await page.close();
	});
});
