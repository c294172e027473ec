import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { twoSheetPdf } from '../fixtures/pdfs';
import { unique } from '../shared';
import { launchBrowser, screenshot, signIn, watchOutsideRequests } from './browser';

const baseUrl = inject('baseUrl');
let browser: Browser;
const files = mkdtempSync(join(tmpdir(), 'checkplate-files-'));

beforeAll(async () => {
	browser = await launchBrowser();
});
afterAll(async () => {
	await browser?.close();
});

describe('the drafter', () => {
	it('creates a drawing, uploads a two-sheet PDF with progress, and sees its sheets', async () => {
		const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
		const outside = watchOutsideRequests(page, baseUrl);
		await signIn(page, baseUrl, 'drafter@example.test');

		await page.goto(`${baseUrl}/teams/kestrel`);
		await page.getByRole('link', { name: 'KF-1001' }).waitFor();
		await screenshot(page, 'drawings');
		await page.getByRole('button', { name: 'New drawing' }).click();
		const number = `KF-${unique()}`.toUpperCase();
		await page.getByLabel('Drawing number').fill(number);
		await page.getByLabel('Title', { exact: true }).fill('Pump cover');
		await page.getByLabel('Part name', { exact: true }).fill('Cover, pump head');
		await page.getByLabel('ISO 2768 class').check();
		await page.getByRole('button', { name: 'Create drawing' }).click();
		await page.getByRole('heading', { name: number }).waitFor();

		const notPdf = join(files, 'cover.pdf');
		writeFileSync(notPdf, 'not a drawing, just text');
		await page.getByLabel('PDF of the drawing').setInputFiles(notPdf);
		await page.getByRole('button', { name: 'Upload revision' }).click();
		await page.getByRole('alert').getByText('This is not a PDF').waitFor();
		await screenshot(page, 'upload-refused');

		const pdf = join(files, 'cover-a.pdf');
		writeFileSync(pdf, await twoSheetPdf(number));
		await page.getByLabel('PDF of the drawing').setInputFiles(pdf);
		await page.getByLabel('Reason for the change').fill('First issue for review');
		await page.getByRole('button', { name: 'Upload revision' }).click();
		await page.getByText('Revision A uploaded: 2 sheets.').waitFor();
		await page.getByRole('cell', { name: 'First issue for review' }).waitFor();

		await page.getByRole('link', { name: 'A', exact: true }).click();
		await page.getByRole('heading', { name: 'Revision A' }).waitFor();
		// The board draws the first sheet, then the sheet strip's thumbnails.
		await page.getByRole('button', { name: 'Sheet 2', exact: true }).waitFor();
		await page.waitForFunction(() => {
			const root = document.querySelector('[data-board]') as HTMLElement & {
				board?: { pictureReady: boolean };
			};
			return root?.board?.pictureReady === true;
		});
		await screenshot(page, 'revision');
		expect(outside).toEqual([]);
		await page.close();
	});

	it('shows the upload progress bar while a file is sent', async () => {
		const page = await browser.newPage();
		await signIn(page, baseUrl, 'drafter@example.test');
		await page.goto(`${baseUrl}/teams/kestrel/drawings/KF-1003`);
		const big = join(files, 'big.pdf');
		const pdf = await twoSheetPdf('BIG');
		// A real PDF padded with a long comment, so the transfer takes long enough to watch.
		const padded = Buffer.concat([
			Buffer.from(pdf.slice(0, 9)),
			Buffer.from(`%${'x'.repeat(12 * 1024 * 1024)}\n`),
			Buffer.from(pdf.slice(9))
		]);
		writeFileSync(big, padded);
		await page.getByLabel('PDF of the drawing').setInputFiles(big);
		await page.getByRole('button', { name: 'Upload revision' }).click();
		await page.getByRole('progressbar', { name: 'Upload progress' }).waitFor();
		await screenshot(page, 'upload-progress');
		// KF-1003 has only the demo's revision A: this upload is its revision B.
		await page.getByText('Revision B uploaded: 2 sheets.').waitFor();
		expect(await page.getByRole('alert').count()).toBe(0);
		await page.close();
	});
});
