import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { unique } from '../shared';
import { followMailLink, launchBrowser, screenshot, watchOutsideRequests } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

describe('a new user', () => {
	it('signs up, confirms the address from the caught mail, signs in and out, then uses a link', async () => {
		const page = await browser.newPage();
		const outside = watchOutsideRequests(page, baseUrl);
		const email = `lena-${unique()}@example.test`;
		const password = 'bracket pivot hole';

		await page.goto(`${baseUrl}/signup`);
		await page.getByLabel('Name').fill('Lena Okafor');
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Password').fill('short');
		await page.getByRole('button', { name: 'Create account' }).click();
		await page.getByText('Use at least 10 characters').waitFor();
		await page.getByLabel('Password').fill(password);
		await page.getByRole('button', { name: 'Create account' }).click();
		await page.getByText('Check your mail').waitFor();

		await followMailLink(page, baseUrl, email, 'Confirm your e-mail address', 'Confirm my address');
		// Opening the link confirms nothing yet (a mail scanner opens links too): the button does.
		await page.getByRole('button', { name: 'Confirm my address' }).click();
		await page.getByText('Your e-mail address is confirmed').waitFor();

		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Password').fill('wrong password here');
		await page.getByRole('button', { name: 'Sign in', exact: true }).click();
		await page.getByRole('alert').getByText('do not match an account').waitFor();
		await screenshot(page, 'sign-in-error');
		await page.getByLabel('Password').fill(password);
		await page.getByRole('button', { name: 'Sign in', exact: true }).click();
		await page.getByRole('link', { name: 'Lena Okafor' }).waitFor();

		await page.goto(`${baseUrl}/account`);
		await screenshot(page, 'account');
		await page.getByRole('main').getByRole('button', { name: 'Sign out', exact: true }).click();
		await page.waitForURL(`${baseUrl}/signin`);
		await screenshot(page, 'sign-in');

		await page.getByRole('button', { name: 'E-mail me a sign-in link instead' }).click();
		await page.getByLabel('E-mail').fill(email);
		await page.getByRole('button', { name: 'Send me a sign-in link' }).click();
		await page.getByText('a sign-in link is on its way').waitFor();
		await followMailLink(page, baseUrl, email, 'Your Checkplate sign-in link', 'Sign in');
		await page.getByRole('link', { name: 'Lena Okafor' }).waitFor();
		expect(outside).toEqual([]);
		await page.close();
	});
});
