import { and, asc, eq, isNull, notInArray, sql, type SQL } from 'drizzle-orm';
import { can } from '../../capabilities';
import type { Db } from '../connect';
import {
	drawings,
	frozenStates,
	invitations,
	memberships,
	revisions,
	teams,
	users,
	type Role,
	type TeamRow,
	type TeamSettings
} from '../schema';
import { recordActivity, type Actor } from './activity';
import { recheckRevision } from './rule-findings';
import { noticeMemberChange } from './revision-events';

export async function getTeamBySlug(db: Db, slug: string) {
	const [team] = await db.select().from(teams).where(eq(teams.slug, slug));
	return team ?? null;
}

export async function getMembership(db: Db, teamId: string, userId: string) {
	const [row] = await db
		.select()
		.from(memberships)
		.where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
	return row ?? null;
}

export async function listTeamsOf(db: Db, userId: string) {
	return db
		.select({ id: teams.id, slug: teams.slug, name: teams.name, role: memberships.role })
		.from(memberships)
		.innerJoin(teams, eq(teams.id, memberships.teamId))
		.where(eq(memberships.userId, userId))
		.orderBy(asc(teams.name));
}

export async function listMembers(db: Db, teamId: string) {
	return db
		.select({
			userId: users.id,
			name: users.name,
			email: users.email,
			role: memberships.role,
			since: memberships.createdAt
		})
		.from(memberships)
		.innerJoin(users, eq(users.id, memberships.userId))
		.where(eq(memberships.teamId, teamId))
		.orderBy(asc(users.name), asc(users.email));
}

export class SlugTaken extends Error {}
export class LastAdmin extends Error {
	constructor() {
		super('A team needs at least one admin: make someone else admin first.');
	}
}

/** Creates a team with its creator as admin. */
export async function createTeam(db: Db, actor: Actor, input: { slug: string; name: string }) {
	return db.transaction(async (tx) => {
		const [team] = await tx
			.insert(teams)
			.values({ slug: input.slug, name: input.name })
			.onConflictDoNothing({ target: teams.slug })
			.returning();
		if (!team) throw new SlugTaken(`The address ${input.slug} is taken`);
		await tx.insert(memberships).values({ teamId: team.id, userId: actor.id, role: 'admin' });
		await recordActivity(tx, {
			teamId: team.id,
			actor,
			entity: 'team',
			entityId: team.id,
			action: 'create',
			summary: `created the team ${team.name}`,
			after: { slug: team.slug, name: team.name }
		});
		return team;
	});
}

/** Adds a user, or changes their role if already a member. */
export async function addMember(
	db: Db,
	actor: Actor | null,
	teamId: string,
	user: Actor,
	role: Role
) {
	return db.transaction(async (tx) => {
		const existing = await getMembership(tx, teamId, user.id);
		if (existing) return { membership: existing, created: false };
		const [membership] = await tx
			.insert(memberships)
			.values({ teamId, userId: user.id, role })
			.returning();
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'membership',
			entityId: user.id,
			action: 'add',
			summary: actor?.id === user.id ? `joined as ${role}` : `added ${user.email} as ${role}`,
			after: { userId: user.id, email: user.email, role }
		});
		return { membership, created: true };
	});
}

async function adminCount(db: Db, teamId: string) {
	const [row] = await db
		.select({ count: sql<number>`count(*)::int` })
		.from(memberships)
		.where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'admin')));
	return row.count;
}

/**
 * Withdraws the team's invitations that `which` picks and are neither accepted nor withdrawn,
 * each recorded in the trail (`why` follows its summary); answers how many.
 */
export async function withdrawInvitations(
	db: Db,
	actor: Actor,
	teamId: string,
	which: SQL,
	why = ''
) {
	const revoked = await db
		.update(invitations)
		.set({ revokedAt: new Date() })
		.where(
			and(
				eq(invitations.teamId, teamId),
				which,
				isNull(invitations.acceptedAt),
				isNull(invitations.revokedAt)
			)
		)
		.returning({ id: invitations.id, email: invitations.email, role: invitations.role });
	for (const row of revoked) {
		await recordActivity(db, {
			teamId,
			actor,
			entity: 'invitation',
			entityId: row.id,
			action: 'revoke',
			summary: `withdrew the invitation to ${row.email}${why}`,
			before: { email: row.email, role: row.role }
		});
	}
	return revoked.length;
}

