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
	/** Each part's SHA-256 (hex) when the object went in as a multipart upload. */
	parts?: string[];
	/** How the bucket's copy was checked: the store's own checksum, or reading it back once. */
	verifiedBy?: VerifiedBy;
}

export interface ByteRange {
	start: number;
	end: number; // inclusive
}

export class StorageVerificationError extends Error {}

/** How a stored object was found to hold what was sent. */
export type VerifiedBy = 'store-checksum' | 'read-back';

/**
 * Counts and hashes bytes (SHA-256) as they pass, in one step: the upload's copy to disk, the
 * stream into the bucket and the check of what the bucket holds all tally through this. Given
 * a part size it also hashes each part as a multipart upload cuts them, for the checksum of
 * checksums a store keeps of a multipart object.
 */
export class ByteTally {
	size = 0;
	private readonly hash = createHash('sha256');
	private readonly parts: Buffer[] = [];
	private part = createHash('sha256');
	private inPart = 0;

	constructor(private readonly partSize = 0) {}

	add(chunk: Uint8Array) {
		this.hash.update(chunk);
		this.size += chunk.length;
		if (this.partSize > 0) this.addToParts(chunk);
		return chunk;
	}

	private addToParts(chunk: Uint8Array) {
		let offset = 0;
		while (offset < chunk.length) {
			if (this.inPart === this.partSize) {
				this.parts.push(this.part.digest());
				this.part = createHash('sha256');
				this.inPart = 0;
			}
			const take = Math.min(chunk.length - offset, this.partSize - this.inPart);
			this.part.update(chunk.subarray(offset, offset + take));
			this.inPart += take;
			offset += take;
		}
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

	/** Each part's SHA-256 (hex), cut at the part size; call once, at the end. */
	partDigests() {
		if (this.partSize <= 0) return [];
		return [...this.parts, this.part.digest()].map((digest) => digest.toString('hex'));
	}
}

/**
 * The SHA-256 checksum S3 keeps of an object (base64): of the whole object when it went in one
 * PutObject, else the checksum of the parts' checksums followed by `-` and the part count.
 */
export function s3Checksum(expected: Pick<StoredObject, 'sha256' | 'parts'>) {
	const parts = expected.parts ?? [];
	if (parts.length <= 1) return Buffer.from(expected.sha256, 'hex').toString('base64');
	const joined = Buffer.concat(parts.map((part) => Buffer.from(part, 'hex')));
	return `${createHash('sha256').update(joined).digest('base64')}-${parts.length}`;
}

/**
 * Whether the store's own SHA-256 checksum of an object matches what was sent: null when the
 * store keeps none (or another kind), so the caller reads the object back instead. Some stores
 * give a multipart object's checksum without the `-N` part count; that is compared too.
 */
export function checksumMatches(
	stored: string | undefined,
	expected: Pick<StoredObject, 'sha256' | 'parts'>
): boolean | null {
	if (!stored) return null;
	const want = s3Checksum(expected);
	return stored === want || (want.includes('-') && stored === want.split('-')[0]);
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
	const partSize = 8 * 1024 * 1024;

	/**
	 * Streams a body of unknown length into the bucket, then checks what the bucket holds. Each
	 * request carries the SHA-256 of its bytes (the SDK sends it as a header: lib-storage hands
	 * it whole parts, not a stream, so no checksum trailer can end up in the object), which a
	 * store that supports checksums verifies on arrival and keeps.
	 */
	async function put(key: string, body: Readable, contentType = 'application/octet-stream') {
		const tally = new ByteTally(partSize);
		const passThrough = new PassThrough();
		const upload = new Upload({
			client,
			params: {
				Bucket,
				Key: key,
				Body: passThrough,
				ContentType: contentType,
				ChecksumAlgorithm: 'SHA256'
			},
			queueSize: 2,
			partSize
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
		// lib-storage sends a body of at most one part with one PutObject, anything longer in parts.
		const parts = tally.partDigests();
		const stored: StoredObject = {
			key,
			size: tally.size,
			sha256: tally.sha256(),
			...(tally.size > partSize ? { parts } : {})
		};
		stored.verifiedBy = await verify(stored);
		return stored;
	}

	/**
	 * Checks that the bucket holds what was sent, once, by the cheapest means the store offers:
	 * its own SHA-256 checksum of the object where it keeps one (no bytes come back), else by
	 * reading the object back and hashing it.
	 */
	async function verify(expected: StoredObject): Promise<VerifiedBy> {
		const head = await client.send(
			new HeadObjectCommand({ Bucket, Key: expected.key, ChecksumMode: 'ENABLED' })
		);
		if (head.ContentLength !== expected.size) {
			throw new StorageVerificationError(
				`Stored ${head.ContentLength} bytes for ${expected.key}, sent ${expected.size}`
			);
		}
		const byChecksum = checksumMatches(head.ChecksumSHA256, expected);
		if (byChecksum === false) {
			throw new StorageVerificationError(
				`Stored object ${expected.key} differs from what was sent (the store's checksum)`
			);
		}
		if (byChecksum) return 'store-checksum';
		const tally = new ByteTally();
		const { body } = await get(expected.key);
		for await (const chunk of body) tally.add(chunk as Buffer);
		if (tally.sha256() !== expected.sha256) {
			throw new StorageVerificationError(
				`Stored object ${expected.key} differs from what was sent`
			);
		}
		return 'read-back';
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
