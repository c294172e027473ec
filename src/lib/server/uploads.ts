import { randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { PassThrough, Readable, type Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import busboy from 'busboy';
import { nextRevisionLetter } from '$lib/revision-letters';
import { revisionFields } from '$lib/schemas/drawings';
import type { Db } from './db/connect';
import type { DrawingRow } from './db/schema';
import {
	insertRevision,
	latestRevision,
	listRevisions,
	RevisionLetterTaken
} from './db/queries/drawings';
import { config } from './config';
import { inspectPdf } from './pdf';
import { ByteTally, type Storage, type StoredObject } from './storage';
import type { Actor } from './db/queries/activity';

export interface Refusal {
	ok: false;
	status: number;
	code: string;
	message: string;
}

const refuse = (status: number, code: string, message: string): Refusal => ({
	ok: false,
	status,
	code,
	message
});

interface Received {
	ok: true;
	path: string;
	size: number;
	sha256: string;
	fields: Record<string, string>;
	/** Present when the bytes went to storage while they arrived. */
	stored?: StoredObject;
}

interface Copied {
	size: number;
	sha256: string;
	stored?: StoredObject;
}

/** Waits until `stream` takes more; fails when it is closed or broken meanwhile. */
function drained(stream: Writable) {
	return new Promise<void>((resolve, reject) => {
		const done = (err?: Error | null) => {
			stream.off('drain', onDrain);
			stream.off('error', done);
			stream.off('close', onClose);
			if (err) reject(err);
			else resolve();
		};
		const onDrain = () => done();
		const onClose = () => done(stream.errored ?? new Error('The storage upload stopped'));
		stream.once('drain', onDrain);
		stream.once('error', done);
		stream.once('close', onClose);
	});
}

/**
 * Copies the uploaded file to `path` and, given `store`, into storage at the same time, hashing
 * and counting once: storage tallies what it is sent, so only a copy without storage tallies
 * here. Settles only when both transfers have: on any failure the storage upload is stopped
 * (the multipart upload aborted) before this rejects.
 */
async function copyFile(
	source: Readable,
	path: string,
	store?: { storage: Storage; key: string }
): Promise<Copied> {
	const tally = store ? null : new ByteTally();
	const toStorage = store ? new PassThrough() : null;
	const storing =
		store && toStorage ? store.storage.put(store.key, toStorage, 'application/pdf') : null;
	// Awaited below on every path; this only keeps an early failure from counting as unhandled.
	storing?.catch(() => {});
	try {
		await pipeline(
			source,
			async function* (chunks: AsyncIterable<Buffer>) {
				for await (const chunk of chunks) {
					tally?.add(chunk);
					if (toStorage) {
						if (toStorage.destroyed) throw toStorage.errored ?? new Error('Storage upload stopped');
						if (!toStorage.write(chunk)) await drained(toStorage);
					}
					yield chunk;
				}
			},
			createWriteStream(path)
		);
		toStorage?.end();
		if (tally) return { size: tally.size, sha256: tally.sha256() };
		const stored = await (storing as Promise<StoredObject>);
		return { size: stored.size, sha256: stored.sha256, stored };
	} catch (err) {
		toStorage?.destroy(err as Error);
		await storing?.catch(() => {});
		throw err;
	}
}

const settle = <T>(promise: Promise<T>) =>
	promise.then(
		(value) => ({ ok: true as const, value }),
		(error: unknown) => ({ ok: false as const, error })
	);

/**
 * Streams a multipart body to a temporary file (never into memory), hashing and counting as it
 * goes, and, given `store`, into storage at the same time so the two transfers overlap. Only the
 * field `file` is kept; anything over `maxBytes` is refused. Every stream and promise is settled
 * on every path (a body cut short, a client gone, a limit reached, storage failing): whatever
 * went to storage or the temp folder is removed, and nothing is left to reject unhandled.
 */
export async function receiveUpload(
	request: Request,
	options: {
		maxBytes: number;
		tempDir: string;
		store?: { storage: Storage; key: string };
	}
): Promise<Received | Refusal> {
	const contentType = request.headers.get('content-type') ?? '';
	if (!contentType.startsWith('multipart/form-data') || !request.body) {
		return refuse(400, 'invalid', 'Send the drawing as multipart/form-data in a field named file.');
	}
	let parser: ReturnType<typeof busboy>;
	try {
		parser = busboy({
			headers: { 'content-type': contentType },
			limits: { files: 1, fileSize: options.maxBytes, fields: 20, fieldSize: 10_000 }
		});
	} catch (err) {
		return refuse(400, 'invalid', `The multipart body cannot be read: ${(err as Error).message}`);
	}
	await mkdir(options.tempDir, { recursive: true });
	const path = join(options.tempDir, `${randomUUID()}.upload`);
	const fields: Record<string, string> = {};
	let fileStream: Readable | null = null;
	let copying: Promise<Copied> | null = null;
	let tooLarge = false;

	parser.on('field', (name, value) => {
		fields[name] = value;
	});
	parser.on('file', (name, stream) => {
		if (name !== 'file' || copying) {
			stream.resume();
			return;
		}
		fileStream = stream;
		// Past the limit busboy drops the rest of the file: stop the copy (and the storage upload)
		// now rather than store what will be refused.
		stream.on('limit', () => {
			tooLarge = true;
			stream.destroy(new Error('The file is over the size limit'));
		});
		copying = copyFile(stream, path, options.store);
		copying.catch(() => {}); // settled below
	});

	const body = Readable.fromWeb(request.body as never);
	const parsed = await settle(pipeline(body, parser));
	// A body that broke off leaves the file stream open in some cases: end the copy with it.
	const broken = fileStream as Readable | null;
	if (!parsed.ok && broken && !broken.destroyed) broken.destroy(parsed.error as Error);
	const copied = copying ? await settle(copying as Promise<Copied>) : null;

	// Removing a key that was never written is harmless; one written but refused must go.
	const discard = async () => {
		await rm(path, { force: true });
		if (options.store) await options.store.storage.remove(options.store.key).catch(() => {});
	};
	const mb = Math.round(options.maxBytes / 1024 / 1024);
	if (tooLarge || (!parsed.ok && (parsed.error as { status?: number }).status === 413)) {
		await discard();
		return refuse(413, 'too_large', `The file is larger than the ${mb} MB limit.`);
	}
	if (!parsed.ok) {
		await discard();
		return refuse(
			400,
			'invalid',
			'The upload ended before it was complete (the connection broke or the body was cut short). Send it again.'
		);
	}
	if (!copied) {
		await discard();
		return refuse(400, 'invalid', 'No file: send the drawing in a field named file.');
	}
	if (!copied.ok) {
		// The body arrived whole, so the fault is ours (disk or storage).
		await discard();
		throw copied.error;
	}
	return { ok: true, path, fields, ...copied.value };
}

export const revisionStorageKey = (drawing: Pick<DrawingRow, 'teamId' | 'id'>) =>
	`teams/${drawing.teamId}/drawings/${drawing.id}/${randomUUID()}.pdf`;

/**
 * Checks an uploaded revision by its content, stores it under a key of our own, verifies what
 * storage holds, and records it. On any refusal nothing is left behind: no row, no object, no
 * temporary file.
 */
export async function storeRevision(
	db: Db,
	storage: Storage,
	actor: Actor,
	drawing: DrawingRow,
	upload: Received
) {
	// Whatever is in storage for this upload goes again unless the revision row is written.
	let storedKey: string | null = upload.stored?.key ?? null;
	try {
		const fields = revisionFields.safeParse(upload.fields);
		if (!fields.success) {
			return refuse(400, 'invalid', fields.error.issues[0]?.message ?? 'Invalid fields');
		}
		const pdf = await inspectPdf(upload.path, upload.size, config.pdfLimits);
		if (!pdf.ok) return refuse(pdf.status, pdf.code, pdf.message);
		const previous = await latestRevision(db, drawing.id);
		if (previous && previous.sha256 === upload.sha256) {
			return refuse(
				422,
				'duplicate_revision',
				`This file is byte for byte revision ${previous.letter}: nothing changed.`
			);
		}
		const existing = (await listRevisions(db, drawing.id, { releasedOnly: false })).map(
			(r) => r.revision.letter
		);
		const letter = fields.data.letter ?? nextRevisionLetter(existing);
		if (existing.includes(letter)) {
			return refuse(409, 'conflict', `Revision ${letter} already exists; choose another letter.`);
		}
		const stored =
			upload.stored ??
			(await storage.put(
				revisionStorageKey(drawing),
				createReadStream(upload.path),
				'application/pdf'
			));
		storedKey = stored.key;
		const key = stored.key;
		if (stored.size !== upload.size || stored.sha256 !== upload.sha256) {
			throw new Error('Storage holds different bytes than were uploaded');
		}
		const revision = await insertRevision(db, actor, drawing, {
			letter,
			reason: fields.data.reason,
			pages: pdf.pages,
			sheets: pdf.sheets,
			sha256: upload.sha256,
			size: upload.size,
			storageKey: key
		});
		storedKey = null;
		return { ok: true as const, revision };
	} catch (err) {
		if (err instanceof RevisionLetterTaken) return refuse(409, 'conflict', err.message);
		throw err;
	} finally {
		await rm(upload.path, { force: true });
		if (storedKey) await storage.remove(storedKey).catch(() => {});
	}
}

/** Stores a revision whose bytes are already in hand (demo data, generated files). */
export async function storeRevisionBytes(
	db: Db,
	storage: Storage,
	actor: Actor,
	drawing: DrawingRow,
	bytes: Uint8Array,
	fields: Record<string, string>,
	tempDir: string
) {
	await mkdir(tempDir, { recursive: true });
	const path = join(tempDir, `${randomUUID()}.upload`);
	await pipeline(Readable.from([Buffer.from(bytes)]), createWriteStream(path));
	const tally = new ByteTally();
	tally.add(bytes);
	return storeRevision(db, storage, actor, drawing, {
		ok: true,
		path,
		size: tally.size,
		sha256: tally.sha256(),
		fields
	});
}
