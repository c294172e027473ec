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

/**
 * Checks a stored upload by its content and reads its sheets. It all runs in a worker thread
 * (pdf-worker.js) with a time limit and a memory cap, so a hostile file (thousands of pages,
 * deep object trees) costs that worker, never the server.
 */
export async function inspectPdf(path: string, size: number, limits: PdfLimits): Promise<PdfCheck> {
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
