/**
 * What the HTTP (tests/app) and browser (tests/e2e) tests share: names unique to this run, and
 * the mail the stand-in caught for the app that tests/e2e/global-setup.ts started.
 */
import { randomBytes } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { inject } from 'vitest';

const run = randomBytes(4).toString('hex');
let count = 0;

/** Distinct on every call in this run and from every other run: a random run id and a counter. */
export const unique = () => `${run}${(count++).toString(36)}`;

interface CaughtMail {
	to: string[];
	subject: string;
	text: string;
	html: string;
	messageId: string;
}

/** The mail the stand-in caught, newest first (of the test app, or of the app in `dataDir`). */
export function caughtMail(dataDir = inject('dataDir')): CaughtMail[] {
	const dir = join(dataDir, 'mail');
	return readdirSync(dir)
		.filter((name) => name.endsWith('.json'))
		.sort()
		.reverse()
		.map((name) => JSON.parse(readFileSync(join(dir, name), 'utf8')) as CaughtMail);
}

/** Waits for a message to `to` whose subject matches, as the outbox delivers within seconds. */
export async function waitForMail(
	to: string,
	subject: RegExp,
	timeoutMs = 15_000,
	dataDir = inject('dataDir')
) {
	const until = Date.now() + timeoutMs;
	while (Date.now() < until) {
		try {
			const found = caughtMail(dataDir).find((m) => m.to.includes(to) && subject.test(m.subject));
			if (found) return found;
		} catch {
			// the mail folder appears with the first message
		}
		await new Promise((done) => setTimeout(done, 200));
	}
	throw new Error(`no mail to ${to} matching ${subject}`);
}

/** The path and query of the first link in the mail's text that leads to `path`. */
export function linkIn(mail: { text: string }, path: string) {
	const match = new RegExp(`https?://\\S+${path.replace(/[/?]/g, '\\$&')}\\S*`).exec(mail.text);
	if (!match) throw new Error(`no ${path} link in: ${mail.text}`);
	return new URL(match[0]).pathname + new URL(match[0]).search;
}
