import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { Client } from '../app/client';
import { draftRevision } from '../app/revisions';
import { launchBrowser, personAt as signedIn, screenshot } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

const personAt = (email: string) => signedIn(browser, baseUrl, email);

describe('the rulebook on a drawing, as a checker and an admin use it', () => {
	it('the check summary links to the finding; a waiver needs its why and counts as waived', async () => {
		// A drawing of its own: Ø25 H7 stated as 25.000/25.025 disagrees with its class
		// (ISO 286-2:2010 table: H7 over 18 up to 30 mm is 0/+0.021), so LIM-04 finds it.
		const drafter = new Client();
		await drafter.signIn('drafter@example.test');
		const { path } = await draftRevision(drafter, 'kestrel');
		const added = await drafter.api('POST', `${path}/features`, {
			kind: 'bore',
			label: 'Bore',
			callout: 'Ø25 H7 (25.000/25.025)'
		});
		expect(added.status).toBe(201);

		const { page, outside } = await personAt('checker@example.test');
		await page.goto(`${baseUrl}${path}`);
		const summary = page.locator('[data-check-summary]:not([data-check-summary="compact"])');
		await summary.getByText('1 rule finding: 1 open, 0 waived, 0 closed').waitFor();
		await page.locator('[data-check-summary="compact"]').getByText('1 open').waitFor();
		await page.getByRole('button', { name: 'Run the rulebook' }).click();
		await summary.getByText('1 rule finding: 1 open').waitFor();
		await screenshot(page, 'rulebook-summary');
		await summary.locator('[data-count="open-LIM"]').click();
		await page.waitForURL(/findings\?kind=rule&state=open&waived=false&family=LIM/);
		const row = page.locator('[data-finding]').first();
		await row.waitFor();
		await row.getByRole('link', { name: /^F-\d+$/ }).click();
		await page.getByText('Numbers: stated 25.000–25.025').waitFor();

		const waiver = page.locator('[data-waiver-form]');
		await waiver.getByRole('button', { name: 'Waive' }).click();
		await waiver.getByText('Say why the finding is waived').waitFor();
		await waiver.getByLabel('Why it is waived').fill('Reamed to 25.025 by agreement with the shop');
		await waiver.getByRole('button', { name: 'Waive' }).click();
		await waiver.getByRole('button', { name: 'Take the waiver back' }).waitFor();
		await page.locator('[data-history]').getByText('Waived: Reamed to 25.025').waitFor();
		await screenshot(page, 'rulebook-waiver');

		await page.goto(`${baseUrl}${path}`);
		await summary.getByText('1 rule finding: 0 open, 1 waived, 0 closed').waitFor();
		expect(outside).toEqual([]);
	});

	it('an admin sets a team severity on the rulebook page; the findings follow at once', async () => {
		const drafter = new Client();
		await drafter.signIn('drafter@example.test');
		const { path } = await draftRevision(drafter, 'kestrel');
		await drafter.api('POST', `${path}/features`, {
			kind: 'bore',
			label: 'Bore',
			callout: 'Ø25 H7 (25.000/25.025)'
		});
		const { page, outside } = await personAt('admin@example.test');
		await page.goto(`${baseUrl}/teams/kestrel`);
		await page.getByRole('link', { name: 'Rulebook', exact: true }).last().click();
		const form = page.locator('[data-rulebook-settings]');
		await form.getByLabel('Severity of LIM-04 for this team').selectOption('critical');
		await form.getByRole('button', { name: 'Save' }).click();
		await form.getByText("Saved. The team's open revisions were checked again.").waitFor();
		await screenshot(page, 'rulebook-settings');
		try {
			const [finding] = await (await drafter.api('GET', `${path}/findings?kind=rule`)).json();
			expect(finding).toMatchObject({ rule: 'LIM-04', severity: 'critical' });
		} finally {
			await page.reload();
			await form.getByLabel('Severity of LIM-04 for this team').selectOption('');
			await form.getByRole('button', { name: 'Save' }).click();
			await form.getByText("Saved. The team's open revisions were checked again.").waitFor();
		}
		const [after] = await (await drafter.api('GET', `${path}/findings?kind=rule`)).json();
		expect(after.severity).toBe('major');
		expect(outside).toEqual([]);
	});
});
