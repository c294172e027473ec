import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { unique } from '../shared';
import { followMailLink, launchBrowser, screenshot, signIn } from './browser';

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
		const invitee = `new-${unique()}@example.test`;
		await admin.getByLabel('E-mail').fill(invitee);
		await admin.getByLabel('Role', { exact: true }).selectOption('checker');
		await admin.getByRole('button', { name: 'Send invitation' }).click();
		await admin.getByText(`Invitation sent to ${invitee}`).waitFor();
		await screenshot(admin, 'members');

		const joiner = await browser.newPage();
		await followMailLink(
			joiner,
			baseUrl,
			invitee,
			'invited you to Kestrel Fluidics',
			'Accept the invitation'
		);
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
		expect(response?.status()).toBe(403);
		await page
			.getByText('Your role in Kestrel Fluidics (Supplier quality) does not allow this')
			.waitFor();
		expect(await page.getByRole('heading', { name: 'Members' }).count()).toBe(0);
		await page.close();
	});
});
