import { and, eq, gt, lt, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import { authAttempts } from '../schema';

type Scope = 'sign-in' | 'reset';

/** Failures allowed per window; an address may be shared by a whole office, so it gets more. */
export const attemptLimits = {
	'sign-in': { account: 10, address: 50, windowMs: 15 * 60_000 },
	reset: { account: 5, address: 30, windowMs: 15 * 60_000 }
} as const;

/** Keys are `account:<email>` and `address:<ip>`: a limit on either stops the attempt. */
export async function isRateLimited(db: Db, scope: Scope, keys: string[], now = new Date()) {
	const limits = attemptLimits[scope];
	const since = new Date(now.getTime() - limits.windowMs);
	for (const key of keys) {
		const perKey = key.startsWith('address:') ? limits.address : limits.account;
		const [row] = await db
			.select({ count: sql<number>`count(*)::int` })
			.from(authAttempts)
			.where(
				and(eq(authAttempts.scope, scope), eq(authAttempts.key, key), gt(authAttempts.at, since))
			);
		if (row.count >= perKey) return true;
	}
	return false;
}

export async function recordAttempt(db: Db, scope: Scope, keys: string[], now = new Date()) {
	if (keys.length === 0) return;
	await db.insert(authAttempts).values(keys.map((key) => ({ scope, key, at: now })));
	// Old rows are of no use to any limit.
	await db
		.delete(authAttempts)
		.where(lt(authAttempts.at, new Date(now.getTime() - 24 * 60 * 60_000)));
}

export async function clearAttempts(db: Db, scope: Scope, key: string) {
	await db
		.delete(authAttempts)
		.where(and(eq(authAttempts.scope, scope), eq(authAttempts.key, key)));
}
