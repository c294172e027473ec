import { and, desc, eq, gt, isNotNull, isNull, or } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../connect';
import { invitations, teams, users, type Role } from '../schema';
import { hashSecretToken, newSecretToken } from '../../secret-tokens';
import { recordActivity, type Actor } from './activity';
import { addMember, withdrawInvitations } from './teams';
import { getUserById, normaliseEmail } from './users';

export const invitationLifetimeMs = 7 * 24 * 60 * 60_000;

export async function createInvitation(
	db: Db,
	actor: Actor,
	teamId: string,
	input: { email: string; role: Role }
) {
	const { token, hash } = newSecretToken();
	const email = normaliseEmail(input.email);
	const invitation = await db.transaction(async (tx) => {
		const [row] = await tx
			.insert(invitations)
			.values({
				teamId,
				email,
				role: input.role,
				tokenHash: hash,
				invitedBy: actor.id,
				expiresAt: new Date(Date.now() + invitationLifetimeMs)
			})
			.returning();
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'invitation',
			entityId: row.id,
			action: 'create',
			summary: `invited ${email} as ${input.role}`,
			after: { email, role: input.role, expiresAt: row.expiresAt }
		});
		return row;
	});
	return { invitation, token };
}

/** Neither accepted, nor withdrawn, nor expired at `now`. */
const openAt = (now: Date) =>
	and(
		isNull(invitations.acceptedAt),
		isNull(invitations.revokedAt),
		gt(invitations.expiresAt, now)
	);

const requester = alias(users, 'requester');

/** Open invitations; `waitingFor` is the account (of another address) waiting for approval. */
export async function listOpenInvitations(db: Db, teamId: string, now = new Date()) {
	const rows = await db
		.select({
			id: invitations.id,
			email: invitations.email,
			role: invitations.role,
			expiresAt: invitations.expiresAt,
			createdAt: invitations.createdAt,
			requesterId: requester.id,
			requesterEmail: requester.email
		})
		.from(invitations)
		.leftJoin(requester, eq(requester.id, invitations.requestedBy))
		.where(and(eq(invitations.teamId, teamId), openAt(now)))
		.orderBy(desc(invitations.createdAt));
	return rows.map(({ requesterId, requesterEmail, ...row }) => ({
		...row,
		waitingFor: requesterId ? { userId: requesterId, email: requesterEmail! } : null
	}));
}

export type InvitationLookup =
	| { ok: true; invitation: typeof invitations.$inferSelect; teamName: string; teamSlug: string }
	| { ok: false; reason: 'invalid' | 'expired' | 'used' };

export async function findInvitation(
	db: Db,
	token: string,
	now = new Date()
): Promise<InvitationLookup> {
	const [row] = await db
		.select({ invitation: invitations, teamName: teams.name, teamSlug: teams.slug })
		.from(invitations)
		.innerJoin(teams, eq(teams.id, invitations.teamId))
		.where(eq(invitations.tokenHash, hashSecretToken(token)));
	if (!row || row.invitation.revokedAt) return { ok: false, reason: 'invalid' };
	if (row.invitation.acceptedAt) return { ok: false, reason: 'used' };
	if (row.invitation.expiresAt <= now) return { ok: false, reason: 'expired' };
	return { ok: true, ...row };
}

export type AcceptOutcome =
	| { ok: true; teamSlug: string; role: Role }
	| { ok: false; reason: 'invalid' | 'expired' | 'used' | 'approval' };

/**
 * Accepts once, for the invited address only: one UPDATE checks the token, the address, expiry,
 * withdrawal and earlier use together, so a second use, a race or a withdrawal in between fails.
 * Someone signed in with another address does not join: the invitation waits for an admin's
 * approval (`approveInvitation`), asked for by the first such account.
 */
export async function acceptInvitation(
	db: Db,
	token: string,
	user: Actor,
	now = new Date()
): Promise<AcceptOutcome> {
	return db.transaction(async (tx) => {
		const [used] = await tx
			.update(invitations)
			.set({ acceptedAt: now, acceptedBy: user.id })
			.where(
				and(
					eq(invitations.tokenHash, hashSecretToken(token)),
					eq(invitations.email, normaliseEmail(user.email)),
					openAt(now)
				)
			)
			.returning();
		if (used) {
			await addMember(tx, user, used.teamId, user, used.role);
			const [team] = await tx.select().from(teams).where(eq(teams.id, used.teamId));
			return { ok: true, teamSlug: team.slug, role: used.role };
		}
		const [waiting] = await tx
			.update(invitations)
			.set({ requestedBy: user.id, requestedAt: now })
			.where(
				and(
					eq(invitations.tokenHash, hashSecretToken(token)),
					openAt(now),
					or(isNull(invitations.requestedBy), eq(invitations.requestedBy, user.id))
				)
			)
			.returning();
		if (waiting) {
			await recordActivity(tx, {
				teamId: waiting.teamId,
				actor: user,
				entity: 'invitation',
				entityId: waiting.id,
				action: 'request',
				summary: `asked to accept the invitation to ${waiting.email} as ${user.email}`,
				after: { requestedBy: user.id, email: user.email }
			});
			return { ok: false, reason: 'approval' };
		}
		const found = await findInvitation(tx, token, now);
		return { ok: false, reason: found.ok ? 'invalid' : found.reason };
	});
}

/**
 * An admin lets the account that asked (`requestedBy`) accept an invitation sent to another
 * address: the same single UPDATE re-checks that it is still open.
 */
export async function approveInvitation(
	db: Db,
	actor: Actor,
	teamId: string,
	id: string,
	now = new Date()
) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.select({ requestedBy: invitations.requestedBy })
			.from(invitations)
			.where(and(eq(invitations.id, id), eq(invitations.teamId, teamId)));
		const user = row?.requestedBy ? await getUserById(tx, row.requestedBy) : null;
		if (!user) return false;
		const [used] = await tx
			.update(invitations)
			.set({ acceptedAt: now, acceptedBy: user.id })
			.where(
				and(
					eq(invitations.id, id),
					eq(invitations.teamId, teamId),
					eq(invitations.requestedBy, user.id),
					isNotNull(invitations.requestedBy),
					openAt(now)
				)
			)
			.returning();
		if (!used) return false;
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'invitation',
			entityId: id,
			action: 'approve',
			summary: `let ${user.email} accept the invitation to ${used.email}`,
			after: { userId: user.id, email: user.email, role: used.role }
		});
		await addMember(tx, actor, teamId, user, used.role);
		return true;
	});
}

export async function revokeInvitation(db: Db, actor: Actor, teamId: string, id: string) {
	return db.transaction(
		async (tx) => (await withdrawInvitations(tx, actor, teamId, eq(invitations.id, id))) === 1
	);
}
