import { spawn } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { count } from 'drizzle-orm';
import { afterEach, describe, expect, it } from 'vitest';
import { DataDirInUseError, acquireDataDirLock, openPglite } from '../../src/lib/server/db/connect';
import { users } from '../../src/lib/server/db/schema';
import { tempDir } from './harness';

const cleanups: (() => unknown)[] = [];
afterEach(async () => {
	for (const cleanup of cleanups.splice(0).reverse()) await cleanup();
});

function otherLiveProcess() {
	const child = spawn('sleep', ['30']);
	cleanups.push(() => child.kill());
	return child.pid!;
}

async function deadPid() {
	const child = spawn('true');
	await new Promise((done) => child.once('exit', done));
	return child.pid!;
}

describe('the embedded database lock', () => {
	it('refuses a data dir held by another live process, naming the dir and the pid', () => {
		const temp = tempDir();
		cleanups.push(temp.remove);
		const holder = otherLiveProcess();
		writeFileSync(join(temp.dir, 'pglite.lock'), String(holder));
		let caught: unknown;
		try {
			acquireDataDirLock(temp.dir);
		} catch (err) {
			caught = err;
		}
		expect(caught).toBeInstanceOf(DataDirInUseError);
		expect((caught as Error).message).toContain(temp.dir);
		expect((caught as Error).message).toContain(String(holder));
	});

	it('takes over a stale lock left by a dead process', async () => {
		const temp = tempDir();
		cleanups.push(temp.remove);
		writeFileSync(join(temp.dir, 'pglite.lock'), String(await deadPid()));
		const release = acquireDataDirLock(temp.dir);
		expect(readFileSync(join(temp.dir, 'pglite.lock'), 'utf8')).toBe(String(process.pid));
		release();
		expect(existsSync(join(temp.dir, 'pglite.lock'))).toBe(false);
	});

	it('keeps every row from two concurrent writers, and refuses a second opener meanwhile', async () => {
		const temp = tempDir();
		cleanups.push(temp.remove);
		const database = await openPglite(temp.dir);
		await database.migrate();
		const writer = (name: string) =>
			(async () => {
				for (let i = 0; i < 150; i++) {
					await database.db.insert(users).values({ email: `${name}-${i}@example.test` });
				}
			})();
		await Promise.all([writer('a'), writer('b')]);
		await expect(openPglite(temp.dir)).rejects.toBeInstanceOf(DataDirInUseError);
		await database.close();

		const reopened = await openPglite(temp.dir);
		const [{ rows }] = await reopened.db.select({ rows: count() }).from(users);
		expect(rows).toBe(300);
		await reopened.close();
	});
});
