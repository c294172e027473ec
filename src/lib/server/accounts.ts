import type { Db } from './db/connect';
import type { Role } from './db/schema';
import { acceptInvitation, findInvitation, type AcceptOutcome } from './db/queries/invitations';
import { consumeUserToken, issueUserToken, retireUserTokens } from './db/queries/tokens';
import {
	createUser,
	getUserByEmail,
	getUserById,
	proveEmail,
	replacePendingSignUp
} from './db/queries/users';
import { queueMail } from './mail/outbox';
import { passwordResetMail, verificationMail } from './mail/templates';
import { hashPassword } from './passwords';

const DAY = 24 * 60 * 60_000;

/**
 * Signs up, or (for an address that has an account) says nothing different: a new account
 * gets a verification link; an unconfirmed one takes this sign-up's name and password and a
 * fresh link, every earlier link ending (so whoever typed the address first cannot have their
 * password confirmed by its owner); a confirmed one gets nothing. The account, its link and
 * the mail are written together or not at all.
 */
export async function signUp(
	db: Db,
	input: { name: string; email: string; password: string },
	origin: string
) {
	// The hash first, whatever the address: a known one must not answer sooner than a new one.
	const passwordHash = await hashPassword(input.password);
	await db.transaction(async (tx) => {
		const existing = await getUserByEmail(tx, input.email);
		if (existing?.emailVerified) return;
		const user = existing
			? await replacePendingSignUp(tx, existing.id, { name: input.name, passwordHash })
			: await createUser(tx, { name: input.name, email: input.email, passwordHash });
		if (!user) return;
		await retireUserTokens(tx, user.id, 'verify-email');
		const token = await issueUserToken(tx, user.id, 'verify-email', DAY);
		await queueMail(tx, verificationMail(user.email, `${origin}/verify?token=${token}`));
	});
}

/** The reset link and its mail, together or not at all. */
export async function requestPasswordReset(db: Db, email: string, origin: string) {
	await db.transaction(async (tx) => {
		const user = await getUserByEmail(tx, email);
		if (!user) return;
		const token = await issueUserToken(tx, user.id, 'reset-password', 60 * 60_000);
		await queueMail(tx, passwordResetMail(user.email, `${origin}/reset/new?token=${token}`));
	});
}

/**
 * The reset link proves the address: in one transaction the link is used, the new password
 * replaces any other, the address counts as confirmed, and every session and API token from
 * before ends. A failure part-way leaves the link unused and the old password in place.
 */
export async function resetPassword(db: Db, token: string, passwordHash: string) {
	return db.transaction(async (tx) => {
		const used = await consumeUserToken(tx, token, 'reset-password');
		if (used.ok) await proveEmail(tx, used.userId, { passwordHash });
		return used;
	});
}

/** The confirmation button: the link is used and the address proven together. */
export async function confirmAddress(db: Db, token: string) {
	return db.transaction(async (tx) => {
		const used = await consumeUserToken(tx, token, 'verify-email');
		// The newest sign-up's password stays (older links ended); sessions and tokens end.
		if (used.ok) await proveEmail(tx, used.userId);
		return used;
	});
}

class Undo extends Error {
	constructor(readonly outcome: AcceptOutcome) {
		super('undone');
	}
}

export type JoinOutcome =
	| { ok: true; teamSlug: string; role: Role; email: string }
	| { ok: false; reason: 'invalid' | 'expired' | 'used' | 'approval' | 'has_account' };

/**
 * Someone new signs up from an invitation link (holding it proves the address, so no second
 * mail) and joins: the account and the acceptance are one transaction, so a failure leaves
 * neither an account nor a used invitation. An unproven sign-up on this address may be
 * anyone's: its name and password are replaced and whatever it held ends.
 */
export async function joinByInvitation(
	db: Db,
	token: string,
	input: { name: string; passwordHash: string },
	now = new Date()
): Promise<JoinOutcome> {
	try {
		return await db.transaction(async (tx) => {
			const found = await findInvitation(tx, token, now);
			if (!found.ok) return found;
			const email = found.invitation.email;
			const pending = await getUserByEmail(tx, email);
			if (pending?.emailVerified) return { ok: false, reason: 'has_account' };
			if (pending) await proveEmail(tx, pending.id, input);
			const user = pending
				? await getUserById(tx, pending.id)
				: await createUser(tx, { ...input, email, emailVerified: now });
			if (!user) return { ok: false, reason: 'has_account' };
			const accepted = await acceptInvitation(tx, token, user, now);
			if (!accepted.ok) throw new Undo(accepted);
			return { ...accepted, email: user.email };
		});
	} catch (err) {
		if (err instanceof Undo) return err.outcome as JoinOutcome;
		throw err;
	}
}
