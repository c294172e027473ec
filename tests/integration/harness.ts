import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { sql } from 'drizzle-orm';
import pg from 'pg';
import { openPglite, openPostgres, type Database, type Db } from '../../src/lib/server/db/connect';
import type { DrawingRow } from '../../src/lib/server/db/schema';
import { createDrawing, insertRevision } from '../../src/lib/server/db/queries/drawings';
import { createTeam } from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { startS3Fake } from '../../fakes/s3.js';
import { startSmtpFake } from '../../fakes/smtp.js';

export function tempDir(prefix = 'checkplate-test-') {
	const dir = mkdtempSync(join(tmpdir(), prefix));
	return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** Which database the integration suite runs on: `TEST_DATABASE=postgres` or PGlite. */
export const testDatabase = process.env.TEST_DATABASE === 'postgres' ? 'postgres' : 'pglite';

async function onServer(sql: string) {
	const url = process.env.TEST_POSTGRES_URL;
	if (!url) {
		throw new Error(
			'TEST_DATABASE=postgres needs TEST_POSTGRES_URL: run the tests through ' +
				'`node scripts/postgres.js <command>`, which starts a server and sets both'
		);
	}
	const admin = new pg.Client({ connectionString: url });
	await admin.connect();
	try {
		await admin.query(sql);
	} finally {
		await admin.end();
	}
	return url;
}

/** An empty database of its own on the test server; dropped again on close. */
export async function freshPostgres(): Promise<Database & { url: string }> {
	const name = `test_${randomBytes(6).toString('hex')}`;
	const serverUrl = new URL(await onServer(`CREATE DATABASE ${name}`));
	serverUrl.pathname = `/${name}`;
	const database = await openPostgres(serverUrl.href);
	return {
		...database,
		url: serverUrl.href,
		close: async () => {
			await database.close();
			await onServer(`DROP DATABASE ${name} WITH (FORCE)`);
		}
	};
}

/** A fresh database with the real migrations applied: in-memory PGlite, or on the test server. */
export async function freshDatabase(): Promise<Database> {
	const database = testDatabase === 'postgres' ? await freshPostgres() : await openPglite(null);
	await database.migrate();
	return database;
}

export async function startFakes() {
	const temp = tempDir('checkplate-fakes-');
	const bucket = 'checkplate-test';
	const s3 = await startS3Fake({ port: 0, directory: join(temp.dir, 's3'), bucket });
	const mailDir = join(temp.dir, 'mail');
	const smtp = await startSmtpFake({ port: 0, directory: mailDir });
	return {
		storageSettings: {
			endpoint: s3.endpoint,
			bucket,
			region: 'us-east-1',
			accessKeyId: 'S3RVER',
			secretAccessKey: 'S3RVER'
		},
		smtpUrl: smtp.url,
		mailDir,
		async stop() {
			await Promise.allSettled([s3.close(), smtp.close()]);
			temp.remove();
		}
	};
}

/**
 * Makes every `op` on `table` fail, as a fault part-way through a multi-table write would (a
 * trigger raising an error); returns the undo.
 */
export async function breakWrites(db: Db, table: string, op: 'INSERT' | 'UPDATE' = 'INSERT') {
	const name = `test_fault_${table}_${op.toLowerCase()}`;
	await db.execute(
		sql.raw(`CREATE OR REPLACE FUNCTION test_fault() RETURNS trigger AS $$
		BEGIN RAISE EXCEPTION 'injected fault'; END; $$ LANGUAGE plpgsql`)
	);
	await db.execute(
		sql.raw(`CREATE TRIGGER ${name} BEFORE ${op} ON "${table}"
		FOR EACH ROW EXECUTE FUNCTION test_fault()`)
	);
	return async () => {
		await db.execute(sql.raw(`DROP TRIGGER ${name} ON "${table}"`));
	};
}

/**
 * A drafter, the team Acme and two of its drawings: a bushing (mm, ISO 8015, ISO 2768-mK) and a
 * shaft (mm, ASME Y14.5-2018, no general tolerance). `newRevision` stores a revision of either
 * without a file (the services never read the PDF), lettered A, B, … in the order made.
 */
export async function teamWithTwoDrawings(db: Db) {
	const actor = (await createUser(db, {
		name: 'Dana Drafter',
		email: 'dana@example.test',
		passwordHash: null
	}))!;
	const team = await createTeam(db, actor, { slug: 'acme', name: 'Acme' });
	const bushing = await createDrawing(db, actor, team.id, {
		number: 'KF-1002',
		title: 'Bushing',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
	});
	const shaft = await createDrawing(db, actor, team.id, {
		number: 'KF-1003',
		title: 'Shaft',
		units: 'mm',
		standard: 'asme-y14.5-2018',
		generalTolerance: null
	});
	const sheet = { width: 1190.55, height: 841.89 };
	let made = 0;
	async function newRevision(drawing: DrawingRow, pages = 1) {
		const letter = 'ABCDEFGHJKLMNPRTUVWY'[made++];
		const revision = await insertRevision(db, actor, drawing, {
			letter,
			pages,
			sheets: Array.from({ length: pages }, () => sheet),
			sha256: letter.repeat(64),
			size: 1000,
			storageKey: `test/${drawing.number}-${letter}.pdf`
		});
		return { team, drawing, revision };
	}
	return { actor, team, bushing, shaft, newRevision };
}
