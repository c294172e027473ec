import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot, watchOutsideRequests } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

async function open(width: number): Promise<{ page: Page; outside: string[] }> {
	const page = await browser.newPage({ viewport: { width, height: 900 } });
	const outside = watchOutsideRequests(page, baseUrl);
	await page.goto(`${baseUrl}/calc`, { waitUntil: 'networkidle' });
	await page.evaluate(() => document.fonts.ready);
	return { page, outside };
}

describe('/calc', () => {
	it('computes Ø25 H7/g6 as you type and draws the diagram', async () => {
		const { page, outside } = await open(1280);
		await page.getByLabel('Hole callout').fill('');
		await page.getByLabel('Hole callout').pressSequentially('Ø25 H7');
		await page.getByLabel('Shaft callout').fill('');
		await page.getByLabel('Shaft callout').pressSequentially('Ø25 g6');
		await expect.poll(() => page.getByTestId('min-clearance').textContent()).toBe('0.007');
		expect(await page.getByTestId('max-clearance').textContent()).toBe('0.041');
		expect((await page.getByTestId('classification').textContent())?.trim()).toBe('clearance fit');
		const svg = page.getByTestId('fit-diagram').locator('svg');
		expect(await svg.isVisible()).toBe(true);
		expect(await svg.textContent()).toContain('24.993');
		const box = await svg.boundingBox();
		expect(box!.width).toBeGreaterThanOrEqual(300);
		expect(await page.getByTestId('caution').textContent()).toContain('qualified checker');
		expect(await page.textContent('main')).toContain('25.021');
		await screenshot(page, 'calc');
		expect(outside).toEqual([]);
		await page.close();
	});

	it('shows the parser message under the field, pointing at the character', async () => {
		const { page } = await open(1280);
		await page.getByLabel('Shaft callout').fill('Ø25 +0.021/x');
		const error = page.getByTestId('shaft-error');
		await expect.poll(() => error.isVisible()).toBe(true);
		const marked = await error.locator('mark').textContent();
		expect(marked).toBe('x');
		expect(await page.getByLabel('Shaft callout').getAttribute('aria-invalid')).toBe('true');
		expect(await error.textContent()).toMatch(/character 12/);
		await screenshot(page, 'calc-error');
		await page.close();
	});

	it('fills both callouts from the fit advisor', async () => {
		const { page } = await open(1280);
		await page.getByRole('button', { name: /H9\/d9/ }).click();
		expect(await page.getByLabel('Hole callout').inputValue()).toBe('Ø25 H9');
		await expect.poll(() => page.getByTestId('min-clearance').textContent()).toBe('0.065');
		await page.close();
	});

	it('shows the fastener budget by modifier: Ø0.5 at LMC on Ø6.6 +0.2/0 for M6 is over', async () => {
		const { page } = await open(1280);
		const budget = page.getByRole('region', { name: 'Fastener budget' });
		await budget.getByLabel('Clearance hole').fill('Ø6.6 +0.2/0');
		await budget.getByLabel('Fastener', { exact: true }).fill('M6');
		await budget.getByLabel('Position tolerance Ø').fill('0.5');
		await budget.getByLabel('Modifier').selectOption('mmc');
		// At MMC the VC is the boundary: 0.5 ≤ H − F = 0.6 (ASME Y14.5 Appendix B).
		await expect.poll(() => page.getByTestId('fastener-available').textContent()).toBe('0.6');
		expect(await page.getByTestId('fastener-verdict').textContent()).toContain('Within the budget');
		// At LMC the inner boundary is MMC − t − T: 0.5 + 0.2 = 0.7 > 0.6 (recalled).
		await budget.getByLabel('Modifier').selectOption('lmc');
		await expect
			.poll(() => page.getByTestId('fastener-verdict').textContent())
			.toContain('Over the budget');
		expect(await page.getByTestId('fastener-used').textContent()).toContain('0.7');
		expect(await page.getByTestId('fastener-used').textContent()).toContain('MMC − t − T');
		await screenshot(page, 'calc-fastener');
		await page.close();
	});

	it('judges a fit at its operating temperature: Ø18 H7/p6, aluminium on bronze at 80 °C', async () => {
		const { page } = await open(1280);
		await page.getByLabel('Hole callout').fill('Ø18 H7');
		await page.getByLabel('Shaft callout').fill('Ø18 p6');
		await page.getByLabel('The fit is meant as').selectOption('interference');
		await page.getByLabel('Hole α (10⁻⁶/K)').fill('23.6');
		await page.getByLabel('Shaft α (10⁻⁶/K)').fill('17.5');
		await page.getByLabel('Operating °C').fill('80');
		// Max clearance 0 at 20 °C, +0.0066 at 80 °C (by hand; see tests/unit/fit.test.ts).
		await expect
			.poll(() => page.getByTestId('max-clearance-at-temperature').textContent())
			.toBe('0.0066');
		expect(await page.getByTestId('max-clearance').textContent()).toBe('0.000');
		expect(await page.getByTestId('fit-at-temperature').textContent()).toContain('transition fit');
		const results = page.getByRole('region', { name: 'Fit results' });
		expect(await results.textContent()).toContain('Does not meet the intent');
		expect(await results.textContent()).toContain('at 80 °C: interference fit');
		await screenshot(page, 'calc-temperature');
		await page.close();
	});

	it('lists the rulebook findings of each size and the gauge note beside the go gauge', async () => {
		const { page } = await open(1280);
		await page.getByLabel('Hole callout').fill('Ø25 H7 (25.000-25.030)');
		// H7 at 25 mm is 25.000/25.021 (ISO 286-2): the stated 25.030 disagrees.
		await expect.poll(() => page.getByTestId('hole-findings').textContent()).toContain('LIM-04');
		expect(await page.getByTestId('hole-findings').textContent()).toContain(
			'H7 at 25.000 gives 25.000–25.021'
		);
		expect(await page.getByTestId('shaft-findings').textContent()).toContain('nothing to report');
		// ISO 8015 without Ⓔ: the go gauge checks more than the drawing asks.
		expect(await page.getByTestId('hole-gauge-note').textContent()).toContain(
			'full-form go gauge checks more'
		);
		expect(await page.textContent('main')).toContain('Gauge sizes are nominal');
		await page.getByLabel('Hole callout').fill('Ø25 H7 Ⓔ');
		await expect.poll(() => page.getByTestId('hole-gauge-note').count()).toBe(0);
		await page.close();
	});

	it('works on a phone-width screen', async () => {
		const { page } = await open(390);
		await screenshot(page, 'calc-390');
		// The calculator itself must fit; the shared header is measured by the shell's own tests.
		const widest = await page.evaluate(() =>
			Math.max(
				...[...document.querySelectorAll('main *')].map((e) => e.getBoundingClientRect().right)
			)
		);
		expect(widest).toBeLessThanOrEqual(390);
		expect(await page.getByTestId('fit-diagram').locator('svg').isVisible()).toBe(true);
		await page.close();
	});

	it('answers the calc API without sign-in', async () => {
		const size = await fetch(
			`${baseUrl}/api/v1/calc/size?callout=${encodeURIComponent('Ø25 +0.021/x')}&units=mm&feature=internal`
		);
		expect(size.status).toBe(400);
		const body = await size.json();
		expect(body.error).toMatchObject({ code: 'invalid', position: 11 });
		const fit = await fetch(`${baseUrl}/api/v1/calc/fit`, {
			method: 'POST',
			// The app's cross-site check wants our origin on a POST without a Bearer token.
			headers: { 'content-type': 'application/json', origin: new URL(baseUrl).origin },
			body: JSON.stringify({
				hole: { callout: 'Ø25 H7' },
				shaft: { callout: 'Ø25 g6' },
				units: 'mm',
				standard: 'iso'
			})
		});
		expect(fit.status, await fit.clone().text()).toBe(200);
		expect(await fit.json()).toMatchObject({ minClearance: '0.007', maxClearance: '0.041' });
	});
});
