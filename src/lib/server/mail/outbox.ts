import { and, asc, eq, isNull, lte, sql } from 'drizzle-orm';
import type { Db } from '../db/connect';
import { outbox, type OutboxRow } from '../db/schema';
import type { Mailer } from './index';

export interface QueuedMail {
	to: string;
	subject: string;
	text: string;
	html: string;
	kind: string;
}

/** Mail whose body carries a key to an account: once sent, the outbox keeps no copy of it. */
export const secretKinds = new Set([
	'verify-email',
	'reset-password',
	'sign-in-link',
	'invitation'
]);

/** The Message-ID stays the same on every retry, so a receiver can drop a duplicate. */
export function messageIdOf(row: Pick<OutboxRow, 'id'>, domain = 'checkplate.local') {
	return `<${row.id}@${domain}>`;
}

export async function queueMail(db: Db, mail: QueuedMail) {
	const [row] = await db
		.insert(outbox)
		.values({
			recipient: mail.to,
			subject: mail.subject,
			text: mail.text,
			html: mail.html,
			kind: mail.kind
		})
		.returning();
	return row;
}

/** Backoff after the nth failed attempt: 5 s, 10 s, 20 s … capped at 15 minutes. */
export function retryDelayMs(attempts: number) {
	return Math.min(5_000 * 2 ** Math.max(0, attempts - 1), 15 * 60_000);
}

/**
 * Sends what is due. Rows are claimed with SKIP LOCKED so several app instances can run this
 * at once without sending one message twice in the normal case.
 */
export async function deliverDueMail(db: Db, mailer: Mailer, now = new Date(), limit = 20) {
	const due = await db.transaction(async (tx) => {
		const rows = await tx
			.select()
			.from(outbox)
			.where(and(isNull(outbox.sentAt), lte(outbox.nextAttemptAt, now)))
			.orderBy(asc(outbox.nextAttemptAt))
			.limit(limit)
			.for('update', { skipLocked: true });
		for (const row of rows) {
			// Claim for a minute; a crash mid-send leaves the row to be retried, never lost.
			await tx
				.update(outbox)
				.set({ nextAttemptAt: new Date(now.getTime() + 60_000) })
				.where(eq(outbox.id, row.id));
		}
		return rows;
	});
	let sent = 0;
	for (const row of due) {
		try {
			await mailer.send({
				to: row.recipient,
				subject: row.subject,
				text: row.text,
				html: row.html,
				messageId: messageIdOf(row)
			});
			await db
				.update(outbox)
				.set({
					sentAt: new Date(),
					attempts: row.attempts + 1,
					lastError: null,
					...(secretKinds.has(row.kind) ? { text: '', html: '' } : {})
				})
				.where(eq(outbox.id, row.id));
			sent++;
		} catch (err) {
			const attempts = row.attempts + 1;
			await db
				.update(outbox)
				.set({
					attempts,
					lastError: String((err as Error).message ?? err).slice(0, 500),
					nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts))
				})
				.where(eq(outbox.id, row.id));
		}
	}
	return { sent, failed: due.length - sent };
}

export async function pendingMailCount(db: Db) {
	const [row] = await db
		.select({ count: sql<number>`count(*)::int` })
		.from(outbox)
		.where(isNull(outbox.sentAt));
	return row.count;
}
