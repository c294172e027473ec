import type { Db } from './db/connect';
import { issueUserToken } from './db/queries/tokens';
import { createUser, getUserByEmail } from './db/queries/users';
import { queueMail } from './mail/outbox';
import { passwordResetMail, verificationMail } from './mail/templates';
import { hashPassword } from './passwords';

const DAY = 24 * 60 * 60_000;

/**
 * Signs up, or (for an address that has an account) says nothing different: a new account
 * gets a verification link; an unconfirmed one gets a fresh link; a confirmed one gets nothing.
 */
export async function signUp(
	db: Db,
	input: { name: string; email: string; password: string },
	origin: string
) {
	const existing = await getUserByEmail(db, input.email);
	if (existing?.emailVerified) return;
	const user =
		existing ??
		(await createUser(db, {
			name: input.name,
			email: input.email,
			passwordHash: await hashPassword(input.password)
		}));
	if (!user) return;
	const token = await issueUserToken(db, user.id, 'verify-email', DAY);
	await queueMail(db, verificationMail(user.email, `${origin}/verify?token=${token}`));
}

export async function requestPasswordReset(db: Db, email: string, origin: string) {
	const user = await getUserByEmail(db, email);
	if (!user) return;
	const token = await issueUserToken(db, user.id, 'reset-password', 60 * 60_000);
	await queueMail(db, passwordResetMail(user.email, `${origin}/reset/new?token=${token}`));
}
