import { randomUUID, createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { PassThrough, Readable, Transform } from 'node:stream';
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
import { inspectPdf } from './pdf';
import type { Storage, StoredObject } from './storage';
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

type Written = { size: number; sha256: string; tooLarge: boolean };

/**
 * Streams a multipart body to a temporary file (never into memory), hashing and counting as it
 * goes, and, given `store`, into storage at the same time so the two transfers overlap. Only the
 * field `file` is kept; anything over `maxBytes` is refused and whatever was stored is removed.
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
	await mkdir(options.tempDir, { recursive: true });
	const path = join(options.tempDir, `${randomUUID()}.upload`);
	const fields: Record<string, string> = {};
	let written: Promise<Written> | null = null;
	let stored: Promise<StoredObject> | null = null;

	const parser = busboy({
		headers: { 'content-type': contentType },
		limits: { files: 1, fileSize: options.maxBytes, fields: 20, fieldSize: 10_000 }
	});
	parser.on('field', (name, value) => {
		fields[name] = value;
	});
	parser.on('file', (name, stream) => {
		if (name !== 'file' || written) {
			stream.resume();
			return;
		}
		const hash = createHash('sha256');
		let size = 0;
		let tooLarge = false;
		stream.on('limit', () => {
			tooLarge = true;
		});
		const counter = new Transform({
			transform(chunk: Buffer, _encoding, done) {
				hash.update(chunk);
				size += chunk.length;
				done(null, chunk);
			}
		});
		const toDisk = new PassThrough();
		counter.pipe(toDisk);
		if (options.store) {
			const toStorage = new PassThrough();
			counter.pipe(toStorage);
			stored = options.store.storage.put(options.store.key, toStorage, 'application/pdf');
		}
		written = Promise.all([
			pipeline(stream, counter),
			pipeline(toDisk, createWriteStream(path))
		]).then(() => ({ size, sha256: hash.digest('hex'), tooLarge }));
	});

	const discard = async () => {
		await rm(path, { force: true });
		if (options.store) await options.store.storage.remove(options.store.key).catch(() => {});
	};
	try {
		await pipeline(Readable.fromWeb(request.body as never), parser);
		if (!written) return refuse(400, 'invalid', 'No file: send the drawing in a field named file.');
		const [file, object] = await Promise.all([
			written as Promise<Written>,
			(stored as Promise<StoredObject> | null)?.catch((err: Error) => err) ?? null
		]);
		if (file.tooLarge) {
			await discard();
			const mb = Math.round(options.maxBytes / 1024 / 1024);
			return refuse(413, 'too_large', `The file is larger than the ${mb} MB limit.`);
		}
		if (object instanceof Error) throw object;
		return {
			ok: true,
			path,
			size: file.size,
			sha256: file.sha256,
			fields,
			stored: object ?? undefined
		};
	} catch (err) {
		await discard();
		if ((err as { status?: number }).status === 413) {
			return refuse(413, 'too_large', 'The upload is larger than the limit.');
		}
		throw err;
	}
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
		const pdf = await inspectPdf(upload.path, upload.size);
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
	const sha256 = createHash('sha256').update(bytes).digest('hex');
	return storeRevision(db, storage, actor, drawing, {
		ok: true,
		path,
		size: bytes.length,
		sha256,
		fields
	});
}