/**
 * Someone who no longer manages the team (removed, or a role without `manageTeam`) no longer
 * brings anyone in: the invitations they sent that are still open are withdrawn.
 */
const revokeInvitationsBy = (db: Db, actor: Actor, teamId: string, inviterId: string) =>
	withdrawInvitations(
		db,
		actor,
		teamId,
		eq(invitations.invitedBy, inviterId),
		': its sender no longer manages the team'
	);

export async function changeRole(db: Db, actor: Actor, teamId: string, userId: string, role: Role) {
	return db.transaction(async (tx) => {
		// Lock the team row so two demotions cannot both pass the last-admin check.
		await tx.select().from(teams).where(eq(teams.id, teamId)).for('update');
		const current = await getMembership(tx, teamId, userId);
		if (!current) return null;
		if (current.role === role) return current;
		if (current.role === 'admin' && (await adminCount(tx, teamId)) <= 1) throw new LastAdmin();
		const [updated] = await tx
			.update(memberships)
			.set({ role })
			.where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
			.returning();
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'membership',
			entityId: userId,
			action: 'change-role',
			summary: `changed a member's role from ${current.role} to ${role}`,
			before: { role: current.role },
			after: { role }
		});
		if (!can(role, 'manageTeam')) await revokeInvitationsBy(tx, actor, teamId, userId);
		await noticeMemberChange(tx, teamId, userId);
		return updated;
	});
}

export async function removeMember(db: Db, actor: Actor, teamId: string, userId: string) {
	return db.transaction(async (tx) => {
		await tx.select().from(teams).where(eq(teams.id, teamId)).for('update');
		const current = await getMembership(tx, teamId, userId);
		if (!current) return false;
		if (current.role === 'admin' && (await adminCount(tx, teamId)) <= 1) throw new LastAdmin();
		await tx
			.delete(memberships)
			.where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'membership',
			entityId: userId,
			action: 'remove',
			summary: `removed a ${current.role} from the team`,
			before: { userId, role: current.role }
		});
		await revokeInvitationsBy(tx, actor, teamId, userId);
		await noticeMemberChange(tx, teamId, userId);
		return true;
	});
}

/** What a team's settings change may carry: its name, self-approval and the rulebook's settings. */
export type TeamSettingsChanges = { name?: string; allowSelfApproval?: boolean } & Partial<
	Pick<TeamSettings, 'severityOverrides' | 'capabilityGrade'>
>;

const teamRecord = (row: TeamRow) => ({
	name: row.name,
	allowSelfApproval: row.allowSelfApproval,
	severityOverrides: row.settings.severityOverrides ?? {},
	capabilityGrade: row.settings.capabilityGrade ?? null
});

/**
 * Changes the team's settings (against `version` when given: null when stale). A change to the
 * rulebook's settings re-checks every revision of the team that is not frozen, in the same
 * transaction, so severities and LIM-06 follow at once.
 */
export async function updateTeamSettings(
	db: Db,
	actor: Actor,
	teamId: string,
	input: TeamSettingsChanges,
	version?: number
) {
	return db.transaction(async (tx) => {
		const [before] = await tx.select().from(teams).where(eq(teams.id, teamId)).for('update');
		if (version !== undefined && before.version !== version) return null;
		const { severityOverrides, capabilityGrade, ...plain } = input;
		const rulebook = severityOverrides !== undefined || capabilityGrade !== undefined;
		const settings = {
			...before.settings,
			...(severityOverrides !== undefined ? { severityOverrides } : {}),
			...(capabilityGrade !== undefined ? { capabilityGrade } : {})
		};
		const [after] = await tx
			.update(teams)
			.set({ ...plain, settings, version: sql`${teams.version} + 1` })
			.where(eq(teams.id, teamId))
			.returning();
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'team',
			entityId: teamId,
			action: 'update',
			summary: rulebook ? "changed the team's rulebook settings" : 'changed the team settings',
			before: teamRecord(before),
			after: teamRecord(after)
		});
		if (rulebook) {
			const open = await tx
				.select({ id: revisions.id })
				.from(revisions)
				.innerJoin(drawings, eq(drawings.id, revisions.drawingId))
				.where(and(eq(drawings.teamId, teamId), notInArray(revisions.state, [...frozenStates])));
			for (const r of open) await recheckRevision(tx, actor, r.id, 'full', false);
		}
		return after;
	});
}
