import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';

/**
 * The demo's people and their password: small, so the server start may import them. The seed
 * itself (drawings, PDF generator, fonts) is loaded only when seeding (see hooks.server.ts).
 */
export const demoPeople = [
	{ email: 'admin@example.test', name: 'Ines Marlow', role: 'admin' },
	{ email: 'drafter@example.test', name: 'Tomas Reyes', role: 'drafter' },
	{ email: 'checker@example.test', name: 'Priya Natarajan', role: 'checker' },
	{ email: 'quality@example.test', name: 'Ken Halloran', role: 'quality' }
] as const;

/**
 * Demo users only when asked for: a local start on the embedded database seeds them unless
 * `SEED_DEMO=0`; a start on a PostgreSQL server (`DATABASE_URL`, a deployment) only with
 * `SEED_DEMO=1`.
 */
export function seedsDemo(env: Record<string, string | undefined>) {
	return env.DATABASE_URL ? env.SEED_DEMO === '1' : env.SEED_DEMO !== '0';
}

/** DEMO_PASSWORD, or one generated once and kept in the data dir (every start says where). */
export function demoPassword(dataDir: string, configured: string | undefined) {
	if (configured) return configured;
	const file = join(dataDir, 'demo-password');
	if (!existsSync(file)) writeFileSync(file, randomBytes(9).toString('base64url'), { mode: 0o600 });
	return readFileSync(file, 'utf8').trim();
}
