import { mkdirSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';
import { findChromium } from './chromium.js';
import { waitForMail } from '../shared';

export const artifactsDir = 'test-results/screenshots';

export async function launchBrowser(): Promise<Browser> {
	const executablePath = findChromium();
	if (!executablePath) throw new Error('No Chromium: apt-get install -y chromium');
	mkdirSync(artifactsDir, { recursive: true });
	return chromium.launch({
		executablePath,
		args: [
			'--headless',
			'--no-sandbox',
			'--disable-gpu',
			'--disable-quic',
			'--no-first-run',
			'--disable-background-networking',
			'--disable-component-update',
			'--disable-sync'
		]
	});
}

/** Records every request that leaves the app's own address, so a test can assert there are none. */
export function watchOutsideRequests(page: Page, baseUrl: string): string[] {
	const origin = new URL(baseUrl).origin;
	const outside: string[] = [];
	page.on('request', (request) => {
		const url = request.url();
		if (
			!url.startsWith(origin) &&
			!url.startsWith('data:') &&
			!url.startsWith('blob:') &&
			url !== 'about:srcdoc'
		) {
			outside.push(url);
		}
	});
	return outside;
}

export async function screenshot(page: Page, name: string) {
	await page.screenshot({ path: `${artifactsDir}/${name}.png`, fullPage: true });
}

/** The demo users' password in test runs (set by global-setup.ts). */
export const demoPassword = 'demo-password-for-tests';

/** Signs a demo user in through the sign-in page, as a person would. */
export async function signIn(page: Page, baseUrl: string, email: string) {
	await page.goto(`${baseUrl}/signin`);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(demoPassword);
	await page.getByRole('button', { name: 'Sign in', exact: true }).click();
	await page.getByRole('heading', { name: 'Your teams' }).waitFor();
}

/** A person of the demo team signed in in a browser context of their own, with its outside requests. */
export async function personAt(browser: Browser, baseUrl: string, email: string) {
	const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
	const page = await context.newPage();
	const outside = watchOutsideRequests(page, baseUrl);
	await signIn(page, baseUrl, email);
	return { page, outside };
}

const literally = (text: string) => new RegExp(text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));

/**
 * Waits until the mail to `to` with this subject is caught, then opens it on /dev/mail as a
 * person would and follows the link named `linkName` in it.
 */
export async function followMailLink(
	page: Page,
	baseUrl: string,
	to: string,
	subject: string,
	linkName: string
) {
	await waitForMail(to, literally(subject));
	await page.goto(`${baseUrl}/dev/mail`);
	const name = new RegExp(`${literally(subject).source}.*to ${literally(to).source}`);
	await page.getByRole('button', { name }).click();
	await page
		.getByRole('navigation', { name: 'Links in this message' })
		.getByRole('link', { name: linkName, exact: true })
		.click();
}
