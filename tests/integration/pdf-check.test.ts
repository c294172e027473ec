import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { inspectPdf } from '../../src/lib/server/pdf';
import { bulkyPdf, manyPagePdf, twoSheetPdf } from '../fixtures/pdfs';
import { tempDir } from './harness';

const temp = tempDir('checkplate-pdf-');
afterAll(temp.remove);

function saved(name: string, bytes: Uint8Array) {
	const path = join(temp.dir, name);
	writeFileSync(path, bytes);
	return { path, size: bytes.length };
}

const roomy = { maxPages: 1000, timeoutMs: 60_000, memoryMb: 512 };

describe('the PDF content check in its worker', () => {
	it('reads the sheets of a good file', async () => {
		const file = saved('good.pdf', await twoSheetPdf('WORKER'));
		expect(await inspectPdf(file.path, file.size, roomy)).toMatchObject({ ok: true, pages: 2 });
	});

	it('reads a file over 32 MB by ranges rather than whole', async () => {
		const file = saved('bulky.pdf', await bulkyPdf(34_000_000));
		expect(await inspectPdf(file.path, file.size, roomy)).toMatchObject({ ok: true, pages: 2 });
	});

	it('refuses more pages than the limit before reading any, and takes exactly the limit', async () => {
		const file = saved('three.pdf', manyPagePdf(3));
		expect(await inspectPdf(file.path, file.size, { ...roomy, maxPages: 2 })).toMatchObject({
			ok: false,
			status: 422,
			code: 'too_many_pages'
		});
		expect(await inspectPdf(file.path, file.size, { ...roomy, maxPages: 3 })).toMatchObject({
			ok: true,
			pages: 3,
			sheets: [
				{ width: 595, height: 842 },
				{ width: 595, height: 842 },
				{ width: 595, height: 842 }
			]
		});
	});

	it('stops a walk past its time limit while this thread keeps running', async () => {
		const file = saved('many.pdf', manyPagePdf(20_000));
		let ticks = 0;
		const ticker = setInterval(() => ticks++, 20);
		try {
			const result = await inspectPdf(file.path, file.size, {
				...roomy,
				maxPages: 100_000,
				timeoutMs: 2000
			});
			expect(result).toMatchObject({ ok: false, status: 422, code: 'unreadable_pdf' });
			expect(!result.ok && result.message).toMatch(/took longer than 2 s/);
		} finally {
			clearInterval(ticker);
		}
		// The walk ran in the worker: this thread's timers kept firing meanwhile.
		expect(ticks).toBeGreaterThan(10);
	});
});
