// The PDF content check, run in a worker thread (see pdf.ts): pdf.js on a hostile file can take
// minutes of CPU and much memory, which must not stall the server's one thread. Plain JavaScript
// so the same file runs as a worker from the sources (dev, tests) and from the build, where it
// is a chunk of its own; importing it on the main thread only reads `workerUrl`.
import { open } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { isMainThread, parentPort, workerData } from 'node:worker_threads';

/** Where a worker finds this module. */
export const workerUrl = import.meta.url;
export const workerTask = 'checkplate-pdf-check';

/**
 * @typedef {{ path: string, size: number, maxPages: number }} CheckInput
 * @typedef {{ width: number, height: number }} Sheet
 * @typedef {import('./pdf').PdfCheck} CheckOutput
 */

/**
 * @param {import('node:fs/promises').FileHandle} file
 * @param {number} position
 * @param {number} length
 */
async function readAt(file, position, length) {
	const buffer = Buffer.alloc(length);
	const { bytesRead } = await file.read(buffer, 0, length, position);
	return buffer.subarray(0, bytesRead);
}

/** Files up to this size are read whole; larger ones by ranges, so memory stays bounded. */
const wholeFileBytes = 32 * 1024 * 1024;

/** @type {Promise<typeof import('pdfjs-dist/legacy/build/pdf.mjs')> | undefined} */
let pdfjs;
/**
 * pdf.js with its parser in this thread (as `globalThis.pdfjsWorker`, which pdf.js looks for):
 * loading that takes seconds, so a worker starts it as soon as it starts.
 */
const loadPdfjs = () =>
	(pdfjs ??= (async () => {
		/** @type {Record<string, unknown>} */ (globalThis).pdfjsWorker = await import(
			// @ts-expect-error pdf.js ships no types for its worker module
			'pdfjs-dist/legacy/build/pdf.worker.mjs'
		);
		return import('pdfjs-dist/legacy/build/pdf.mjs');
	})());

/** @returns {CheckOutput} */
const encrypted = () => ({
	ok: false,
	status: 422,
	code: 'encrypted_pdf',
	message: 'The PDF is encrypted or password-protected. Save it without security and upload again.'
});

/**
 * Checks the first and last bytes, then reads the sheets (by ranges from disk for a large file,
 * so a 100 MB drawing is never held whole), refusing a page count over `maxPages` before looking
 * at a single page.
 * @param {CheckInput} input
 * @returns {Promise<CheckOutput>}
 */
async function check({ path, size, maxPages }) {
	if (size === 0) return { ok: false, status: 415, code: 'not_pdf', message: 'The file is empty.' };
	const file = await open(path, 'r');
	try {
		const head = (await readAt(file, 0, Math.min(size, 1024))).toString('latin1');
		if (!head.includes('%PDF-')) {
			return {
				ok: false,
				status: 415,
				code: 'not_pdf',
				message: 'This is not a PDF: the file does not start like one, whatever its name says.'
			};
		}
		const tailLength = Math.min(size, 2048);
		const tail = (await readAt(file, size - tailLength, tailLength)).toString('latin1');
		if (!tail.includes('%%EOF')) {
			return {
				ok: false,
				status: 422,
				code: 'unreadable_pdf',
				message: 'The PDF ends early (no end-of-file marker): it looks truncated. Upload it again.'
			};
		}
		return await readSheets(file, size, maxPages);
	} finally {
		await file.close();
	}
}

/**
 * @param {import('node:fs/promises').FileHandle} file
 * @param {number} size
 * @param {number} maxPages
 * @returns {Promise<CheckOutput>}
 */
async function readSheets(file, size, maxPages) {
	const { getDocument, PDFDataRangeTransport } = await loadPdfjs();
	const require = createRequire(import.meta.url);
	const pdfjsRoot = dirname(require.resolve('pdfjs-dist/package.json'));
	const standardFontDataUrl = pathToFileURL(join(pdfjsRoot, 'standard_fonts')).href + '/';
	/** @type {Parameters<typeof getDocument>[0] & object} */
	const source = {
		disableAutoFetch: true,
		disableStream: true,
		isEvalSupported: false,
		standardFontDataUrl,
		verbosity: 0
	};
	if (size <= wholeFileBytes) {
		// Several times faster than by ranges for a file with many small objects.
		source.data = new Uint8Array(await readAt(file, 0, size));
	} else {
		const initial = await readAt(file, 0, Math.min(size, 65_536));
		const transport = new PDFDataRangeTransport(size, new Uint8Array(initial));
		transport.requestDataRange = (/** @type {number} */ begin, /** @type {number} */ end) => {
			readAt(file, begin, end - begin).then(
				(chunk) => transport.onDataRange(begin, new Uint8Array(chunk)),
				() => transport.abort()
			);
		};
		source.range = transport;
	}
	const task = getDocument(source);
	try {
		const document = await task.promise;
		const { info } = /** @type {{ info: Record<string, unknown> }} */ (
			/** @type {unknown} */ (await document.getMetadata())
		);
		if (info?.EncryptFilterName) return encrypted();
		if (document.numPages > maxPages) {
			return {
				ok: false,
				status: 422,
				code: 'too_many_pages',
				message: `The PDF has ${document.numPages.toLocaleString('en')} pages; Checkplate takes drawings of up to ${maxPages.toLocaleString('en')} sheets.`
			};
		}
		/** @type {Sheet[]} */
		const sheets = [];
		for (let number = 1; number <= document.numPages; number++) {
			const page = await document.getPage(number);
			const { width, height } = page.getViewport({ scale: 1 });
			sheets.push({ width: Math.round(width * 100) / 100, height: Math.round(height * 100) / 100 });
			page.cleanup();
		}
		if (sheets.length === 0) throw new Error('no pages');
		return { ok: true, pages: sheets.length, sheets };
	} catch (err) {
		if (/** @type {Error} */ (err)?.name === 'PasswordException') return encrypted();
		return {
			ok: false,
			status: 422,
			code: 'unreadable_pdf',
			message: `The PDF cannot be read (${/** @type {Error} */ (err)?.message ?? 'unknown fault'}). Export it again from the drawing's source.`
		};
	} finally {
		await task.destroy();
	}
}

// A worker checks one file at a time, as often as the main thread asks (it keeps it warm).
if (!isMainThread && workerData?.task === workerTask && parentPort) {
	const port = parentPort;
	void loadPdfjs();
	port.on('message', (/** @type {CheckInput} */ input) => {
		check(input).then(
			(result) => port.postMessage(result),
			(err) =>
				port.postMessage({
					ok: false,
					status: 422,
					code: 'unreadable_pdf',
					message: `The PDF cannot be read (${err?.message ?? 'unknown fault'}).`
				})
		);
	});
}
