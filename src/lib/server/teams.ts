import { roleLabels } from './capabilities';
import type { Db } from './db/connect';
import type { Role, TeamRow } from './db/schema';
import { spendAttempt } from './db/queries/attempts';
import { createInvitation } from './db/queries/invitations';
import { queueMail } from './mail/outbox';
import { invitationMail } from './mail/templates';
import { nudgeOutbox } from './mail/worker';
import type { Actor } from './db/queries/activity';
import { tryAgainIn } from './forms';

export type InviteOutcome =
	| {
			ok: true;
			invitation: { id: string; email: string; role: Role; expiresAt: Date };
	  }
	| { ok: false; status: 429; code: 'rate_limited'; message: string; retryAfter: number };

/**
 * Invites someone by e-mail: always an invitation they accept, also when the address has an
 * account (adding it at once would tell the inviter which addresses have accounts, and put
 * people in teams they never agreed to join). Each one counts against the inviter's limit.
 */
export async function invite(
	db: Db,
	actor: Actor,
	team: TeamRow,
	input: { email: string; role: Role },
	origin: string
): Promise<InviteOutcome> {
	const wait = await spendAttempt(db, 'invite', [`user:${actor.id}`]);
	if (wait > 0) {
		const message = `Too many invitations sent. ${tryAgainIn(wait)}`;
		return { ok: false, status: 429, code: 'rate_limited', message, retryAfter: wait };
	}
	// The invitation and its mail together: no invitation nobody was told of, no mail for none.
	const invitation = await db.transaction(async (tx) => {
		const { invitation, token } = await createInvitation(tx, actor, team.id, input);
		await queueMail(
			tx,
			invitationMail(
				invitation.email,
				`${origin}/invitations/${token}`,
				team.name,
				actor.name ?? actor.email,
				roleLabels[input.role]
			)
		);
		return invitation;
	});
	nudgeOutbox();
	return {
		ok: true,
		invitation: {
			id: invitation.id,
			email: invitation.email,
			role: invitation.role,
			expiresAt: invitation.expiresAt
		}
	};
}

/** The team's settings as the API answers them (GET and PATCH /teams/{team}). */
export function teamSettingsOf(team: TeamRow) {
	return {
		slug: team.slug,
		name: team.name,
		allowSelfApproval: team.allowSelfApproval,
		severityOverrides: team.settings.severityOverrides ?? {},
		capabilityGrade: team.settings.capabilityGrade ?? null,
		version: team.version
	};
}
