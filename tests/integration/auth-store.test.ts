import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import {
	attemptLimits,
	isRateLimited,
	recordAttempt
} from '../../src/lib/server/db/queries/attempts';
import { consumeUserToken, issueUserToken } from '../../src/lib/server/db/queries/tokens';
import { createUser } from '../../src/lib/server/db/queries/users';
import { freshDatabase } from './harness';

let database: Database;
let userId: string;

beforeAll(async () => {
	database = await freshDatabase();
	const user = await createUser(database.db, {
		name: 'Test',
		email: 'store@example.test',
		passwordHash: null
	});
	userId = user!.id;
});
afterAll(() => database?.close());

describe('e-mailed tokens', () => {
	it('are single use', async () => {
		const token = await issueUserToken(database.db, userId, 'reset-password', 60_000);
		expect(await consumeUserToken(database.db, token, 'reset-password')).toEqual({
			ok: true,
			userId
		});
		expect(await consumeUserToken(database.db, token, 'reset-password')).toEqual({
			ok: false,
			reason: 'invalid'
		});
	});

	it('expire', async () => {
		const token = await issueUserToken(database.db, userId, 'reset-password', 60 * 60_000);
		const later = new Date(Date.now() + 61 * 60_000);
		expect(await consumeUserToken(database.db, token, 'reset-password', later)).toEqual({
			ok: false,
			reason: 'expired'
		});
	});

	it('only serve their own purpose', async () => {
		const token = await issueUserToken(database.db, userId, 'verify-email', 60_000);
		expect(await consumeUserToken(database.db, token, 'reset-password')).toMatchObject({
			ok: false
		});
	});
});

describe('attempt limits', () => {
	it('stop the 11th failure on an account within the window and let a later attempt through', async () => {
		const keys = ['account:limit@example.test', 'address:10.0.0.1'];
		const start = new Date('2026-06-01T10:00:00Z');
		for (let i = 0; i < attemptLimits['sign-in'].account; i++) {
			expect(await isRateLimited(database.db, 'sign-in', keys, start)).toBe(false);
			await recordAttempt(database.db, 'sign-in', keys, start);
		}
		expect(await isRateLimited(database.db, 'sign-in', keys, start)).toBe(true);
		const after = new Date(start.getTime() + attemptLimits['sign-in'].windowMs + 1000);
		expect(await isRateLimited(database.db, 'sign-in', keys, after)).toBe(false);
	});
});
