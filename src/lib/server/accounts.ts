import type { Db } from './db/connect';
import { issueUserToken, retireUserTokens } from './db/queries/tokens';
import { createUser, getUserByEmail, replacePendingSignUp } from './db/queries/users';
import { queueMail } from './mail/outbox';
import { passwordResetMail, verificationMail } from './mail/templates';
import { hashPassword } from './passwords';

const DAY = 24 * 60 * 60_000;

/**
 * Signs up, or (for an address that has an account) says nothing different: a new account
 * gets a verification link; an unconfirmed one takes this sign-up's name and password and a
 * fresh link, every earlier link ending (so whoever typed the address first cannot have their
 * password confirmed by its owner); a confirmed one gets nothing.
 */
export async function signUp(
	db: Db,
	input: { name: string; email: string; password: string },
	origin: string
) {
	// The hash first, whatever the address: a known one must not answer sooner than a new one.
	const passwordHash = await hashPassword(input.password);
	const existing = await getUserByEmail(db, input.email);
	if (existing?.emailVerified) return;
	const user = existing
		? await replacePendingSignUp(db, existing.id, { name: input.name, passwordHash })
		: await createUser(db, { name: input.name, email: input.email, passwordHash });
	if (!user) return;
	await retireUserTokens(db, user.id, 'verify-email');
	const token = await issueUserToken(db, user.id, 'verify-email', DAY);
	await queueMail(db, verificationMail(user.email, `${origin}/verify?token=${token}`));
}

export async function requestPasswordReset(db: Db, email: string, origin: string) {
	const user = await getUserByEmail(db, email);
	if (!user) return;
	const token = await issueUserToken(db, user.id, 'reset-password', 60 * 60_000);
	await queueMail(db, passwordResetMail(user.email, `${origin}/reset/new?token=${token}`));
}
