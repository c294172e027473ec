import { open, type FileHandle } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';

export interface PdfFacts {
	pages: number;
	/** Each sheet's size in points as displayed: after its rotation, within its crop box. */
	sheets: { width: number; height: number }[];
}

export type PdfCheck =
	| ({ ok: true } & PdfFacts)
	| {
			ok: false;
			status: 415 | 422;
			code: 'not_pdf' | 'unreadable_pdf' | 'encrypted_pdf';
			message: string;
	  };

const require = createRequire(import.meta.url);
const pdfjsRoot = dirname(require.resolve('pdfjs-dist/package.json'));
const standardFontDataUrl = pathToFileURL(join(pdfjsRoot, 'standard_fonts')).href + '/';

// The legacy build runs in Node (the modern one needs DOMMatrix); loaded once, on first use.
let pdfjs: Promise<typeof import('pdfjs-dist/legacy/build/pdf.mjs')> | undefined;
const loadPdfjs = () => (pdfjs ??= import('pdfjs-dist/legacy/build/pdf.mjs'));

async function readAt(file: FileHandle, position: number, length: number) {
	const buffer = Buffer.alloc(length);
	const { bytesRead } = await file.read(buffer, 0, length, position);
	return buffer.subarray(0, bytesRead);
}

/**
 * Checks a stored upload by its content and reads its sheets. pdf.js reads the file by ranges
 * from disk, so a 100 MB drawing is never held in memory whole.
 */
export async function inspectPdf(path: string, size: number): Promise<PdfCheck> {
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
		return await readSheets(file, size);
	} finally {
		await file.close();
	}
}

async function readSheets(file: FileHandle, size: number): Promise<PdfCheck> {
	const { getDocument, PDFDataRangeTransport } = await loadPdfjs();
	const initial = await readAt(file, 0, Math.min(size, 65_536));
	const transport = new PDFDataRangeTransport(size, new Uint8Array(initial));
	transport.requestDataRange = (begin: number, end: number) => {
		readAt(file, begin, end - begin).then(
			(chunk) => transport.onDataRange(begin, new Uint8Array(chunk)),
			() => transport.abort()
		);
	};
	const task = getDocument({
		range: transport,
		length: size,
		disableAutoFetch: true,
		disableStream: true,
		isEvalSupported: false,
		standardFontDataUrl,
		verbosity: 0
	});
	try {
		const document = await task.promise;
		const { info } = (await document.getMetadata()) as unknown as { info: Record<string, unknown> };
		if (info?.EncryptFilterName) {
			return encrypted();
		}
		const sheets: PdfFacts['sheets'] = [];
		for (let number = 1; number <= document.numPages; number++) {
			const page = await document.getPage(number);
			const { width, height } = page.getViewport({ scale: 1 });
			sheets.push({ width: Math.round(width * 100) / 100, height: Math.round(height * 100) / 100 });
			page.cleanup();
		}
		if (sheets.length === 0) throw new Error('no pages');
		return { ok: true, pages: sheets.length, sheets };
	} catch (err) {
		if ((err as Error)?.name === 'PasswordException') {
			return encrypted();
		}
		return {
			ok: false,
			status: 422,
			code: 'unreadable_pdf',
			message: `The PDF cannot be read (${(err as Error)?.message ?? 'unknown fault'}). Export it again from the drawing's source.`
		};
	} finally {
		await task.destroy();
	}
}

const encrypted = () =>
	({
		ok: false,
		status: 422,
		code: 'encrypted_pdf',
		message:
			'The PDF is encrypted or password-protected. Save it without security and upload again.'
	}) as const;
