import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { activity } from '../../src/lib/server/db/schema';
import { recordActivity } from '../../src/lib/server/db/queries/activity';
import {
	acceptInvitation,
	approveInvitation,
	createInvitation,
	invitationLifetimeMs,
	listOpenInvitations,
	revokeInvitation
} from '../../src/lib/server/db/queries/invitations';
import {
	addMember,
	changeRole,
	createTeam,
	getMembership,
	removeMember
} from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { can, capabilityTable } from '../../src/lib/server/capabilities';
import { freshDatabase } from './harness';

let database: Database;
let admin: { id: string; name: string | null; email: string };
let teamId: string;

beforeAll(async () => {
	database = await freshDatabase();
	admin = (await createUser(database.db, {
		name: 'Admin',
		email: 'a@example.test',
		passwordHash: null
	}))!;
	teamId = (await createTeam(database.db, admin, { slug: 'acme', name: 'Acme' })).id;
});
afterAll(() => database?.close());

describe('the activity trail', () => {
	it('refuses UPDATE and DELETE (append-only trigger)', async () => {
		await recordActivity(database.db, {
			teamId,
			actor: admin,
			entity: 'team',
			entityId: teamId,
			action: 'test',
			summary: 'a test entry'
		});
		await expect(database.db.update(activity).set({ summary: 'rewritten' })).rejects.toThrow();
		await expect(database.db.delete(activity)).rejects.toThrow();
		await expect(database.db.execute(sql`truncate activity`)).rejects.toThrow();
		const rows = await database.db.select().from(activity);
		expect(rows.some((r) => r.summary === 'a test entry')).toBe(true);
		expect(rows.every((r) => r.summary !== 'rewritten')).toBe(true);
	});
});

describe('invitations', () => {
	it('are refused once expired', async () => {
		const { token } = await createInvitation(database.db, admin, teamId, {
			email: 'late@example.test',
			role: 'checker'
		});
		const joiner = (await createUser(database.db, {
			name: 'Late',
			email: 'late@example.test',
			passwordHash: null
		}))!;
		const later = new Date(Date.now() + invitationLifetimeMs + 60_000);
		expect(await acceptInvitation(database.db, token, joiner, later)).toEqual({
			ok: false,
			reason: 'expired'
		});
	});

	it('are refused once withdrawn or used, by the accepting statement itself', async () => {
		const email = 'twice@example.test';
		const joiner = (await createUser(database.db, { name: 'T', email, passwordHash: null }))!;
		const withdrawn = await createInvitation(database.db, admin, teamId, {
			email,
			role: 'quality'
		});
		expect(await revokeInvitation(database.db, admin, teamId, withdrawn.invitation.id)).toBe(true);
		expect(await acceptInvitation(database.db, withdrawn.token, joiner)).toEqual({
			ok: false,
			reason: 'invalid'
		});
		const { token } = await createInvitation(database.db, admin, teamId, {
			email,
			role: 'quality'
		});
		const both = await Promise.all([
			acceptInvitation(database.db, token, joiner),
			acceptInvitation(database.db, token, joiner)
		]);
		expect(both.filter((r) => r.ok)).toHaveLength(1);
		expect(both.find((r) => !r.ok)).toEqual({ ok: false, reason: 'used' });
	});

	it('sent to another address wait for an admin before that account joins', async () => {
		const { invitation, token } = await createInvitation(database.db, admin, teamId, {
			email: 'invited@example.test',
			role: 'drafter'
		});
		const other = (await createUser(database.db, {
			name: 'Other',
			email: 'someone-else@example.test',
			passwordHash: null
		}))!;
		expect(await acceptInvitation(database.db, token, other)).toEqual({
			ok: false,
			reason: 'approval'
		});
		expect(await getMembership(database.db, teamId, other.id)).toBeNull();
		const open = await listOpenInvitations(database.db, teamId);
		expect(open.find((i) => i.id === invitation.id)?.waitingFor).toEqual({
			userId: other.id,
			email: 'someone-else@example.test'
		});
		// A third account cannot take the request over.
		const third = (await createUser(database.db, {
			name: 'Third',
			email: 'third@example.test',
			passwordHash: null
		}))!;
		expect(await acceptInvitation(database.db, token, third)).toMatchObject({ ok: false });
		expect(await approveInvitation(database.db, admin, teamId, invitation.id)).toBe(true);
		expect((await getMembership(database.db, teamId, other.id))?.role).toBe('drafter');
		expect(await getMembership(database.db, teamId, third.id)).toBeNull();
		expect(await approveInvitation(database.db, admin, teamId, invitation.id)).toBe(false);
	});

	it('are withdrawn when their sender is removed or loses the right to manage the team', async () => {
		const sender = async (email: string) => {
			const user = (await createUser(database.db, { name: email, email, passwordHash: null }))!;
			await addMember(database.db, admin, teamId, user, 'admin');
			const { token } = await createInvitation(database.db, user, teamId, {
				email: `from-${email}`,
				role: 'checker'
			});
			return { user, token };
		};
		const removed = await sender('removed-admin@example.test');
		const demoted = await sender('demoted-admin@example.test');
		const kept = await sender('kept-admin@example.test');
		await removeMember(database.db, admin, teamId, removed.user.id);
		await changeRole(database.db, admin, teamId, demoted.user.id, 'checker');
		await changeRole(database.db, admin, teamId, kept.user.id, 'admin');
		const open = (await listOpenInvitations(database.db, teamId)).map((i) => i.email);
		expect(open).not.toContain('from-removed-admin@example.test');
		expect(open).not.toContain('from-demoted-admin@example.test');
		expect(open).toContain('from-kept-admin@example.test');
		const invitee = (await createUser(database.db, {
			name: 'Invitee',
			email: 'from-removed-admin@example.test',
			passwordHash: null
		}))!;
		expect(await acceptInvitation(database.db, removed.token, invitee)).toEqual({
			ok: false,
			reason: 'invalid'
		});
	});
});

describe('the capability table (PRODUCT.md §2)', () => {
	it('gives supplier quality only viewing, released exports and comments on released work', () => {
		const allowed = Object.keys(capabilityTable).filter((c) =>
			can('quality', c as keyof typeof capabilityTable)
		);
		expect(allowed.sort()).toEqual(['commentReleased', 'exportReleased', 'view']);
	});
	it('lets only admins manage the team, and keeps drafters from judging findings', () => {
		expect(can('admin', 'manageTeam')).toBe(true);
		expect(can('checker', 'manageTeam')).toBe(false);
		expect(can('drafter', 'judgeFindings')).toBe(false);
		expect(can('drafter', 'author')).toBe(true);
		expect(can('checker', 'author')).toBe(false);
		expect(can('checker', 'decideRevisions')).toBe(true);
	});
});
