import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import {
	invitations,
	memberships,
	outbox,
	userTokens,
	users,
	type TeamRow
} from '../../src/lib/server/db/schema';
import {
	joinByInvitation,
	requestPasswordReset,
	resetPassword,
	signUp
} from '../../src/lib/server/accounts';
import { createInvitation } from '../../src/lib/server/db/queries/invitations';
import { issueUserToken } from '../../src/lib/server/db/queries/tokens';
import { createTeam } from '../../src/lib/server/db/queries/teams';
import { createUser, getUserByEmail } from '../../src/lib/server/db/queries/users';
import { hashPassword, verifyPassword } from '../../src/lib/server/passwords';
import { invite } from '../../src/lib/server/teams';
import { breakWrites, freshDatabase } from './harness';

let database: Database;
let admin: { id: string; name: string | null; email: string };
let team: TeamRow;
const origin = 'http://localhost:3000';

beforeAll(async () => {
	database = await freshDatabase();
	admin = (await createUser(database.db, {
		name: 'Admin',
		email: 'tx-admin@example.test',
		passwordHash: null,
		emailVerified: new Date()
	}))!;
	team = await createTeam(database.db, admin, { slug: 'tx', name: 'Transactions' });
});
afterAll(() => database?.close());

const mailTo = (to: string) => database.db.select().from(outbox).where(eq(outbox.recipient, to));

/** Runs `work` with `table`'s writes failing, and expects the fault to surface. */
async function withFault(table: string, op: 'INSERT' | 'UPDATE', work: () => Promise<unknown>) {
	const undo = await breakWrites(database.db, table, op);
	try {
		await expect(work()).rejects.toThrow();
	} finally {
		await undo();
	}
}

describe('a fault part-way through a multi-table write leaves nothing half-done', () => {
	it('sign-up: no account and no link when its mail cannot be queued', async () => {
		const email = 'tx-signup@example.test';
		await withFault('outbox', 'INSERT', () =>
			signUp(database.db, { name: 'Half', email, password: 'long enough phrase' }, origin)
		);
		expect(await getUserByEmail(database.db, email)).toBeNull();
		expect(await mailTo(email)).toEqual([]);
		// Once the fault is gone the same sign-up works, and the mail is queued with it.
		await signUp(database.db, { name: 'Whole', email, password: 'long enough phrase' }, origin);
		const user = (await getUserByEmail(database.db, email))!;
		expect(user.name).toBe('Whole');
		expect(await mailTo(email)).toHaveLength(1);
	});

	it('a new verification link for a pending sign-up: the old password and link stay', async () => {
		const email = 'tx-pending@example.test';
		await signUp(database.db, { name: 'First', email, password: 'first long phrase' }, origin);
		const before = (await getUserByEmail(database.db, email))!;
		await withFault('outbox', 'INSERT', () =>
			signUp(database.db, { name: 'Second', email, password: 'second long phrase' }, origin)
		);
		const after = (await getUserByEmail(database.db, email))!;
		expect(after.name).toBe('First');
		expect(await verifyPassword('first long phrase', after.passwordHash)).toBe(true);
		const links = await database.db
			.select()
			.from(userTokens)
			.where(eq(userTokens.userId, before.id));
		expect(links.filter((l) => !l.usedAt)).toHaveLength(1);
	});

	it('reset mail: no reset link without its mail', async () => {
		await withFault('outbox', 'INSERT', () =>
			requestPasswordReset(database.db, admin.email, origin)
		);
		const links = await database.db
			.select()
			.from(userTokens)
			.where(and(eq(userTokens.userId, admin.id), eq(userTokens.purpose, 'reset-password')));
		expect(links).toEqual([]);
	});

	it('invitation: none without its mail (and nothing in the trail)', async () => {
		const email = 'tx-invitee@example.test';
		await withFault('outbox', 'INSERT', () =>
			invite(database.db, admin, team, { email, role: 'checker' }, origin)
		);
		expect(
			await database.db.select().from(invitations).where(eq(invitations.email, email))
		).toEqual([]);
	});

	it('the reset: the link stays unused and the password unchanged when the account cannot be written', async () => {
		const user = (await createUser(database.db, {
			name: 'Resetter',
			email: 'tx-reset@example.test',
			passwordHash: await hashPassword('the old long phrase')
		}))!;
		const token = await issueUserToken(database.db, user.id, 'reset-password', 60_000);
		const newHash = await hashPassword('the new long phrase');
		await withFault('users', 'UPDATE', () => resetPassword(database.db, token, newHash));
		const unchanged = (await getUserByEmail(database.db, user.email))!;
		expect(await verifyPassword('the old long phrase', unchanged.passwordHash)).toBe(true);
		expect(unchanged.emailVerified).toBeNull();
		// The link was not used up: it still works once.
		expect(await resetPassword(database.db, token, newHash)).toMatchObject({ ok: true });
		const changed = (await getUserByEmail(database.db, user.email))!;
		expect(await verifyPassword('the new long phrase', changed.passwordHash)).toBe(true);
		expect(changed.emailVerified).not.toBeNull();
	});

	it('join by invitation: no account and an unused invitation when joining fails', async () => {
		const email = 'tx-joiner@example.test';
		const { token } = await createInvitation(database.db, admin, team.id, {
			email,
			role: 'drafter'
		});
		const input = { name: 'Joiner', passwordHash: await hashPassword('joiner long phrase') };
		await withFault('memberships', 'INSERT', () => joinByInvitation(database.db, token, input));
		expect(await getUserByEmail(database.db, email)).toBeNull();
		const [row] = await database.db.select().from(invitations).where(eq(invitations.email, email));
		expect(row.acceptedAt).toBeNull();
		const joined = await joinByInvitation(database.db, token, input);
		expect(joined).toMatchObject({ ok: true, teamSlug: 'tx', role: 'drafter', email });
		const member = await database.db
			.select()
			.from(memberships)
			.innerJoin(users, eq(users.id, memberships.userId))
			.where(eq(users.email, email));
		expect(member).toHaveLength(1);
	});
});
