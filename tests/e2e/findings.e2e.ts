import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { Marker } from '../../src/lib/board/markers';
import { Client } from '../app/client';
import { draftRevision } from '../app/revisions';
import { settled } from './board-drawing';
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
		await quality.page.locator('[data-review][data-state="released"]').waitFor();
		await quality.page.getByRole('link', { name: 'Findings', exact: true }).click();
		// Numbered after the rulebook's four findings on KF-1001 (README demo section).
		const anodise = quality.page.locator('[data-finding="5"]');
		await anodise.getByText('Anodising').waitFor();
		const href = await anodise.getByRole('link', { name: 'Show on sheet 1' }).getAttribute('href');
		const view = new URL(href!, baseUrl).searchParams;
		expect(view.get('sheet')).toBe('1');
		expect(view.get('show')).toMatch(/^finding-[0-9a-f-]{36}$/);
		expect(view.get('centre')).toMatch(/^0\.\d{5},0\.\d{5}$/);
		await screenshot(quality.page, 'findings-demo');
		await anodise.getByRole('link', { name: 'F-5' }).click();
		await quality.page.locator('[data-thread] .mention').first().waitFor();
		expect(quality.outside).toEqual([]);
	});
});

type BoardHandle = HTMLElement & {
	board: {
		markers: Marker[];
		selected: string | null;
		toScreen: (p: { x: number; y: number }) => { x: number; y: number };
	};
};

/** The finding markers on the board, as the board holds them. */
function findingMarkers(page: Page) {
	return page.evaluate(() =>
		(document.querySelector('[data-board]') as BoardHandle).board.markers.filter((m) =>
			m.id.startsWith('finding-')
		)
	);
}

/** Presses a state change in the board's finding panel and waits for the new state. */
async function moveOnBoard(page: Page, button: string, message: string, state: string) {
	const panel = page.locator('[data-finding-panel]');
	if (message) await panel.getByLabel('Message').fill(message);
	await panel.getByRole('button', { name: button, exact: true }).click();
	await panel.locator(`[data-finding-state="${state}"]`).waitFor();
}

