import { closeSync, mkdirSync, openSync, readFileSync, unlinkSync, writeSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import pg from 'pg';
import * as schema from './schema';

export type Db = PgDatabase<PgQueryResultHKT, typeof schema>;

export interface Database {
	db: Db;
	kind: 'pglite' | 'postgres';
	migrate: (migrationsFolder?: string) => Promise<void>;
	close: () => Promise<void>;
}

export class DataDirInUseError extends Error {
	constructor(
		readonly dataDir: string,
		readonly pid: number
	) {
		super(
			`The data directory ${dataDir} is in use by process ${pid}. ` +
				`Stop that process, or set DATA_DIR to another directory.`
		);
	}
}

function processIsAlive(pid: number): boolean {
	try {
		process.kill(pid, 0);
		return true;
	} catch (err) {
		return (err as NodeJS.ErrnoException).code === 'EPERM';
	}
}

/**
 * PGlite has no lock between processes: two processes on one directory both "work" and
 * silently lose writes. A lock file holding our pid keeps it to one; a dead holder's lock
 * is taken over.
 */
export function acquireDataDirLock(dataDir: string): () => void {
	mkdirSync(dataDir, { recursive: true });
	const lockPath = join(dataDir, 'pglite.lock');
	for (let attempt = 0; attempt < 3; attempt++) {
		try {
			const fd = openSync(lockPath, 'wx');
			writeSync(fd, String(process.pid));
			closeSync(fd);
			let released = false;
			return () => {
				if (released) return;
				released = true;
				try {
					if (readFileSync(lockPath, 'utf8').trim() === String(process.pid)) unlinkSync(lockPath);
				} catch {
					// already gone
				}
			};
		} catch (err) {
			if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
			const holder = Number.parseInt(readFileSync(lockPath, 'utf8').trim(), 10);
			if (Number.isInteger(holder) && processIsAlive(holder)) {
				throw new DataDirInUseError(dataDir, holder);
			}
			unlinkSync(lockPath);
		}
	}
	throw new Error(`Could not take the lock on ${dataDir}`);
}

const defaultMigrations = () => resolve(process.cwd(), 'drizzle');

/** Opens the embedded database in `dataDir` (or in memory when `dataDir` is null). */
export async function openPglite(dataDir: string | null): Promise<Database> {
	const release = dataDir ? acquireDataDirLock(dataDir) : () => {};
	let client: PGlite;
	try {
		client = new PGlite(dataDir ? join(dataDir, 'pglite') : undefined);
		await client.waitReady;
	} catch (err) {
		release();
		throw err;
	}
	const db = drizzlePglite(client, { schema }) as unknown as Db;
	return {
		db,
		kind: 'pglite',
		migrate: (folder = defaultMigrations()) =>
			migratePglite(db as never, { migrationsFolder: folder }),
		close: async () => {
			try {
				if (!client.closed) await client.close();
			} finally {
				release();
			}
		}
	};
}

/** Any fixed number: the key of the advisory lock held while migrating. */
const migrationLockKey = 7_302_114_551;

/**
 * `url` is the runtime role's. With `migrationUrl` the migrations run as that role instead (the
 * owner of the tables), so the runtime role needs only SELECT, INSERT, UPDATE and DELETE and
 * cannot drop or alter a table or the activity trail's append-only trigger (README, "Running
 * several instances").
 */
export async function openPostgres(
	url: string,
	options: { migrationUrl?: string } = {}
): Promise<Database> {
	const pool = new pg.Pool({ connectionString: url, max: 10 });
	// An idle connection ended by the server (a restart, an administrator, a dropped test
	// database) is reported here; without a listener node-postgres throws it and the process
	// ends. The pool replaces the connection on the next query.
	pool.on('error', (err) => console.error(`PostgreSQL connection lost: ${err.message}`));
	const db = drizzlePg(pool, { schema }) as unknown as Db;
	return {
		db,
		kind: 'postgres',
		// Instances starting together would each apply the same migrations and fail on the
		// second CREATE: one migrates under the lock, the others wait and find nothing to do.
		migrate: async (folder = defaultMigrations()) => {
			const owner = options.migrationUrl
				? new pg.Client({ connectionString: options.migrationUrl })
				: null;
			if (owner) await owner.connect();
			const client = owner ?? (await pool.connect());
			try {
				await client.query('SELECT pg_advisory_lock($1)', [migrationLockKey]);
				try {
					await migratePg(drizzlePg(client, { schema }), { migrationsFolder: folder });
				} finally {
					await client.query('SELECT pg_advisory_unlock($1)', [migrationLockKey]);
				}
			} finally {
				if (owner) await owner.end();
				else (client as pg.PoolClient).release();
			}
		},
		close: () => pool.end()
	};
}

export function openDatabase(settings: {
	databaseUrl?: string;
	migrationUrl?: string;
	dataDir: string;
}) {
	return settings.databaseUrl
		? openPostgres(settings.databaseUrl, { migrationUrl: settings.migrationUrl })
		: openPglite(resolve(settings.dataDir));
}
