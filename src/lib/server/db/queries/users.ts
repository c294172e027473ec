import { and, eq, isNull, sql } from 'drizzle-orm';
import type { PgUpdateSetSource } from 'drizzle-orm/pg-core';
import type { Db } from '../connect';
import { apiTokens, users } from '../schema';

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

export async function getUserByEmail(db: Db, email: string) {
	const [user] = await db
		.select()
		.from(users)
		.where(eq(users.email, normaliseEmail(email)));
	return user ?? null;
}

export async function getUserById(db: Db, id: string) {
	const [user] = await db.select().from(users).where(eq(users.id, id));
	return user ?? null;
}

export async function createUser(
	db: Db,
	input: { name: string; email: string; passwordHash: string | null; emailVerified?: Date | null }
) {
	const [user] = await db
		.insert(users)
		.values({
			name: input.name,
			email: normaliseEmail(input.email),
			passwordHash: input.passwordHash,
			emailVerified: input.emailVerified ?? null
		})
		.onConflictDoNothing({ target: users.email })
		.returning();
	return user ?? null;
}

/**
 * Someone used a link mailed to the address: it is proven. What anyone who typed the address
 * could have set before ends: every session and API token. `set` gives the password (and name)
 * that came with the proof: `passwordHash: null` when none did; left out, the pending password
 * stays (a verification link, which only the newest sign-up's password holds).
 */
export async function proveEmail(
	db: Db,
	userId: string,
	set: { passwordHash?: string | null; name?: string } = {}
) {
	await endCredentials(db, userId, {
		...set,
		emailVerified: sql`coalesce(${users.emailVerified}, now())`
	});
}

/**
 * A sign-up again on an address nobody has proven yet: the newest sign-up's name and password
 * replace the pending ones (its link is the only one that still works, see `signUp`).
 */
export async function replacePendingSignUp(
	db: Db,
	userId: string,
	input: { name: string; passwordHash: string }
) {
	const [user] = await db
		.update(users)
		.set({ name: input.name, passwordHash: input.passwordHash })
		.where(and(eq(users.id, userId), isNull(users.emailVerified)))
		.returning();
	return user ?? null;
}

/**
 * Ends every credential the user holds: sessions (tokens carry the generation they were issued
 * in) and personal API tokens. Run on a password reset or change and on "sign out everywhere".
 */
async function endCredentials(db: Db, userId: string, set: PgUpdateSetSource<typeof users>) {
	await db.transaction(async (tx) => {
		await tx
			.update(users)
			.set({ ...set, sessionGeneration: sql`${users.sessionGeneration} + 1` })
			.where(eq(users.id, userId));
		await tx
			.update(apiTokens)
			.set({ revokedAt: new Date() })
			.where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
	});
}

/** Sets a new password and ends every session and API token issued before it. */
export async function setPassword(db: Db, userId: string, passwordHash: string) {
	await endCredentials(db, userId, { passwordHash });
}

/** Ends every session of the user (signing out: a copied session cookie stops working too). */
export async function endSessions(db: Db, userId: string) {
	await db
		.update(users)
		.set({ sessionGeneration: sql`${users.sessionGeneration} + 1` })
		.where(eq(users.id, userId));
}

/** Ends every session and API token of the user at once. */
export async function endAllSessions(db: Db, userId: string) {
	await endCredentials(db, userId, {});
}
