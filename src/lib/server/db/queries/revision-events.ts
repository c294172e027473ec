/*
 * The revision's change feed (PRODUCT.md §6, server-sent events): one row per change, written in
 * the change's own transaction, and a notification on one channel that PostgreSQL (and PGlite)
 * delivers to every listener when, and only if, that transaction commits. Each app instance
 * listens once (`src/lib/server/live-events.ts`) and hands the event to the board streams open on
 * that revision; a stream that reconnects reads what it missed from these rows.
 */
import { and, asc, desc, eq, gt, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import { chunks } from './activity';
import {
	revisionEvents,
	revisions,
	type RevisionEventRow,
	type RevisionEventType
} from '../schema';

/** The one notification channel of the app. */
export const liveChannel = 'checkplate_live';

export type EventSubject = NonNullable<RevisionEventRow['subject']>;

/** A change as a stream sends it (the SSE `data`), with the revision it belongs to. */
export interface RevisionEvent {
	/** The durable sequence number: the SSE `id:`. */
	seq: number;
	revisionId: string;
	type: RevisionEventType;
	action: string;
	id: string;
	version: number | null;
	subject?: EventSubject;
}

/** What the channel carries: a revision's change, or a member's access changing. */
export type LiveNotice =
	({ kind: 'event' } & RevisionEvent) | { kind: 'member'; teamId: string; userId: string };

export const eventOf = (row: RevisionEventRow): RevisionEvent => ({
	seq: row.id,
	revisionId: row.revisionId,
	type: row.type,
	action: row.action,
	id: row.entityId,
	version: row.version ?? null,
	...(row.subject ? { subject: row.subject } : {})
});

export interface NewRevisionEvent {
	revisionId: string;
	type: RevisionEventType;
	action: string;
	id: string;
	version?: number | null;
	subject?: EventSubject;
	/**
	 * Take the revision's row lock first (default). Sequence numbers are handed out in lock
	 * order, so per revision they commit in order and a catch-up from `id > n` misses nothing.
	 * Only a fit's second listing, on its shaft's revision, skips it (two locks could deadlock).
	 */
	lock?: boolean;
}

/** Records a change in the transaction `tx`; listeners hear of it once `tx` commits. */
export async function appendEvent(tx: Db, event: NewRevisionEvent) {
	const [row] = await appendEvents(tx, event.revisionId, [event], { lock: event.lock });
	return row;
}

/** Several changes of one revision (an import), in one statement and one notification each. */
export async function appendEvents(
	tx: Db,
	revisionId: string,
	events: Omit<NewRevisionEvent, 'revisionId' | 'lock'>[],
	options: { lock?: boolean } = {}
) {
	if (events.length === 0) return [];
	if (options.lock !== false) {
		await tx
			.select({ id: revisions.id })
			.from(revisions)
			.where(eq(revisions.id, revisionId))
			.for('update');
	}
	const rows: RevisionEventRow[] = [];
	// In runs: a statement's parameters are limited (an import of thousands).
	for (const run of chunks(events, 1000)) {
		const written = await tx
			.insert(revisionEvents)
			.values(
				run.map((event) => ({
					revisionId,
					type: event.type,
					action: event.action,
					entityId: event.id,
					version: event.version ?? null,
					subject: event.subject ?? null
				}))
			)
			.returning();
		rows.push(...written);
	}
	rows.sort((a, b) => a.id - b.id);
	const notices: LiveNotice[] = rows.map((row) => ({ kind: 'event', ...eventOf(row) }));
	await tx.execute(
		sql`select pg_notify(${liveChannel}, notice::text) from jsonb_array_elements(${JSON.stringify(notices)}::jsonb) as notice`
	);
	return rows;
}

/** Tells every instance that a member's access to a team changed (role, removal). */
export async function noticeMemberChange(tx: Db, teamId: string, userId: string) {
	const notice: LiveNotice = { kind: 'member', teamId, userId };
	await tx.execute(sql`select pg_notify(${liveChannel}, ${JSON.stringify(notice)})`);
}

/** The revision's changes after sequence number `after`, oldest first, at most `limit`. */
export async function eventsAfter(db: Db, revisionId: string, after: number, limit = 1000) {
	const rows = await db
		.select()
		.from(revisionEvents)
		.where(and(eq(revisionEvents.revisionId, revisionId), gt(revisionEvents.id, after)))
		.orderBy(asc(revisionEvents.id))
		.limit(limit);
	return rows.map(eventOf);
}

/** The revision's latest sequence number (0 before its first change): where a new board starts. */
export async function latestEventSeq(db: Db, revisionId: string) {
	const [row] = await db
		.select({ id: revisionEvents.id })
		.from(revisionEvents)
		.where(eq(revisionEvents.revisionId, revisionId))
		.orderBy(desc(revisionEvents.id))
		.limit(1);
	return row?.id ?? 0;
}
