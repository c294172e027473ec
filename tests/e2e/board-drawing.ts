import type { Page } from 'playwright-core';
import { a0BoardPdf } from '../fixtures/pdfs';

/**
 * Creates a drawing in the demo team and uploads the A0 board sheets as revision A, through the
 * API with the signed-in page's own cookie; returns the board's path.
 */
export async function uploadBoardDrawing(
	page: Page,
	baseUrl: string,
	number: string,
	strokes = 5000
) {
	const headers = { origin: new URL(baseUrl).origin };
	const created = await page.request.post(`${baseUrl}/api/v1/teams/kestrel/drawings`, {
		headers,
		data: { number, title: 'Board test sheet', units: 'mm', standard: 'iso-8015' }
	});
	if (created.status() !== 201)
		throw new Error(`drawing: ${created.status()} ${await created.text()}`);
	const uploaded = await page.request.post(
		`${baseUrl}/api/v1/teams/kestrel/drawings/${number}/revisions`,
		{
			headers,
			multipart: {
				reason: 'Board test',
				file: {
					name: `${number}.pdf`,
					mimeType: 'application/pdf',
					buffer: Buffer.from(await a0BoardPdf(strokes))
				}
			}
		}
	);
	if (uploaded.status() !== 201) {
		throw new Error(`revision: ${uploaded.status()} ${await uploaded.text()}`);
	}
	return `/teams/kestrel/drawings/${number}/revisions/A`;
}

/** Waits until the board shows its sheet: the whole-sheet picture drawn, and settled. */
export async function waitForSheet(page: Page) {
	await page.waitForFunction(() => {
		const root = document.querySelector('[data-board]') as
			(HTMLElement & { board?: { pictureReady: boolean; status: string } }) | null;
		return root?.board?.pictureReady === true;
	});
}

export interface BoardFacts {
	sheet: number;
	view: { zoom: number; centre: { x: number; y: number } };
	viewport: { width: number; height: number };
	page: { width: number; height: number };
	zoomPercent: number;
	idle: boolean;
	timings: { firstSheet: number; picture: number; sharp: number };
}

/** What the board shows, read from the board object on its element. */
export function boardFacts(page: Page): Promise<BoardFacts> {
	return page.evaluate(() => {
		const board = (document.querySelector('[data-board]') as HTMLElement & { board: BoardFacts })
			.board;
		const { sheet, view, viewport, page, zoomPercent, idle, timings } = board;
		return JSON.parse(
			JSON.stringify({ sheet, view, viewport, page, zoomPercent, idle, timings })
		) as BoardFacts;
	});
}

/** Waits until the view stopped and its sharp drawing (if any) is on screen. */
export async function settled(page: Page) {
	await waitForSheet(page);
	// The review bar, counts and rulebook line sit above the board: a person scrolls it into
	// view, so wheel and screenshots act on the whole board, not on the page.
	await page.locator('[data-board-viewport]').scrollIntoViewIfNeeded();
	await page.waitForFunction(
		() =>
			(document.querySelector('[data-board]') as HTMLElement & { board: { idle: boolean } }).board
				.idle
	);
	return boardFacts(page);
}
