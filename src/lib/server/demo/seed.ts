import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Db } from '../db/connect';
import { createUser, getUserByEmail } from '../db/queries/users';
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
	for (const person of demoPeople) {
		if (await getUserByEmail(db, person.email)) continue;
		await createUser(db, {
			name: person.name,
			email: person.email,
			passwordHash,
			emailVerified: new Date()
		});
	}
}
