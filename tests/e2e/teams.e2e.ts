import { afterAll, beforeAll, describe, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot, signIn } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

describe('team members', () => {
	it('the admin invites a checker, who joins from the e-mailed link', async () => {
		const admin = await browser.newPage();
		await signIn(admin, baseUrl, 'admin@example.test');
		await admin.goto(`${baseUrl}/teams/kestrel/members`);
		const invitee = `new-${Date.now()}@example.test`;
		await admin.getByLabel('E-mail').fill(invitee);
		await admin.getByLabel('Role', { exact: true }).selectOption('checker');
		await admin.getByRole('button', { name: 'Send invitation' }).click();
		await admin.getByText(`Invitation sent to ${invitee}`).waitFor();
		await screenshot(admin, 'members');

		const joiner = await browser.newPage();
		for (let i = 0; i < 50; i++) {
			await joiner.goto(`${baseUrl}/dev/mail`);
			const item = joiner.getByRole('button', { name: new RegExp(`to ${invitee}`) }).first();
			if (await item.count()) {
				await item.click();
				break;
			}
			await joiner.waitForTimeout(300);
		}
		await joiner
			.getByRole('navigation', { name: 'Links in this message' })
			.getByRole('link', { name: 'Accept the invitation' })
			.click();
		await joiner.getByRole('heading', { name: 'Join Kestrel Fluidics' }).waitFor();
		await joiner.getByLabel('Your name').fill('Nadia Newcomb');
		await joiner.getByLabel('Choose a password').fill('a long enough phrase');
		await joiner.getByRole('button', { name: 'Create account and join' }).click();
		await joiner.getByText('You are checker in this team.').waitFor();

		await admin.goto(`${baseUrl}/teams/kestrel/activity`);
		await admin.getByText(`invited ${invitee} as checker`).waitFor();
		await screenshot(admin, 'activity');
		await admin.close();
		await joiner.close();
	});

	it('refuses the members page to supplier quality', async () => {
		const page = await browser.newPage();
		await signIn(page, baseUrl, 'quality@example.test');
		const response = await page.goto(`${baseUrl}/teams/kestrel/members`);
		if (response?.status() !== 403) throw new Error(`expected 403, got ${response?.status()}`);
		await page
			.getByRole('heading', { name: 'Kestrel Fluidics' })
			.waitFor({ state: 'detached' })
			.catch(() => {});
		await page.close();
	});
});
