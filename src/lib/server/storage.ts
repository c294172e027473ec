import { createHash } from 'node:crypto';
import { PassThrough, Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import {
	DeleteObjectCommand,
	GetObjectCommand,
	HeadObjectCommand,
	S3Client
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';

export interface StorageSettings {
	endpoint: string;
	bucket: string;
	region: string;
	accessKeyId: string;
	secretAccessKey: string;
}

export interface StoredObject {
	key: string;
	size: number;
	sha256: string;
}

export interface ByteRange {
	start: number;
	end: number; // inclusive
}

export class StorageVerificationError extends Error {}

/**
 * Counts and hashes bytes (SHA-256) as they pass, in one step: the upload's copy to disk, the
 * stream into the bucket and the check of what the bucket holds all tally through this.
 */
export class ByteTally {
	size = 0;
	private readonly hash = createHash('sha256');

	add(chunk: Uint8Array) {
		this.hash.update(chunk);
		this.size += chunk.length;
		return chunk;
	}

	/** A pass-through stream that tallies what flows through it. */
	through() {
		return new Transform({
			transform: (chunk: Buffer, _encoding, done) => done(null, this.add(chunk))
		});
	}

	/** The SHA-256 (hex) of everything added; call once, at the end. */
	sha256() {
		return this.hash.digest('hex');
	}
}

export function createStorage(settings: StorageSettings) {
	// Without WHEN_REQUIRED the SDK frames stream bodies with a checksum trailer that some
	// S3-compatible servers store inside the object.
	const client = new S3Client({
		endpoint: settings.endpoint,
		region: settings.region,
		forcePathStyle: true,
		credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
		requestChecksumCalculation: 'WHEN_REQUIRED',
		responseChecksumValidation: 'WHEN_REQUIRED'
	});
	const Bucket = settings.bucket;

	/** Streams a body of unknown length into the bucket, then checks what the bucket holds. */
	async function put(key: string, body: Readable, contentType = 'application/octet-stream') {
		const tally = new ByteTally();
		const passThrough = new PassThrough();
		const upload = new Upload({
			client,
			params: { Bucket, Key: key, Body: passThrough, ContentType: contentType },
			queueSize: 2,
			partSize: 8 * 1024 * 1024
		});
		const sending = upload.done();
		try {
			await Promise.all([pipeline(body, tally.through(), passThrough), sending]);
		} catch (err) {
			// Whichever side failed, stop the other: the body is not read on, and the upload, its
			// source broken, ends by aborting the multipart upload so the bucket keeps no parts.
			body.destroy(err as Error);
			passThrough.destroy(err as Error);
			await settleWithin(sending, 30_000, () => upload.abort());
			throw err;
		}
		const stored: StoredObject = { key, size: tally.size, sha256: tally.sha256() };
		await verify(stored);
		return stored;
	}

	async function verify(expected: StoredObject) {
		const head = await client.send(new HeadObjectCommand({ Bucket, Key: expected.key }));
		if (head.ContentLength !== expected.size) {
			throw new StorageVerificationError(
				`Stored ${head.ContentLength} bytes for ${expected.key}, sent ${expected.size}`
			);
		}
		const tally = new ByteTally();
		const { body } = await get(expected.key);
		for await (const chunk of body) tally.add(chunk as Buffer);
		if (tally.sha256() !== expected.sha256) {
			throw new StorageVerificationError(
				`Stored object ${expected.key} differs from what was sent`
			);
		}
	}

	async function get(key: string, range?: ByteRange) {
		const result = await client.send(
			new GetObjectCommand({
				Bucket,
				Key: key,
				Range: range ? `bytes=${range.start}-${range.end}` : undefined
			})
		);
		return {
			body: result.Body as Readable,
			size: result.ContentLength ?? 0,
			contentRange: result.ContentRange,
			contentType: result.ContentType
		};
	}

	async function size(key: string): Promise<number | null> {
		try {
			const head = await client.send(new HeadObjectCommand({ Bucket, Key: key }));
			return head.ContentLength ?? 0;
		} catch (err) {
			if ((err as { name?: string }).name === 'NotFound') return null;
			throw err;
		}
	}

	async function remove(key: string) {
		await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
	}

	return { put, get, size, remove, verify, bucket: Bucket, client };
}

export type Storage = ReturnType<typeof createStorage>;

/** Waits for `promise` to settle, calling `giveUp` if it has not within `ms`. */
async function settleWithin(promise: Promise<unknown>, ms: number, giveUp: () => unknown) {
	let timer: ReturnType<typeof setTimeout> | undefined;
	const late = new Promise<void>((resolve) => {
		timer = setTimeout(() => {
			void Promise.resolve(giveUp()).catch(() => {});
			resolve();
		}, ms);
	});
	await Promise.race([promise.catch(() => {}), late]);
	clearTimeout(timer);
}

/**
 * Parses an HTTP Range header for one range of a resource of `size` bytes.
 * Returns null for no header, 'unsatisfiable' for a range outside the resource.
 */
export function parseRange(
	header: string | null,
	size: number
): ByteRange | null | 'unsatisfiable' {
	if (!header) return null;
	const match = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
	if (!match || (match[1] === '' && match[2] === '')) return null;
	let start: number;
	let end: number;
	if (match[1] === '') {
		const suffix = Number(match[2]);
		if (suffix === 0) return 'unsatisfiable';
		start = Math.max(0, size - suffix);
		end = size - 1;
	} else {
		start = Number(match[1]);
		end = match[2] === '' ? size - 1 : Math.min(Number(match[2]), size - 1);
	}
	if (start >= size || start > end) return 'unsatisfiable';
	return { start, end };
}
