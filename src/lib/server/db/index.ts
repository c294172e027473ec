import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import { openDatabase, type Database, type Db } from './connect';

export type { Db } from './connect';

let database: Database | undefined;

const notStarted = new Proxy({} as Db, {
	get() {
		throw new Error('Database not started: init in hooks.server.ts has not run');
	}
});

/**
 * The app's database, the one way into it: every load, action, route and service passes `db`
 * to the queries. It is the real client once `init` in hooks.server.ts has run
 * `startDatabase()`; before that any use throws.
 */
export let db: Db = notStarted;

/** Opens the process-wide database once (only `init` calls this); never while building. */
export async function startDatabase(): Promise<Database> {
	if (building) throw new Error('The database is not opened while building');
	if (!database) {
		database = await openDatabase({
			databaseUrl: env.DATABASE_URL || undefined,
			migrationUrl: env.MIGRATION_DATABASE_URL || undefined,
			dataDir: env.DATA_DIR || './data'
		});
		db = database.db;
		const opened = database;
		process.once('sveltekit:shutdown', () => void opened.close());
	}
	return database;
}
