import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import {
	attemptLimits,
	attemptMemoryMs,
	attemptWait,
	delayAfter,
	recordAttempt,
	spendAttempt
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
	const limit = attemptLimits['sign-in'];
	const at = (start: Date, ms: number) => new Date(start.getTime() + ms);

	it('let the free failures through, then make each further one wait twice as long', async () => {
		const keys = ['account:limit@example.test', 'address:10.0.0.1'];
		const start = new Date('2026-06-01T10:00:00Z');
		for (let i = 0; i < limit.free.account; i++) {
			expect(await attemptWait(database.db, 'sign-in', keys, start)).toBe(0);
			await recordAttempt(database.db, 'sign-in', keys, start);
		}
		// 1 s, then 2 s, then 4 s after the failure before (baseMs 1000, doubling).
		let last = start;
		for (const delay of [1000, 2000, 4000]) {
			expect(await attemptWait(database.db, 'sign-in', keys, last)).toBe(delay / 1000);
			expect(await attemptWait(database.db, 'sign-in', keys, at(last, delay - 1))).toBe(1);
			last = at(last, delay);
			expect(await attemptWait(database.db, 'sign-in', keys, last)).toBe(0);
			await recordAttempt(database.db, 'sign-in', keys, last);
		}
		// Never longer than the cap, and forgotten a day later.
		expect(delayAfter(limit, 1000, limit.free.account)).toBe(limit.maxMs);
		expect(await attemptWait(database.db, 'sign-in', keys, at(last, attemptMemoryMs))).toBe(0);
	});

	it('count an address apart from the accounts it tries', async () => {
		const start = new Date('2026-06-02T10:00:00Z');
		for (let i = 0; i < limit.free.address; i++) {
			const keys = [`account:spray-${i}@example.test`, 'address:10.0.0.2'];
			await recordAttempt(database.db, 'sign-in', keys, start);
		}
		const fresh = ['account:untouched@example.test', 'address:10.0.0.2'];
		expect(await attemptWait(database.db, 'sign-in', fresh, start)).toBe(1);
		const elsewhere = ['account:untouched@example.test', 'address:10.0.0.3'];
		expect(await attemptWait(database.db, 'sign-in', elsewhere, start)).toBe(0);
	});

	it('spend one attempt per request that sends mail, and none while waiting', async () => {
		const keys = ['account:mailbox@example.test', 'address:10.0.0.4'];
		const start = new Date('2026-06-03T10:00:00Z');
		const mailLimit = attemptLimits.link;
		for (let i = 0; i < mailLimit.free.account; i++) {
			expect(await spendAttempt(database.db, 'link', keys, start)).toBe(0);
		}
		expect(await spendAttempt(database.db, 'link', keys, start)).toBe(mailLimit.baseMs / 1000);
		expect(await spendAttempt(database.db, 'link', keys, at(start, 1000))).toBe(
			mailLimit.baseMs / 1000 - 1
		);
		expect(await spendAttempt(database.db, 'link', keys, at(start, mailLimit.baseMs))).toBe(0);
	});
});
