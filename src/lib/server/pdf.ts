import { open, type FileHandle } from 'node:fs/promises';
import { Worker } from 'node:worker_threads';

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
			code: 'not_pdf' | 'unreadable_pdf' | 'encrypted_pdf' | 'too_many_pages';
			message: string;
	  };

export interface PdfLimits {
	/** More pages than this are refused (`too_many_pages`) before any page is read. */
	maxPages: number;
	/** The check is stopped after this long. */
	timeoutMs: number;
	/** The worker's heap is capped at this. */
	memoryMb: number;
}

async function readAt(file: FileHandle, position: number, length: number) {
	const buffer = Buffer.alloc(length);
	const { bytesRead } = await file.read(buffer, 0, length, position);
	return buffer.subarray(0, bytesRead);
}

/**
 * Checks a stored upload by its content and reads its sheets. The quick checks of the first and
 * last bytes run here; pdf.js runs in a worker thread with a time limit and a memory cap, so a
 * hostile file (thousands of pages, deep object trees) costs that worker, never the server.
 */
export async function inspectPdf(path: string, size: number, limits: PdfLimits): Promise<PdfCheck> {
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
	} finally {
		await file.close();
	}
	return inWorker({ path, size, maxPages: limits.maxPages }, limits);
}

const unreadable = (message: string): PdfCheck => ({
	ok: false,
	status: 422,
	code: 'unreadable_pdf',
	message
});

// One check per core at a time: each may take its time limit and its memory cap. Workers that
// finished in time are kept (idle, not holding the process open) for the next check.
const maxRunning = 2;
let running = 0;
const waiting: (() => void)[] = [];
const idle: Worker[] = [];

type Input = { path: string; size: number; maxPages: number };

async function inWorker(input: Input, limits: PdfLimits): Promise<PdfCheck> {
	if (running >= maxRunning) await new Promise<void>((start) => waiting.push(start));
	running++;
	try {
		return await runWorker(idle.pop() ?? (await startWorker(limits)), input, limits);
	} finally {
		running--;
		waiting.shift()?.();
	}
}

/** Starts one worker ahead of the first upload: loading pdf.js in it takes seconds. */
export async function preparePdfCheck(limits: PdfLimits) {
	if (idle.length === 0 && running === 0) {
		const worker = await startWorker(limits);
		worker.unref();
		idle.push(worker);
	}
}

async function startWorker(limits: PdfLimits) {
	// Its own chunk in the build, so the worker loads pdf.js and nothing of the app.
	const { workerUrl, workerTask } = await import('./pdf-worker.js');
	const worker = new Worker(new URL(workerUrl), {
		workerData: { task: workerTask },
		resourceLimits: { maxOldGenerationSizeMb: limits.memoryMb, maxYoungGenerationSizeMb: 32 }
	});
	worker.once('exit', () => {
		const index = idle.indexOf(worker);
		if (index >= 0) idle.splice(index, 1);
	});
	return worker;
}

function runWorker(worker: Worker, input: Input, limits: PdfLimits): Promise<PdfCheck> {
	worker.ref();
	return new Promise<PdfCheck>((resolve) => {
		const finish = (result: PdfCheck, reusable = false) => {
			clearTimeout(timer);
			worker.off('message', onMessage);
			worker.off('error', onError);
			worker.off('exit', onExit);
			if (reusable && idle.length < maxRunning) {
				worker.unref();
				idle.push(worker);
			} else {
				void worker.terminate();
			}
			resolve(result);
		};
		const onMessage = (result: PdfCheck) => finish(result, true);
		const onError = (err: Error & { code?: string }) =>
			finish(
				err.code === 'ERR_WORKER_OUT_OF_MEMORY'
					? unreadable(
							`The PDF needs more than ${limits.memoryMb} MB to check: it is too complex to take. Export it again from the drawing's source.`
						)
					: unreadable(`The PDF cannot be read (${err.message}).`)
			);
		const onExit = (code: number) =>
			finish(unreadable(`The PDF check stopped (exit code ${code}).`));
		const timer = setTimeout(
			() =>
				finish(
					unreadable(
						`The PDF took longer than ${Math.round(limits.timeoutMs / 1000)} s to check: it is too complex to take. Export it again from the drawing's source.`
					)
				),
			limits.timeoutMs
		);
		worker.on('message', onMessage);
		worker.on('error', onError);
		worker.on('exit', onExit);
		worker.postMessage(input);
	});
}
