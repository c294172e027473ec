import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
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

/** Presses a state change on the finding's page, with a message, and waits for the new state. */
async function move(page: Page, button: string, message: string, state: string) {
	await page.getByLabel('Message').fill(message);
	await page.getByRole('button', { name: button, exact: true }).click();
	await page.getByText(`Now ${state}.`).waitFor();
}

describe('a finding through its table and its thread', () => {
	it('the checker raises it, the drafter answers, the checker resolves and verifies', async () => {
		const drafterApi = new Client();
		await drafterApi.signIn('drafter@example.test');
		const { number } = await draftRevision(drafterApi, 'kestrel');
		const findingsPath = `${baseUrl}/teams/kestrel/drawings/${number}/revisions/A/findings`;

		const checker = await personAt('checker@example.test');
		await checker.page.goto(findingsPath);
		await checker.page.getByText('No finding matches.').waitFor();
		await checker.page.getByRole('button', { name: 'Raise finding' }).click();
		await checker.page.getByText('Say what is wrong').waitFor();
		const raise = checker.page.locator('[data-raise-finding]');
		await raise.getByLabel('What is wrong').fill('The bore has no surface finish.');
		await raise.getByLabel('Severity').selectOption('critical');
		await raise.getByLabel('Assignee').selectOption({ label: 'Tomas Reyes' });
		await raise.getByRole('button', { name: 'Raise finding' }).click();
		await checker.page.getByRole('heading', { name: 'F-1' }).waitFor();

		// A comment with markup that would run if it were trusted.
		await checker.page
			.getByLabel('Comment')
			.fill(
				'@tomas please add **Ra 0.8**.\n\n<script>window.pwned = 1</script>\n\n<img src=x onerror="window.pwned = 2">'
			);
		await checker.page.getByRole('button', { name: 'Post comment' }).click();
		const thread = checker.page.locator('[data-thread]');
		await thread.getByText('Ra 0.8').waitFor();
		expect(await thread.locator('.mention').textContent()).toBe('@tomas');
		expect(await thread.locator('script, img').count()).toBe(0);
		await thread.getByText('<script>window.pwned = 1</script>').waitFor();
		expect(await checker.page.evaluate(() => (window as { pwned?: number }).pwned)).toBeUndefined();
		await screenshot(checker.page, 'finding-raised');

		const drafter = await personAt('drafter@example.test');
		await drafter.page.goto(`${findingsPath}/1`);
		await drafter.page.getByText('The bore has no surface finish.').waitFor();
		// The drafter answers; resolving is the checker's.
		expect(await drafter.page.getByRole('button', { name: 'Resolve' }).count()).toBe(0);
		await move(drafter.page, 'Answer', 'Ra 0.8 added to the bore.', 'answered');
		expect(await drafter.page.evaluate(() => (window as { pwned?: number }).pwned)).toBeUndefined();

		await checker.page.reload();
		await move(checker.page, 'Resolve', 'Finish is on the sheet now.', 'resolved');
		await move(checker.page, 'Verify', '', 'verified');
		const history = checker.page.locator('[data-history]');
		for (const line of ['Answered', 'Resolved', 'Verified']) {
			await history.getByText(line, { exact: true }).waitFor();
		}
		await history.getByText('Ra 0.8 added to the bore.').waitFor();
		await screenshot(checker.page, 'finding-verified');

		await checker.page.goto(`${findingsPath}?state=verified`);
		const row = checker.page.locator('[data-finding="1"]');
		await row.getByText('Verified').waitFor();
		await row.getByText('Tomas Reyes').waitFor();
		await checker.page.goto(`${findingsPath}?state=open`);
		await checker.page.getByText('No finding matches.').waitFor();
		expect(await checker.page.locator('[data-count="verified"]').textContent()).toContain('1');
		await screenshot(checker.page, 'findings-table');

		expect(checker.outside).toEqual([]);
		expect(drafter.outside).toEqual([]);
	});

	it("lists the demo's released findings to supplier quality, with links to their place on the board", async () => {
		// Supplier quality on first sign-in: KF-1001 A is released, its findings resolved.
		const quality = await personAt('quality@example.test');
		const revision = `${baseUrl}/teams/kestrel/drawings/KF-1001/revisions/A`;
		await quality.page.goto(revision);
		const counts = quality.page.locator('[data-finding-counts]');
		await counts.getByText('0 open').waitFor();
		await quality.page.locator('[data-review][data-state="released"]').waitFor();
		await quality.page.getByRole('link', { name: 'Findings', exact: true }).click();
		const anodise = quality.page.locator('[data-finding="1"]');
		await anodise.getByText('Anodising').waitFor();
		const href = await anodise.getByRole('link', { name: 'Show on sheet 1' }).getAttribute('href');
		const view = new URL(href!, baseUrl).searchParams;
		expect(view.get('sheet')).toBe('1');
		expect(view.get('show')).toMatch(/^finding-[0-9a-f-]{36}$/);
		expect(view.get('centre')).toMatch(/^0\.\d{5},0\.\d{5}$/);
		await screenshot(quality.page, 'findings-demo');
		await anodise.getByRole('link', { name: 'F-1' }).click();
		await quality.page.locator('[data-thread] .mention').first().waitFor();
		expect(quality.outside).toEqual([]);
	});
});
