import { createHash, randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createStorage, parseRange, type Storage } from '../../src/lib/server/storage';
import { startFakes } from './harness';

let fakes: Awaited<ReturnType<typeof startFakes>>;
let storage: Storage;

beforeAll(async () => {
	fakes = await startFakes();
	storage = createStorage(fakes.storageSettings);
});
afterAll(() => fakes?.stop());

/** A stream of `total` random bytes in uneven chunks, with no length known up front. */
function randomStream(total: number, hash: ReturnType<typeof createHash>) {
	let sent = 0;
	return new Readable({
		read() {
			if (sent >= total) return this.push(null);
			const size = Math.min(total - sent, 65_536 + Math.floor(Math.random() * 300_000));
			const chunk = randomBytes(size);
			hash.update(chunk);
			sent += size;
			this.push(chunk);
		}
	});
}

async function readAll(body: Readable) {
	const chunks: Buffer[] = [];
	for await (const chunk of body) chunks.push(chunk as Buffer);
	return Buffer.concat(chunks);
}

describe('storage against the S3 stand-in', () => {
	it('round-trips a 50 MB stream of unknown length byte-identical and verifies it', async () => {
		const sent = createHash('sha256');
		const stored = await storage.put('test/big.bin', randomStream(50 * 1024 * 1024, sent));
		expect(stored.size).toBe(50 * 1024 * 1024);
		expect(stored.sha256).toBe(sent.digest('hex'));
		const back = createHash('sha256');
		const { body } = await storage.get('test/big.bin');
		for await (const chunk of body) back.update(chunk as Buffer);
		expect(back.digest('hex')).toBe(stored.sha256);
		await storage.remove('test/big.bin');
		expect(await storage.size('test/big.bin')).toBeNull();
	});

	it('returns exactly the bytes of a range', async () => {
		const data = randomBytes(100_000);
		await storage.put('test/range.bin', Readable.from([data]));
		const { body } = await storage.get('test/range.bin', { start: 1000, end: 1999 });
		expect((await readAll(body)).equals(data.subarray(1000, 2000))).toBe(true);
		const tail = await storage.get('test/range.bin', { start: 99_990, end: 99_999 });
		expect((await readAll(tail.body)).equals(data.subarray(99_990))).toBe(true);
	});

	it('detects an object that differs from what was sent', async () => {
		const stored = await storage.put('test/check.bin', Readable.from([Buffer.from('abc')]));
		await expect(storage.verify({ ...stored, sha256: '0'.repeat(64) })).rejects.toThrow(/differs/);
		await expect(storage.verify({ ...stored, size: 4 })).rejects.toThrow(/Stored 3 bytes/);
	});
});

