import { randomUUID, createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { Readable, Transform } from 'node:stream';
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
import type { Storage } from './storage';

type Actor = { id: string; name: string | null; email: string };

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
}

/**
 * Streams a multipart body to a temporary file (never into memory), hashing and counting as it
 * goes. Only the field `file` is kept; anything over `maxBytes` is refused.
 */
export async function receiveUpload(
	request: Request,
	options: { maxBytes: number; tempDir: string }
): Promise<Received | Refusal> {
	const contentType = request.headers.get('content-type') ?? '';
	if (!contentType.startsWith('multipart/form-data') || !request.body) {
		return refuse(400, 'invalid', 'Send the drawing as multipart/form-data in a field named file.');
	}
	await mkdir(options.tempDir, { recursive: true });
	const path = join(options.tempDir, `${randomUUID()}.upload`);
	const fields: Record<string, string> = {};
	let written: Promise<{ size: number; sha256: string; tooLarge: boolean }> | null = null;

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
		written = pipeline(stream, counter, createWriteStream(path)).then(() => ({
			size,
			sha256: hash.digest('hex'),
			tooLarge
		}));
	});

	try {
		await pipeline(Readable.fromWeb(request.body as never), parser);
		if (!written) return refuse(400, 'invalid', 'No file: send the drawing in a field named file.');
		const file = await (written as Promise<{ size: number; sha256: string; tooLarge: boolean }>);
		if (file.tooLarge) {
			await rm(path, { force: true });
			const mb = Math.round(options.maxBytes / 1024 / 1024);
			return refuse(413, 'too_large', `The file is larger than the ${mb} MB limit.`);
		}
		return { ok: true, path, size: file.size, sha256: file.sha256, fields };
	} catch (err) {
		await rm(path, { force: true });
		if ((err as { status?: number }).status === 413) {
			return refuse(413, 'too_large', 'The upload is larger than the limit.');
		}
		throw err;
	}
}

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
	let storedKey: string | null = null;
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
		const key = `teams/${drawing.teamId}/drawings/${drawing.id}/${randomUUID()}.pdf`;
		const stored = await storage.put(key, createReadStream(upload.path), 'application/pdf');
		storedKey = key;
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
