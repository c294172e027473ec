import { readFileSync } from 'node:fs';
import pg from 'pg';
import { afterEach, describe, expect, it } from 'vitest';
import { openPostgres, type Database } from '../../src/lib/server/db/connect';
import type { Mailer } from '../../src/lib/server/mail';
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
});
