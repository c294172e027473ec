import { and, desc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../connect';
import { apiTokens, users } from '../schema';
import { hashSecretToken, newSecretToken } from '../../secret-tokens';
import { recordActivity, type Actor } from './activity';

const prefix = 'cpt_';

export async function createApiToken(
	db: Db,
	actor: Actor,
	input: { name: string; expiresAt: Date | null }
) {
	const { token, hash } = newSecretToken(prefix);
	return db.transaction(async (tx) => {
		const [row] = await tx
			.insert(apiTokens)
			.values({
				userId: actor.id,
				name: input.name,
				tokenHash: hash,
				hint: token.slice(-4),
				expiresAt: input.expiresAt
			})
			.returning();
		await recordActivity(tx, {
			teamId: null,
			actor,
			entity: 'api-token',
			entityId: row.id,
			action: 'create',
			summary: `created the API token "${row.name}"`,
			after: { name: row.name, expiresAt: row.expiresAt }
		});
		return { token, row };
	});
}

export async function listApiTokens(db: Db, userId: string) {
	return db
		.select({
			id: apiTokens.id,
			name: apiTokens.name,
			hint: apiTokens.hint,
			expiresAt: apiTokens.expiresAt,
			lastUsedAt: apiTokens.lastUsedAt,
			revokedAt: apiTokens.revokedAt,
			createdAt: apiTokens.createdAt
		})
		.from(apiTokens)
		.where(eq(apiTokens.userId, userId))
		.orderBy(desc(apiTokens.createdAt));
}

export async function revokeApiToken(db: Db, actor: Actor, id: string) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.update(apiTokens)
			.set({ revokedAt: new Date() })
			.where(and(eq(apiTokens.id, id), eq(apiTokens.userId, actor.id), isNull(apiTokens.revokedAt)))
			.returning();
		if (!row) return false;
		await recordActivity(tx, {
			teamId: null,
			actor,
			entity: 'api-token',
			entityId: id,
			action: 'revoke',
			summary: `revoked the API token "${row.name}"`
		});
		return true;
	});
}

/** The user a Bearer token stands for, or null when unknown, revoked or expired. */
export async function userForApiToken(db: Db, token: string, now = new Date()) {
	if (!token.startsWith(prefix)) return null;
	const [row] = await db
		.select({ token: apiTokens, user: users })
		.from(apiTokens)
		.innerJoin(users, eq(users.id, apiTokens.userId))
		.where(eq(apiTokens.tokenHash, hashSecretToken(token)));
	if (!row || row.token.revokedAt || (row.token.expiresAt && row.token.expiresAt <= now)) {
		return null;
	}
	// Once a minute is enough to show when a token was last used.
	if (!row.token.lastUsedAt || now.getTime() - row.token.lastUsedAt.getTime() > 60_000) {
		await db.update(apiTokens).set({ lastUsedAt: now }).where(eq(apiTokens.id, row.token.id));
	}
	return row.user;
}
