import { eq, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import { users } from '../schema';

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

export async function markEmailVerified(db: Db, userId: string) {
	await db
		.update(users)
		.set({ emailVerified: sql`coalesce(${users.emailVerified}, now())` })
		.where(eq(users.id, userId));
}

/** Sets a new password and ends every session signed in before it. */
export async function setPassword(db: Db, userId: string, passwordHash: string) {
	await db
		.update(users)
		.set({ passwordHash, sessionGeneration: sql`${users.sessionGeneration} + 1` })
		.where(eq(users.id, userId));
}

/** Ends every session of the user at once: tokens carry the generation they were issued in. */
export async function endAllSessions(db: Db, userId: string) {
	await db
		.update(users)
		.set({ sessionGeneration: sql`${users.sessionGeneration} + 1` })
		.where(eq(users.id, userId));
}
