import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import { openDatabase, type Database, type Db } from './connect';

export type { Db } from './connect';

let database: Database | undefined;

/** Opens the process-wide database once; never while building. */
export async function startDatabase(): Promise<Database> {
	if (building) throw new Error('The database is not opened while building');
	if (!database) {
		database = await openDatabase({
			databaseUrl: env.DATABASE_URL || undefined,
			migrationUrl: env.MIGRATION_DATABASE_URL || undefined,
			dataDir: env.DATA_DIR || './data'
		});
		const opened = database;
		process.once('sveltekit:shutdown', () => void opened.close());
	}
	return database;
}

/** The app's database. Valid after `init` in hooks.server.ts has run. */
export const db: Db = new Proxy({} as Db, {
	get(_target, property) {
		if (!database) throw new Error('Database not started: init in hooks.server.ts has not run');
		const value = Reflect.get(database.db as object, property);
		return typeof value === 'function' ? value.bind(database.db) : value;
	}
});
