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
