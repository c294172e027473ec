import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, watchOutsideRequests } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

describe('/rules', () => {
	it('lists every rule with its severity and the advisory caution', async () => {
		const page = await browser.newPage();
		const outside = watchOutsideRequests(page, baseUrl);
		await page.goto(`${baseUrl}/rules`, { waitUntil: 'networkidle' });
		await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Rulebook');
		const codes = await page.locator('tbody td:first-child a').allTextContents();
		expect(codes).toHaveLength(22);
		expect(codes[0]).toBe('LIM-01');
		expect(await page.getByRole('note').first().textContent()).toContain('advisory');
		await screenshot(page, 'rules');
		expect(outside).toEqual([]);
		await page.close();
	});

	it('explains one rule, and answers 404 for a rule that does not exist', async () => {
		const page = await browser.newPage();
		await page.goto(`${baseUrl}/rules`, { waitUntil: 'networkidle' });
		await page.getByRole('link', { name: 'FIT-01' }).click();
		await page.waitForURL(`${baseUrl}/rules/FIT-01`);
		await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain(
			'Not enough clearance at MMC'
		);
		for (const title of [
			'What it checks',
			'Why it matters',
			'Worked example',
			'How to fix it',
			'Clause'
		])
			expect(await page.getByRole('heading', { name: title }).count()).toBe(1);
		expect(await page.getByRole('note').textContent()).toContain('qualified checker');
		await screenshot(page, 'rule-fit-01');
		const missing = await page.goto(`${baseUrl}/rules/XYZ-99`);
		expect(missing?.status()).toBe(404);
		await page.close();
	});
});
