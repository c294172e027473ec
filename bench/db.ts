// Database throughput: 10,000 activity rows inserted one statement at a time and read back in
// pages, through the app's query layer (Drizzle) and through the raw driver underneath it, on
// in-memory PGlite and on a throwaway PostgreSQL server. Run: npm run bench:db
import { randomUUID } from 'node:crypto';
import type { PGlite } from '@electric-sql/pglite';
import pg from 'pg';
import { findPostgresBin, startPostgres } from '../scripts/postgres.js';
import { openPglite, openPostgres, type Database } from '../src/lib/server/db/connect';
import { listTeamActivity, recordActivity } from '../src/lib/server/db/queries/activity';

const ROWS = 10_000;
const PAGE = 500;
const READ_ROUNDS = 5;

interface Raw {
	query: (sql: string, params: unknown[]) => Promise<{ rows: unknown[] }>;
	close: () => Promise<void>;
}

const actor = { id: randomUUID(), name: 'Tomas Reyes' };
const entry = (teamId: string, i: number) => ({
	teamId,
	actor,
	entity: 'finding',
	entityId: `KF-1002-A-${i}`,
	action: 'comment',
	summary: `commented on finding ${i} of KF-1002 rev A`,
	after: { finding: i, text: 'Ø18 H7 bore: state the position tolerance' }
});

const insertSql = `insert into activity
	(team_id, actor_id, actor_name, entity, entity_id, action, summary, before, after)
	values ($1, $2, $3, $4, $5, $6, $7, $8, $9)`;
const pageSql = `select * from activity where team_id = $1 and ($2::bigint is null or id < $2)
	order by id desc limit ${PAGE}`;

async function timed(work: () => Promise<number>) {
	const start = performance.now();
	const rows = await work();
	return rows / ((performance.now() - start) / 1000);
}

async function appPath(database: Database) {
	const teamId = randomUUID();
	const insert = await timed(async () => {
		for (let i = 0; i < ROWS; i++) await recordActivity(database.db, entry(teamId, i));
		return ROWS;
	});
	const read = await timed(async () => {
		let total = 0;
		for (let round = 0; round < READ_ROUNDS; round++) {
			let before: number | undefined;
			for (;;) {
				const page = await listTeamActivity(database.db, teamId, { before, limit: PAGE });
				total += page.length;
				if (page.length < PAGE) break;
				before = page[page.length - 1].id;
			}
		}
		return total;
	});
	return { insert, read };
}

async function rawPath(raw: Raw) {
	const teamId = randomUUID();
	const insert = await timed(async () => {
		for (let i = 0; i < ROWS; i++) {
			const e = entry(teamId, i);
			await raw.query(insertSql, [
				e.teamId,
				e.actor.id,
				e.actor.name,
				e.entity,
				e.entityId,
				e.action,
				e.summary,
				null,
				JSON.stringify(e.after)
			]);
		}
		return ROWS;
	});
	const read = await timed(async () => {
		let total = 0;
		for (let round = 0; round < READ_ROUNDS; round++) {
			let before: number | null = null;
			for (;;) {
				const { rows } = await raw.query(pageSql, [teamId, before]);
				total += rows.length;
				if (rows.length < PAGE) break;
				before = Number((rows[rows.length - 1] as { id: string | number }).id);
			}
		}
		return total;
	});
	return { insert, read };
}

type Figures = { insert: number; read: number };
const results: { name: string; app: Figures; raw: Figures }[] = [];

async function measure(name: string, database: Database, raw: Raw) {
	// A warm-up of both paths, so neither pays for the JIT, first plans or connections.
	const warm = randomUUID();
	for (let i = 0; i < 1000; i++) {
		await recordActivity(database.db, entry(warm, i));
		await raw.query(insertSql, [warm, null, null, 'warm-up', String(i), 'a', 's', null, null]);
	}
	for (let i = 0; i < 20; i++) {
		await listTeamActivity(database.db, warm, { limit: PAGE });
		await raw.query(pageSql, [warm, null]);
	}
	const app = await appPath(database);
	const rawFigures = await rawPath(raw);
	results.push({ name, app, raw: rawFigures });
}

const pglite = await openPglite(null);
await pglite.migrate();
const pgliteClient = (pglite.db as unknown as { $client: PGlite }).$client;
await measure('PGlite (in memory)', pglite, {
	query: (sql, params) => pgliteClient.query(sql, params),
	close: async () => {}
});
await pglite.close();

if (!findPostgresBin()) {
	console.log('!! PostgreSQL not installed: apt-get install -y postgresql — PGlite only');
} else {
	const server = await startPostgres();
	try {
		const postgres = await openPostgres(server.url);
		await postgres.migrate();
		const client = new pg.Client({ connectionString: server.url });
		await client.connect();
		await measure('PostgreSQL (local server)', postgres, {
			query: (sql, params) => client.query(sql, params),
			close: () => client.end()
		});
		await client.end();
		await postgres.close();
	} finally {
		server.stop();
	}
}

const rate = (n: number) => Math.round(n).toLocaleString('en').padStart(9);
console.log(
	`\n${ROWS.toLocaleString('en')} activity rows, one INSERT each; read back ${READ_ROUNDS}× in pages of ${PAGE}`
);
console.log(
	`${'database'.padEnd(28)}${'path'.padEnd(24)}${'insert rows/s'.padStart(14)}${'read rows/s'.padStart(14)}`
);
for (const { name, app, raw } of results) {
	const row = (path: string, f: Figures) =>
		console.log(
			`${name.padEnd(28)}${path.padEnd(24)}${rate(f.insert).padStart(14)}${rate(f.read).padStart(14)}`
		);
	row('app (Drizzle queries)', app);
	row('raw driver', raw);
	console.log(
		`${name.padEnd(28)}${'app / raw'.padEnd(24)}${(app.insert / raw.insert).toFixed(2).padStart(14)}${(app.read / raw.read).toFixed(2).padStart(14)}`
	);
}
