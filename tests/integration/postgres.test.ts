import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import pg from 'pg';
import { afterEach, describe, expect, it } from 'vitest';
import { openPostgres, type Database } from '../../src/lib/server/db/connect';
import type { Mailer } from '../../src/lib/server/mail';
import { createTeam } from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { deliverDueMail, pendingMailCount, queueMail } from '../../src/lib/server/mail/outbox';
import { freshDatabase, freshPostgres, testDatabase } from './harness';

const opened: Database[] = [];
afterEach(async () => {
	for (const database of opened.splice(0).reverse()) await database.close();
});

const journal = JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as {
	entries: unknown[];
};

it('runs on the database TEST_DATABASE names', async () => {
	const database = await freshDatabase();
	opened.push(database);
	expect(database.kind).toBe(testDatabase);
});

describe.skipIf(testDatabase !== 'postgres')('on a PostgreSQL server', () => {
	it('applies every migration once when several instances start together', async () => {
		const first = await freshPostgres();
		opened.push(first);
		const others = await Promise.all([openPostgres(first.url), openPostgres(first.url)]);
		opened.push(...others);
		await Promise.all([first, ...others].map((database) => database.migrate()));
		const client = new pg.Client({ connectionString: first.url });
		await client.connect();
		const applied = await client.query(
			'select count(*)::int as n from drizzle.__drizzle_migrations'
		);
		const triggers = await client.query('select tgname from pg_trigger where not tgisinternal');
		await client.end();
		expect(applied.rows[0].n).toBe(journal.entries.length);
		expect(triggers.rows.map((t) => t.tgname)).toEqual(
			expect.arrayContaining(['activity_append_only', 'activity_no_truncate'])
		);
	});

	it('sends each queued message once when two instances deliver at the same time', async () => {
		const first = await freshPostgres();
		opened.push(first);
		await first.migrate();
		const second = await openPostgres(first.url);
		opened.push(second);
		for (let i = 0; i < 40; i++) {
			await queueMail(first.db, {
				to: `reader-${i}@example.test`,
				subject: `message ${i}`,
				text: 'text',
				html: '<p>text</p>',
				kind: 'test'
			});
		}
		const sent: string[] = [];
		const slowMailer = {
			async send(message: { messageId?: string }) {
				await new Promise((done) => setTimeout(done, 5));
				sent.push(message.messageId!);
				return { messageId: message.messageId!, accepted: [] };
			},
			close() {}
		} as unknown as Mailer;
		const rounds = await Promise.all([
			deliverDueMail(first.db, slowMailer, new Date(), 10),
			deliverDueMail(second.db, slowMailer, new Date(), 10),
			deliverDueMail(first.db, slowMailer, new Date(), 10),
			deliverDueMail(second.db, slowMailer, new Date(), 10)
		]);
		expect(rounds.reduce((total, round) => total + round.sent, 0)).toBe(40);
		expect(new Set(sent).size).toBe(40);
		expect(sent).toHaveLength(40);
		expect(await pendingMailCount(first.db)).toBe(0);
	});

	it("runs as a role that cannot remove the trail's append-only trigger or any table", async () => {
		const server = new URL(process.env.TEST_POSTGRES_URL!);
		const suffix = randomBytes(4).toString('hex');
		const [owner, runtime, name] = ['owner', 'app', 'roles'].map((w) => `cp_${w}_${suffix}`);
		const as = (role: string) => {
			const url = new URL(server);
			url.username = role;
			url.pathname = `/${name}`;
			return url.href;
		};
		const admin = new pg.Client({ connectionString: server.href });
		await admin.connect();
		await admin.query(`CREATE ROLE ${owner} LOGIN; CREATE ROLE ${runtime} LOGIN`);
		await admin.query(`CREATE DATABASE ${name} OWNER ${owner}`);
		// The README's grants, with this test's role names.
		const readme = readFileSync('README.md', 'utf8');
		const block = /runtime role grants: start -->\s*```sql\n([\s\S]*?)```/.exec(readme)![1];
		const ownerClient = new pg.Client({ connectionString: as(owner) });
		await ownerClient.connect();
		await ownerClient.query(
			block.replaceAll('checkplate_owner', owner).replaceAll('checkplate_app', runtime)
		);
		await ownerClient.end();

		const database = await openPostgres(as(runtime), { migrationUrl: as(owner) });
		const client = new pg.Client({ connectionString: as(runtime) });
		try {
			await database.migrate();
			// The app's own work needs nothing more.
			const user = (await createUser(database.db, {
				name: 'Runtime',
				email: 'runtime@example.test',
				passwordHash: null
			}))!;
			await createTeam(database.db, user, { slug: 'roles', name: 'Roles' });

			await client.connect();
			const refused = async (statement: string) =>
				expect(client.query(statement), statement).rejects.toThrow(
					/must be owner|permission denied|append-only/
				);
			await refused('DROP TRIGGER activity_append_only ON activity');
			await refused('ALTER TABLE activity DISABLE TRIGGER activity_append_only');
			await refused('ALTER TABLE activity DISABLE TRIGGER ALL');
			await refused('DROP TABLE activity');
			await refused('DROP TABLE users CASCADE');
			await refused('ALTER TABLE activity OWNER TO CURRENT_USER');
			await refused(
				'CREATE OR REPLACE FUNCTION activity_refuse_change() RETURNS trigger AS $$ BEGIN RETURN NEW; END; $$ LANGUAGE plpgsql'
			);
			await refused('CREATE TABLE sneaky (id int)');
			await refused('DELETE FROM activity');
			await refused('TRUNCATE activity');
			const trail = await client.query('SELECT summary FROM activity');
			expect(trail.rows.map((r) => r.summary)).toEqual(['created the team Roles']);
		} finally {
			await client.end().catch(() => {});
			await database.close();
			await admin.query(`DROP DATABASE ${name} WITH (FORCE)`);
			await admin.query(`DROP ROLE ${runtime}; DROP ROLE ${owner}`);
			await admin.end();
		}
	});
});
