import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { activity } from '../../src/lib/server/db/schema';
import { recordActivity } from '../../src/lib/server/db/queries/activity';
import {
	acceptInvitation,
	createInvitation,
	invitationLifetimeMs
} from '../../src/lib/server/db/queries/invitations';
import { createTeam } from '../../src/lib/server/db/queries/teams';
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
