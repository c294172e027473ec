import { and, eq, gt, lt, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import { authAttempts } from '../schema';

/**
 * What is counted: failed sign-ins (and wrong current passwords), and every request that sends
 * mail or spends a secret (sign-up, reset, e-mailed sign-in link, invitation).
 */
export type Scope = 'sign-in' | 'reset' | 'link' | 'sign-up' | 'invite';

interface Limit {
	/** Attempts per key that pass without delay; an address may be a whole office's, so more. */
	free: { account: number; address: number };
	/** The wait after the first attempt past `free`, doubled after each further one. */
	baseMs: number;
	maxMs: number;
}

const MINUTE = 60_000;
/** How long an attempt counts: past it, a key starts afresh. */
export const attemptMemoryMs = 24 * 60 * MINUTE;

/**
 * Growing delays rather than a lock-out: past the free attempts each one must wait
 * `baseMs · 2ⁿ` (at most `maxMs`) after the one before, and a request during the wait is
 * answered 429 with Retry-After without being counted or looked at. Someone guessing the
 * owner's password only slows the owner's password sign-in down (an e-mailed link still
 * works), and never for longer than `maxMs` at a time.
 */
export const attemptLimits: Record<Scope, Limit> = {
	'sign-in': { free: { account: 5, address: 20 }, baseMs: 1000, maxMs: 15 * MINUTE },
	// Each mails an address: a mailbox gets three a day before the waits; a client more.
	reset: { free: { account: 3, address: 50 }, baseMs: MINUTE, maxMs: 60 * MINUTE },
	link: { free: { account: 3, address: 50 }, baseMs: MINUTE, maxMs: 60 * MINUTE },
	'sign-up': { free: { account: 3, address: 50 }, baseMs: MINUTE, maxMs: 60 * MINUTE },
	invite: { free: { account: 30, address: 30 }, baseMs: MINUTE, maxMs: 60 * MINUTE }
};

/** The wait that `count` counted attempts impose after the last of them. */
export function delayAfter(limit: Limit, count: number, perKey: number) {
	if (count < perKey) return 0;
	return Math.min(limit.baseMs * 2 ** Math.min(count - perKey, 30), limit.maxMs);
}

/**
 * Keys are `account:<email>` (or `user:<id>`) and `address:<ip>`. Answers how many seconds to
 * wait before the next attempt on any of them (0: go ahead).
 */
export async function attemptWait(db: Db, scope: Scope, keys: string[], now = new Date()) {
	const limit = attemptLimits[scope];
	const since = new Date(now.getTime() - attemptMemoryMs);
	let waitMs = 0;
	for (const key of keys) {
		const perKey = key.startsWith('address:') ? limit.free.address : limit.free.account;
		const [row] = await db
			.select({
				count: sql<number>`count(*)::int`,
				last: sql<string | null>`max(${authAttempts.at})`
			})
			.from(authAttempts)
			.where(
				and(eq(authAttempts.scope, scope), eq(authAttempts.key, key), gt(authAttempts.at, since))
			);
		const delay = delayAfter(limit, row.count, perKey);
		if (delay > 0 && row.last) {
			waitMs = Math.max(waitMs, new Date(row.last).getTime() + delay - now.getTime());
		}
	}
	return Math.max(0, Math.ceil(waitMs / 1000));
}

export async function recordAttempt(db: Db, scope: Scope, keys: string[], now = new Date()) {
	if (keys.length === 0) return;
	await db.insert(authAttempts).values(keys.map((key) => ({ scope, key, at: now })));
	// Old rows are of no use to any limit.
	await db
		.delete(authAttempts)
		.where(lt(authAttempts.at, new Date(now.getTime() - attemptMemoryMs)));
}

/**
 * For requests that count every time (mail, invitations): the seconds to wait, or 0 after
 * counting this one.
 */
export async function spendAttempt(db: Db, scope: Scope, keys: string[], now = new Date()) {
	const wait = await attemptWait(db, scope, keys, now);
	if (wait === 0) await recordAttempt(db, scope, keys, now);
	return wait;
}

export async function clearAttempts(db: Db, scope: Scope, key: string) {
	await db
		.delete(authAttempts)
		.where(and(eq(authAttempts.scope, scope), eq(authAttempts.key, key)));
}