describe('a finding raised on the board', () => {
	it('the checker marks an area, the drafter answers in the thread, the checker resolves and verifies', async () => {
		const drafterApi = new Client();
		await drafterApi.signIn('drafter@example.test');
		const { number, path } = await draftRevision(drafterApi, 'kestrel');

		const checker = await personAt('checker@example.test');
		await checker.page.goto(`${baseUrl}${path}`);
		await settled(checker.page);
		const sheet = checker.page.locator('[data-board-viewport]');
		const box = (await sheet.boundingBox())!;

		// Escape leaves raise mode without raising anything.
		await checker.page.getByRole('button', { name: 'Raise finding' }).click();
		await checker.page.locator('[data-board-placing]').waitFor();
		await checker.page.keyboard.press('Escape');
		await checker.page.locator('[data-board-placing]').waitFor({ state: 'detached' });

		// Raise mode again: drag around an area of the sheet.
		await checker.page.getByRole('button', { name: 'Raise finding' }).click();
		await checker.page.locator('[data-board-placing]').waitFor();
		const from = { x: box.x + box.width * 0.3, y: box.y + box.height * 0.3 };
		const to = { x: box.x + box.width * 0.5, y: box.y + box.height * 0.45 };
		await checker.page.mouse.move(from.x, from.y);
		await checker.page.mouse.down();
		await checker.page.mouse.move((from.x + to.x) / 2, (from.y + to.y) / 2, { steps: 4 });
		await checker.page.locator('[data-board-sketch]').waitFor();
		await checker.page.mouse.move(to.x, to.y, { steps: 4 });
		await checker.page.mouse.up();
		const form = checker.page.locator('[data-raise-finding]');
		await form.getByRole('heading', { name: 'New finding' }).waitFor();
		await form.getByText('the area marked').waitFor();
		// The text is required: the API's message shows under the field and nothing is raised.
		await form.getByRole('button', { name: 'Raise finding' }).click();
		await form.getByText('Say what is wrong').waitFor();
		await form.getByLabel('What is wrong').fill('The title block has no surface finish note.');
		await form.getByLabel('Severity').selectOption('major');
		await form.getByLabel('Assignee').selectOption({ label: 'Tomas Reyes' });
		// Supplier quality cannot answer, so is not offered.
		expect(await form.getByLabel('Assignee').locator('option').allTextContents()).not.toContain(
			'Ken Halloran'
		);
		await form.getByRole('button', { name: 'Raise finding' }).click();
		const panel = checker.page.locator('[data-finding-panel]');
		await panel.getByRole('heading', { name: 'F-1' }).waitFor();
		await panel.locator('[data-finding-state="raised"]').waitFor();
		const [marker] = await findingMarkers(checker.page);
		// A tag (features are round balloons) around the area dragged out, at its top-left.
		expect(marker).toMatchObject({ label: 'F-1', shape: 'tag', outline: 'cloud', tone: 'major' });
		expect(marker.location.w).toBeGreaterThan(0.05);
		expect(marker.location.h).toBeGreaterThan(0.05);
		expect(marker.finish).toBe('solid');
		await screenshot(checker.page, 'board-finding-raised');

		// The drafter opens it from the findings table, which flies the board to its marker.
		const drafter = await personAt('drafter@example.test');
		await drafter.page.goto(`${baseUrl}${path}/findings`);
		await drafter.page
			.locator('[data-finding="1"]')
			.getByRole('link', { name: 'Show on sheet 1' })
			.click();
		await drafter.page.waitForURL(/show=finding-/);
		await settled(drafter.page);
		const shown = new URL(drafter.page.url()).searchParams.get('show');
		expect(
			await drafter.page.evaluate(
				() => (document.querySelector('[data-board]') as BoardHandle).board.selected
			)
		).toBe(shown);
		// Only whoever raised it or a checker may move it: not the drafter.
		expect((await findingMarkers(drafter.page))[0].movable).toBe(false);
		const drafterPanel = drafter.page.locator('[data-finding-panel]');
		await drafterPanel.getByText('The title block has no surface finish note.').waitFor();
		// Resolving is the checker's: the drafter is offered only the answer.
		expect(await drafterPanel.getByRole('button', { name: 'Resolve' }).count()).toBe(0);
		await drafterPanel.getByLabel('Comment').fill('Added **Ra 1.6** to the general note.');
		await drafterPanel.getByRole('button', { name: 'Post comment' }).click();
		await drafterPanel.locator('[data-thread]').getByText('Ra 1.6').waitFor();
		await moveOnBoard(drafter.page, 'Answer', 'Note added on sheet 1.', 'answered');
		expect((await findingMarkers(drafter.page))[0].finish).toBe('half');
		await screenshot(drafter.page, 'board-finding-answered');

		// The checker picks the marker on the sheet, resolves and verifies.
		await checker.page.reload();
		await settled(checker.page);
		await checker.page.locator('[data-finding-panel]').waitFor({ state: 'detached' });
		const tagAt = async () => {
			const at = await checker.page.evaluate(() => {
				const board = (document.querySelector('[data-board]') as BoardHandle).board;
				const m = board.markers.find((m) => m.id.startsWith('finding-'))!;
				return board.toScreen(m.location);
			});
			const now = (await sheet.boundingBox())!;
			return { x: now.x + at.x, y: now.y + at.y };
		};
		const first = await tagAt();
		await checker.page.mouse.click(first.x, first.y);
		const checkerPanel = checker.page.locator('[data-finding-panel]');
		await checkerPanel.waitFor();
		// The side panel widened: the whole sheet is fitted to the narrower view again.
		await settled(checker.page);
		const tag = await tagAt();
		// The checker raised it, so may drag it elsewhere: the API keeps the new place.
		expect((await findingMarkers(checker.page))[0].movable).toBe(true);
		await checker.page.mouse.move(tag.x, tag.y);
		await checker.page.mouse.down();
		await checker.page.mouse.move(tag.x + 60, tag.y + 40, { steps: 6 });
		await checker.page.mouse.up();
		const findingsUrl = `/teams/kestrel/drawings/${number}/revisions/A/findings`;
		await expect
			.poll(async () => {
				const list = (await (await drafterApi.api('GET', findingsUrl)).json()) as {
					location: { x: number };
				}[];
				return list[0].location.x;
			})
			.toBeGreaterThan(marker.location.x + 0.01);
		await checkerPanel.locator('[data-finding-state="answered"]').waitFor();
		await checkerPanel.locator('[data-thread]').getByText('Ra 1.6').waitFor();
		await moveOnBoard(checker.page, 'Resolve', 'The note is on the sheet.', 'resolved');
		await moveOnBoard(checker.page, 'Verify', '', 'verified');
		const history = checkerPanel.locator('[data-history]');
		for (const line of ['Answered', 'Resolved', 'Verified']) {
			await history.getByText(line, { exact: true }).waitFor();
		}
		await history.getByText('Note added on sheet 1.').waitFor();
		const [done] = await findingMarkers(checker.page);
		expect(done).toMatchObject({ label: 'F-1✓', finish: 'hollow' });
		await screenshot(checker.page, 'board-finding-verified');

		const api = await drafterApi.api('GET', findingsUrl);
		expect(((await api.json()) as { state: string }[])[0].state).toBe('verified');
		expect(checker.outside).toEqual([]);
		expect(drafter.outside).toEqual([]);
	});
});
