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

/** What a listener hears: each notification's payload, and that it listens again after a gap. */
export interface Listener {
	notice: (payload: string) => void;
	/** The connection was lost and is back: notifications in between are gone (catch up). */
	resumed?: () => void;
}

export interface Database {
	db: Db;
	kind: 'pglite' | 'postgres';
	migrate: (migrationsFolder?: string) => Promise<void>;
	/**
	 * LISTEN on `channel` (a plain lower-case name): PGlite in this process, or one connection
	 * of its own to the PostgreSQL server that comes back when lost. Returns the way to stop;
	 * `close` stops it too.
	 */
	listen: (channel: string, listener: Listener) => Promise<() => Promise<void>>;
	close: () => Promise<void>;
}

const channelName = (channel: string) => {
	if (!/^[a-z_][a-z0-9_]*$/.test(channel)) throw new Error(`Not a channel name: ${channel}`);
	return channel;
};

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
		listen: async (channel, listener) => {
			const stop = await client.listen(channelName(channel), listener.notice);
			return async () => {
				if (!client.closed) await stop();
			};
		},
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
	const listening = new Set<() => Promise<void>>();
	return {
		db,
		kind: 'postgres',
		listen: async (channel, listener) => {
			const stop = await listenPostgres(url, channelName(channel), listener);
			const once = async () => {
				listening.delete(once);
				await stop();
			};
			listening.add(once);
			return once;
		},
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
		close: async () => {
			await Promise.all([...listening].map((stop) => stop()));
			await pool.end();
		}
	};
}

/**
 * One connection that LISTENs; when it is lost (a server restart, a network cut) a new one is
 * opened a second later and the listener told `resumed`, since what was sent meanwhile is lost.
 */
async function listenPostgres(url: string, channel: string, listener: Listener) {
	let client: pg.Client | null = null;
	let stopped = false;
	let retry: ReturnType<typeof setTimeout> | undefined;
	const open = async (again: boolean): Promise<void> => {
		const next = new pg.Client({ connectionString: url });
		let lost = false;
		const reopen = () => {
			if (lost) return;
			lost = true;
			if (client === next) client = null;
			if (!stopped) retry = setTimeout(() => void open(true).catch(() => {}), 1000);
		};
		next.on('notification', (message) => {
			if (message.channel === channel && message.payload) listener.notice(message.payload);
		});
		next.on('error', (err) => {
			console.error(`PostgreSQL listening connection lost: ${err.message}`);
			reopen();
		});
		next.on('end', reopen);
		try {
			await next.connect();
			await next.query(`LISTEN ${channel}`);
		} catch (err) {
			next.end().catch(() => {});
			if (!again) throw err;
			reopen();
			return;
		}
		if (stopped) {
			await next.end();
			return;
		}
		client = next;
		if (again) listener.resumed?.();
	};
	await open(false);
	return async () => {
		stopped = true;
		clearTimeout(retry);
		const last = client;
		client = null;
		await last?.end().catch(() => {});
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