describe('verifying what the bucket holds, once', () => {
	/** Records each request's command, checksum header and trailer, and lets a test change an answer. */
	function watch(answer?: (command: string, output: Record<string, unknown>) => void) {
		const sent: { command: string; checksum?: string; trailer?: string; body?: Uint8Array }[] = [];
		storage.client.middlewareStack.add(
			(next, context) => async (args) => {
				const request = (args as { request: { headers: Record<string, string>; body: unknown } })
					.request;
				const body = request.body instanceof Uint8Array ? request.body : undefined;
				sent.push({
					command: context.commandName as string,
					checksum: request.headers['x-amz-checksum-sha256'],
					trailer: request.headers['x-amz-trailer'],
					body
				});
				const result = await next(args);
				answer?.(
					context.commandName as string,
					result.output as unknown as Record<string, unknown>
				);
				return result;
			},
			{ step: 'finalizeRequest', name: 'watchStorage', priority: 'low' }
		);
		return {
			sent,
			stop: () => storage.client.middlewareStack.remove('watchStorage')
		};
	}
	const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest();

	it('sends each part with its SHA-256 in a header (no trailer) and, the stand-in keeping no checksums, reads back once', async () => {
		const watching = watch();
		try {
			const data = randomBytes(20 * 1024 * 1024);
			const stored = await storage.put('test/parts.bin', Readable.from([data]));
			const parts = watching.sent.filter((r) => r.command === 'UploadPartCommand');
			expect(parts).toHaveLength(3); // 8 + 8 + 4 MiB at lib-storage's 8 MiB part size
			for (const part of parts) {
				expect(part.trailer).toBeUndefined();
				expect(part.checksum).toBe(sha256(part.body!).toString('base64'));
			}
			expect(stored.verifiedBy).toBe('read-back');
			expect(watching.sent.filter((r) => r.command === 'GetObjectCommand')).toHaveLength(1);
		} finally {
			watching.stop();
		}
	});

	it("trusts a store's own checksum of the parts and reads nothing back", async () => {
		// A store that keeps checksums answers HeadObject with the SHA-256 of the parts' SHA-256s
		// and the part count (AWS, Amazon S3 User Guide, "Checking object integrity": checksums of
		// multipart objects). Here it is made from the part checksums that arrived, as such a
		// store would; `answer` spoils it or leaves out the count.
		let answer: 'right' | 'no count' | 'wrong' = 'right';
		const watching = watch((command, output) => {
			if (command !== 'HeadObjectCommand') return;
			const sums = watching.sent
				.filter((r) => r.command === 'UploadPartCommand')
				.map((r) => Buffer.from(r.checksum!, 'base64'));
			if (answer === 'wrong') sums.reverse();
			const composite = createHash('sha256').update(Buffer.concat(sums)).digest('base64');
			output.ChecksumSHA256 = answer === 'no count' ? composite : `${composite}-${sums.length}`;
		});
		try {
			const stored = await storage.put('test/checksum.bin', Readable.from([randomBytes(17 << 20)]));
			expect(watching.sent.filter((r) => r.command === 'UploadPartCommand')).toHaveLength(3);
			expect(stored.verifiedBy).toBe('store-checksum');
			expect(watching.sent.some((r) => r.command === 'GetObjectCommand')).toBe(false);
			answer = 'no count';
			expect(await storage.verify(stored)).toBe('store-checksum');
			answer = 'wrong';
			await expect(storage.verify(stored)).rejects.toThrow(/store's checksum/);
		} finally {
			watching.stop();
		}
	});

	it("trusts a store's checksum of a small object sent whole", async () => {
		const data = randomBytes(100_000);
		const watching = watch((command, output) => {
			if (command === 'HeadObjectCommand') output.ChecksumSHA256 = sha256(data).toString('base64');
		});
		try {
			const stored = await storage.put('test/small.bin', Readable.from([data]));
			expect(stored.verifiedBy).toBe('store-checksum');
			const put = watching.sent.find((r) => r.command === 'PutObjectCommand');
			expect(put?.checksum).toBe(sha256(data).toString('base64'));
			expect(watching.sent.some((r) => r.command === 'GetObjectCommand')).toBe(false);
		} finally {
			watching.stop();
		}
	});
});

describe('HTTP Range parsing', () => {
	it('reads the forms RFC 9110 §14.1.2 allows for one range', () => {
		expect(parseRange('bytes=0-99', 1000)).toEqual({ start: 0, end: 99 });
		expect(parseRange('bytes=900-', 1000)).toEqual({ start: 900, end: 999 });
		expect(parseRange('bytes=-100', 1000)).toEqual({ start: 900, end: 999 });
		expect(parseRange('bytes=990-2000', 1000)).toEqual({ start: 990, end: 999 });
		expect(parseRange('bytes=1000-', 1000)).toBe('unsatisfiable');
		expect(parseRange(null, 1000)).toBeNull();
		expect(parseRange('items=1-2', 1000)).toBeNull();
	});
	it('aborts the multipart upload and keeps nothing when the body breaks off midway', async () => {
		const sentCommands: string[] = [];
		storage.client.middlewareStack.add(
			(next, context) => (args) => {
				sentCommands.push(context.commandName as string);
				return next(args);
			},
			{ step: 'initialize', name: 'recordCommands' }
		);
		try {
			// Two 8 MB parts go out before the source fails, as a client cut off mid-upload leaves it.
			let sent = 0;
			const broken = new Readable({
				read() {
					if (sent >= 18 * 1024 * 1024) {
						this.destroy(new Error('client went away'));
						return;
					}
					sent += 1024 * 1024;
					this.push(randomBytes(1024 * 1024));
				}
			});
			await expect(storage.put('test/broken.bin', broken)).rejects.toThrow('client went away');
			expect(sentCommands).toContain('CreateMultipartUploadCommand');
			expect(sentCommands).toContain('AbortMultipartUploadCommand');
			expect(sentCommands).not.toContain('CompleteMultipartUploadCommand');
			expect(await storage.size('test/broken.bin')).toBeNull();
		} finally {
			storage.client.middlewareStack.remove('recordCommands');
		}
	});
});
