import { roleLabels } from './capabilities';
import type { Db } from './db/connect';
import type { Role, TeamRow } from './db/schema';
import { createInvitation } from './db/queries/invitations';
import { addMember } from './db/queries/teams';
import { getUserByEmail } from './db/queries/users';
import { queueMail } from './mail/outbox';
import { invitationMail } from './mail/templates';
import { nudgeOutbox } from './mail/worker';
import type { Actor } from './db/queries/activity';

/**
 * Adds a person to a team: someone who already has an account joins at once; anyone else
 * gets an invitation by e-mail, which signs them up when they accept it.
 */
export async function addOrInvite(
	db: Db,
	actor: Actor,
	team: TeamRow,
	input: { email: string; role: Role },
	origin: string
) {
	const existing = await getUserByEmail(db, input.email);
	if (existing?.emailVerified) {
		const { membership, created } = await addMember(db, actor, team.id, existing, input.role);
		return {
			kind: 'member' as const,
			created,
			member: { userId: existing.id, role: membership.role }
		};
	}
	return { kind: 'invitation' as const, invitation: await invite(db, actor, team, input, origin) };
}

export async function invite(
	db: Db,
	actor: Actor,
	team: TeamRow,
	input: { email: string; role: Role },
	origin: string
) {
	const { invitation, token } = await createInvitation(db, actor, team.id, input);
	await queueMail(
		db,
		invitationMail(
			invitation.email,
			`${origin}/invitations/${token}`,
			team.name,
			actor.name ?? actor.email,
			roleLabels[input.role]
		)
	);
	nudgeOutbox();
	return {
		id: invitation.id,
		email: invitation.email,
		role: invitation.role,
		expiresAt: invitation.expiresAt
	};
}
