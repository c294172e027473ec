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

/** Presses a move on the revision's review bar, with a message, and waits for the new state. */
async function move(page: Page, button: string, message: string, state: string) {
	const review = page.locator('[data-review]');
	await review.getByRole('button', { name: button, exact: true }).click();
	if (message) await review.getByLabel(/Message/).fill(message);
	await review.getByRole('button', { name: `Confirm: ${button}` }).click();
	await page.locator(`[data-review][data-state="${state}"]`).waitFor();
}

describe('the review loop on the board', () => {
	it('the drafter submits, the checker returns, the drafter resubmits, the checker approves and releases; supplier quality sees it', async () => {
		const drafterApi = new Client();
		await drafterApi.signIn('drafter@example.test');
		const { number } = await draftRevision(drafterApi, 'kestrel');
		const drawingUrl = `${baseUrl}/teams/kestrel/drawings/${number}`;
		const revisionUrl = `${drawingUrl}/revisions/A`;

		const drafter = await personAt('drafter@example.test');
		await drafter.page.goto(revisionUrl);
		const review = drafter.page.locator('[data-review]');
		await review.waitFor();
		expect(await review.getAttribute('data-state')).toBe('draft');
		// A drafter submits; approving is not theirs to offer.
		expect(
			await review.locator('[data-move]').evaluateAll((b) => b.map((e) => e.textContent))
		).toEqual(['Submit for check']);
		await move(drafter.page, 'Submit for check', '', 'in-check');

		const checker = await personAt('checker@example.test');
		await checker.page.goto(revisionUrl);
		const checkerReview = checker.page.locator('[data-review]');
		await checkerReview.getByRole('button', { name: 'Return to the author' }).click();
		// A return needs a message: the browser will not send it empty.
		await checkerReview.getByRole('button', { name: 'Confirm: Return to the author' }).click();
		expect(await checkerReview.getAttribute('data-state')).toBe('in-check');
		await checkerReview
			.getByLabel(/Message/)
			.fill('Give the bore a surface finish, then resubmit.');
		await screenshot(checker.page, 'review-return');
		await checkerReview.getByRole('button', { name: 'Confirm: Return to the author' }).click();
		await checker.page.locator('[data-review][data-state="returned"]').waitFor();
		expect(await checker.page.locator('[data-last-move]').textContent()).toContain(
			'Give the bore a surface finish, then resubmit.'
		);

		await drafter.page.reload();
		await drafter.page.locator('[data-review][data-state="returned"]').waitFor();
		expect(await drafter.page.locator('[data-last-move]').textContent()).toContain('returned by');
		await move(drafter.page, 'Resubmit for check', 'Finish added.', 'in-check');

		await checker.page.reload();
		await move(checker.page, 'Approve', '', 'approved');
		expect(await checker.page.locator('[data-read-only]').textContent()).toContain(
			'the revision is approved'
		);
		await move(checker.page, 'Release', 'For the first batch.', 'released');
		await screenshot(checker.page, 'review-released');

		// The drawing page: each revision's history with who, when and why; the release marked.
		await checker.page.goto(drawingUrl);
		const history = checker.page.locator('[data-history-of="A"] [data-move]');
		expect(
			await history.evaluateAll((rows) => rows.map((r) => r.getAttribute('data-move')))
		).toEqual(['release', 'approve', 'resubmit', 'return', 'submit']);
		await checker.page.getByText('Give the bore a surface finish, then resubmit.').waitFor();
		await checker.page.locator('[data-revision="A"] [data-current-release]').waitFor();
		await screenshot(checker.page, 'review-history');

		// Supplier quality now sees the released revision, and is offered no move.
		const quality = await personAt('quality@example.test');
		await quality.page.goto(`${baseUrl}/teams/kestrel`);
		await quality.page.getByRole('link', { name: number }).click();
		await quality.page.locator('[data-revision="A"] [data-current-release]').waitFor();
		await quality.page.goto(revisionUrl);
		await quality.page.locator('[data-review][data-state="released"]').waitFor();
		expect(await quality.page.locator('[data-review] [data-move]').count()).toBe(0);
		await screenshot(quality.page, 'review-quality');

		for (const person of [drafter, checker, quality]) expect(person.outside).toEqual([]);
	});
});
