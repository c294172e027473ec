import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { createMailer } from '../../src/lib/server/mail';
import { listCaughtMail } from '../../src/lib/server/mail/caught';
import {
	deliverDueMail,
	messageIdOf,
	pendingMailCount,
	queueMail
} from '../../src/lib/server/mail/outbox';
import { outbox } from '../../src/lib/server/db/schema';
import { freshDatabase, startFakes } from './harness';

let database: Database;
let fakes: Awaited<ReturnType<typeof startFakes>>;

beforeAll(async () => {
	database = await freshDatabase();
	fakes = await startFakes();
});
afterAll(async () => {
	await database?.close();
	await fakes?.stop();
});

const mail = {
	to: 'drafter@example.test',
	subject: 'KF-1002 rev A returned',
	text: 'Two findings are assigned to you.',
	html: '<p>Two findings are assigned to you.</p>',
	kind: 'revision-returned'
};

describe('the outbox', () => {
	it('keeps mail while the server is down, retries with backoff, then delivers with a stable Message-ID', async () => {
		const row = await queueMail(database.db, mail);
		const down = createMailer('smtp://127.0.0.1:1', 'Checkplate <c@example.test>');
		const now = new Date();
		expect(await deliverDueMail(database.db, down, now)).toEqual({ sent: 0, failed: 1 });
		expect(await pendingMailCount(database.db)).toBe(1);
		// Not due again until the backoff has passed.
		const up = createMailer(fakes.smtpUrl, 'Checkplate <c@example.test>');
		expect(await deliverDueMail(database.db, up, new Date(now.getTime() + 1000))).toEqual({
			sent: 0,
			failed: 0
		});
		expect(await deliverDueMail(database.db, up, new Date(now.getTime() + 6000))).toEqual({
			sent: 1,
			failed: 0
		});
		expect(await pendingMailCount(database.db)).toBe(0);
		const caught = await listCaughtMail(fakes.mailDir);
		expect(caught[0].subject).toBe(mail.subject);
		expect(caught[0].messageId).toBe(messageIdOf(row));
		up.close();
		down.close();
	});

	it('keeps no copy of a sent sign-in, reset, invitation or confirmation link; other mail stays', async () => {
		const kinds = ['sign-in-link', 'reset-password', 'invitation', 'verify-email'];
		const secret = 'https://checkplate.test/auth/callback/nodemailer?token=secret-key';
		const rows = await Promise.all(
			kinds.map((kind) =>
				queueMail(database.db, { ...mail, kind, text: secret, html: `<a href="${secret}">x</a>` })
			)
		);
		const kept = await queueMail(database.db, mail);
		const smtp = createMailer(fakes.smtpUrl, 'Checkplate <c@example.test>');
		expect(await deliverDueMail(database.db, smtp)).toEqual({ sent: 5, failed: 0 });
		const stored = await database.db.select().from(outbox);
		for (const row of rows) {
			expect(stored.find((s) => s.id === row.id)).toMatchObject({ text: '', html: '' });
		}
		expect(stored.find((s) => s.id === kept.id)).toMatchObject({
			text: mail.text,
			html: mail.html
		});
		const caught = await listCaughtMail(fakes.mailDir);
		expect(caught.filter((m) => m.text.includes('secret-key'))).toHaveLength(4);
		smtp.close();
	});
});
