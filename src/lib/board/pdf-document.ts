import type { PDFDocumentProxy, PDFPageProxy } from 'pdfjs-dist';
import libraryUrl from 'pdfjs-dist/build/pdf.min.mjs?url';
import workerUrl from 'pdfjs-dist/build/pdf.worker.min.mjs?url';
import type { PageSize } from './view';

type PdfJs = typeof import('pdfjs-dist');

let pdfjs: Promise<PdfJs> | undefined;

/**
 * pdf.js's own built files, served by the app from `_app/immutable` (no CDN). The page names
 * the library in a `modulepreload` link, so the browser fetches it while the app starts.
 */
export const pdfjsFiles = { library: libraryUrl, worker: workerUrl };

/**
 * pdf.js and its worker, loaded once. The worker is started first, so it boots while the
 * library itself is still loading; every document of the page shares it.
 */
export function loadPdfJs(): Promise<PdfJs> {
	pdfjs ??= (async () => {
		const worker = new Worker(workerUrl, { type: 'module' });
		const library = (await import(/* @vite-ignore */ libraryUrl)) as PdfJs;
		library.GlobalWorkerOptions.workerPort = worker;
		return library;
	})();
	return pdfjs;
}

/** The options every view of a drawing opens it with: by HTTP ranges, no `eval`. */
export const documentOptions = {
	isEvalSupported: false,
	disableAutoFetch: true,
	disableStream: true
} as const;

export interface SheetSource {
	document: PDFDocumentProxy;
	page(number: number): Promise<PDFPageProxy>;
	/** The displayed size in points (after rotation, within the crop box) of a loaded page. */
	size(page: PDFPageProxy): PageSize;
	close(): Promise<void>;
}

/** Opens the revision's PDF from its file route; pages are fetched once and kept. */
export async function openSheets(url: string): Promise<SheetSource> {
	const library = await loadPdfJs();
	const task = library.getDocument({ url, ...documentOptions });
	let document: PDFDocumentProxy;
	try {
		document = await task.promise;
	} catch (err) {
		await task.destroy();
		throw err;
	}
	const pages = new Map<number, Promise<PDFPageProxy>>();
	return {
		document,
		page(number) {
			let page = pages.get(number);
			if (!page) {
				page = document.getPage(number);
				pages.set(number, page);
			}
			return page;
		},
		size(page) {
			const { width, height } = page.getViewport({ scale: 1 });
			return { width, height };
		},
		close: () => task.destroy()
	};
}

/** Words for a reader when pdf.js cannot open the file. */
export function openFailure(err: unknown): string {
	const name = (err as { name?: string } | null)?.name;
	const status = (err as { status?: number } | null)?.status;
	if (status === 404 || status === 403) {
		return 'The drawing file could not be fetched (it is missing or you may no longer see it).';
	}
	if (name === 'InvalidPDFException') return 'The drawing file is damaged: pdf.js cannot read it.';
	if (name === 'PasswordException') return 'The drawing file is locked with a password.';
	if (name === 'ResponseException' || name === 'UnexpectedResponseException') {
		return 'The drawing file could not be fetched: the connection failed. Try reloading.';
	}
	const message = err instanceof Error ? err.message : String(err);
	return `The drawing could not be opened: ${message}`;
}
