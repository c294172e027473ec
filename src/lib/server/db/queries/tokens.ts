import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../connect';
import { userTokens } from '../schema';
import { hashSecretToken, newSecretToken } from '../../secret-tokens';

type Purpose = (typeof userTokens.$inferInsert)['purpose'];

/** A fresh random secret for the link; only its hash is stored. */
export async function issueUserToken(db: Db, userId: string, purpose: Purpose, ttlMs: number) {
	const { token, hash } = newSecretToken();
	await db.insert(userTokens).values({
		userId,
		purpose,
		tokenHash: hash,
		expiresAt: new Date(Date.now() + ttlMs)
	});
	return token;
}

export type ConsumeResult =
	{ ok: true; userId: string } | { ok: false; reason: 'invalid' | 'expired' };

/** Whether a token would be accepted now, without using it (a page shows what it confirms). */
export async function peekUserToken(
	db: Db,
	token: string,
	purpose: Purpose,
	now = new Date()
): Promise<{ ok: true } | { ok: false; reason: 'invalid' | 'expired' }> {
	const [row] = await db
		.select({ usedAt: userTokens.usedAt, expiresAt: userTokens.expiresAt })
		.from(userTokens)
		.where(and(eq(userTokens.tokenHash, hashSecretToken(token)), eq(userTokens.purpose, purpose)));
	if (!row || row.usedAt) return { ok: false, reason: 'invalid' };
	if (row.expiresAt <= now) return { ok: false, reason: 'expired' };
	return { ok: true };
}

/**
 * Uses a token once. Looking it up by its hash means no secret is compared byte by byte, and
 * the conditional update makes a second use fail even when two requests race.
 */
export async function consumeUserToken(
	db: Db,
	token: string,
	purpose: Purpose,
	now = new Date()
): Promise<ConsumeResult> {
	const tokenHash = hashSecretToken(token);
	const [row] = await db
		.select()
		.from(userTokens)
		.where(and(eq(userTokens.tokenHash, tokenHash), eq(userTokens.purpose, purpose)));
	if (!row || row.usedAt) return { ok: false, reason: 'invalid' };
	if (row.expiresAt <= now) return { ok: false, reason: 'expired' };
	const used = await db
		.update(userTokens)
		.set({ usedAt: now })
		.where(and(eq(userTokens.id, row.id), isNull(userTokens.usedAt)))
		.returning({ id: userTokens.id });
	if (used.length === 0) return { ok: false, reason: 'invalid' };
	return { ok: true, userId: row.userId };
}

/** Ends every unused link of one purpose for the user: only a link issued after this works. */
export async function retireUserTokens(db: Db, userId: string, purpose: Purpose) {
	await db
		.update(userTokens)
		.set({ usedAt: new Date() })
		.where(
			and(eq(userTokens.userId, userId), eq(userTokens.purpose, purpose), isNull(userTokens.usedAt))
		);
}
