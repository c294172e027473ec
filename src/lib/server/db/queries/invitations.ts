import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '../connect';
import { invitations, teams, type Role } from '../schema';
import { hashSecretToken, newSecretToken } from '../../secret-tokens';
import { recordActivity, type Actor } from './activity';
import { addMember } from './teams';
import { normaliseEmail } from './users';

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

export async function listOpenInvitations(db: Db, teamId: string, now = new Date()) {
	return db
		.select({
			id: invitations.id,
			email: invitations.email,
			role: invitations.role,
			expiresAt: invitations.expiresAt,
			createdAt: invitations.createdAt
		})
		.from(invitations)
		.where(
			and(
				eq(invitations.teamId, teamId),
				isNull(invitations.acceptedAt),
				isNull(invitations.revokedAt),
				gt(invitations.expiresAt, now)
			)
		)
		.orderBy(desc(invitations.createdAt));
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

/** Accepts once: the conditional update makes a second use (or a race) fail. */
export async function acceptInvitation(db: Db, token: string, user: Actor, now = new Date()) {
	const found = await findInvitation(db, token, now);
	if (!found.ok) return found;
	return db.transaction(async (tx) => {
		const [used] = await tx
			.update(invitations)
			.set({ acceptedAt: now, acceptedBy: user.id })
			.where(and(eq(invitations.id, found.invitation.id), isNull(invitations.acceptedAt)))
			.returning();
		if (!used) return { ok: false as const, reason: 'used' as const };
		await addMember(tx, user, used.teamId, user, used.role);
		return { ok: true as const, teamSlug: found.teamSlug, role: used.role };
	});
}

export async function revokeInvitation(db: Db, actor: Actor, teamId: string, id: string) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.update(invitations)
			.set({ revokedAt: new Date() })
			.where(
				and(
					eq(invitations.id, id),
					eq(invitations.teamId, teamId),
					isNull(invitations.acceptedAt),
					isNull(invitations.revokedAt)
				)
			)
			.returning();
		if (!row) return false;
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'invitation',
			entityId: id,
			action: 'revoke',
			summary: `withdrew the invitation to ${row.email}`,
			before: { email: row.email, role: row.role }
		});
		return true;
	});
}
