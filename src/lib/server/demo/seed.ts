import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Db } from '../db/connect';
import { addMember, getTeamBySlug } from '../db/queries/teams';
import { createUser, getUserByEmail } from '../db/queries/users';
import { teams, type Role, type UserRow } from '../db/schema';
import { hashPassword } from '../passwords';

export const demoPeople = [
	{ email: 'admin@example.test', name: 'Ines Marlow', role: 'admin' },
	{ email: 'drafter@example.test', name: 'Tomas Reyes', role: 'drafter' },
	{ email: 'checker@example.test', name: 'Priya Natarajan', role: 'checker' },
	{ email: 'quality@example.test', name: 'Ken Halloran', role: 'quality' }
] as const;

/** DEMO_PASSWORD, or one generated once and kept in the data dir so every start prints it. */
export function demoPassword(dataDir: string, configured: string | undefined) {
	if (configured) return configured;
	const file = join(dataDir, 'demo-password');
	if (!existsSync(file)) writeFileSync(file, randomBytes(9).toString('base64url'), { mode: 0o600 });
	return readFileSync(file, 'utf8').trim();
}

/** The invented Kestrel Fluidics demo: created once, never overwritten. */
export async function seedDemo(db: Db, password: string) {
	const passwordHash = await hashPassword(password);
	const people: { user: UserRow; role: Role }[] = [];
	for (const person of demoPeople) {
		// Another instance starting at the same time may create the user between our two calls.
		const user =
			(await getUserByEmail(db, person.email)) ??
			(await createUser(db, {
				name: person.name,
				email: person.email,
				passwordHash,
				emailVerified: new Date()
			})) ??
			(await getUserByEmail(db, person.email));
		if (user) people.push({ user, role: person.role });
	}
	if (await getTeamBySlug(db, 'kestrel')) return;
	// One transaction, so an instance that loses the race never sees the team without members.
	await db.transaction(async (tx) => {
		const [team] = await tx
			.insert(teams)
			.values({ slug: 'kestrel', name: 'Kestrel Fluidics' })
			.onConflictDoNothing()
			.returning();
		if (!team) return;
		for (const { user, role } of people) await addMember(tx, null, team.id, user, role);
	});
}
