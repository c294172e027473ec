import { inject } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

export const baseUrl = inject('baseUrl');
export const dataDir = inject('dataDir');
import { demoPassword } from '../e2e/browser';

export { demoPassword };

/** A minimal browser stand-in: keeps cookies, sends same-origin form posts like `use:enhance`. */
export class Client {
	cookies = new Map<string, string>();

	private cookieHeader() {
		return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
	}

	private keep(response: Response) {
		for (const line of response.headers.getSetCookie()) {
			const [pair, ...attributes] = line.split(';');
			const index = pair.indexOf('=');
			const name = pair.slice(0, index).trim();
			const value = pair.slice(index + 1).trim();
			const expired = attributes.some((a) => /max-age=0|expires=thu, 01 jan 1970/i.test(a.trim()));
			if (expired || value === '') this.cookies.delete(name);
			else this.cookies.set(name, value);
		}
	}

	async get(path: string, headers: Record<string, string> = {}) {
		const response = await fetch(new URL(path, baseUrl), {
			headers: { cookie: this.cookieHeader(), ...headers },
			redirect: 'manual'
		});
		this.keep(response);
		return response;
	}

	/** Follows redirects by hand so every cookie is kept. */
	async follow(path: string) {
		let response = await this.get(path);
		for (let hops = 0; hops < 5 && response.status >= 300 && response.status < 400; hops++) {
			response = await this.get(response.headers.get('location')!);
		}
		return response;
	}

	/** Submits a form action; returns SvelteKit's action result `{type, status, data|location}`. */
	async submit(path: string, fields: Record<string, string>) {
		const response = await fetch(new URL(path, baseUrl), {
			method: 'POST',
			headers: {
				cookie: this.cookieHeader(),
				origin: new URL(baseUrl).origin,
				'content-type': 'application/x-www-form-urlencoded',
				accept: 'application/json',
				'x-sveltekit-action': 'true'
			},
			body: new URLSearchParams(fields),
			redirect: 'manual'
		});
		this.keep(response);
		const result = (await response.json()) as {
			type: 'success' | 'failure' | 'redirect' | 'error';
			status: number;
			location?: string;
			data?: string;
		};
		return result;
	}

	/** A JSON API call with the session cookie (and the Origin a browser sends). */
	async api(method: string, path: string, body?: unknown) {
		return apiCall(method, path, body, {
			cookie: this.cookieHeader(),
			origin: new URL(baseUrl).origin
		});
	}

	async signIn(email: string, password = demoPassword) {
		return this.submit('/signin?/password', { email, password });
	}

	async me() {
		return this.get('/api/v1/me');
	}
}

/** The mail the stand-in caught, newest first. */
export function caughtMail() {
	const dir = join(dataDir, 'mail');
	return readdirSync(dir)
		.filter((name) => name.endsWith('.json'))
		.sort()
		.reverse()
		.map((name) => JSON.parse(readFileSync(join(dir, name), 'utf8')) as CaughtMail);
}

interface CaughtMail {
	to: string[];
	subject: string;
	text: string;
	html: string;
	messageId: string;
}

/** Waits for a message to `to` whose subject matches, as the outbox delivers within seconds. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 15_000) {
	const until = Date.now() + timeoutMs;
	while (Date.now() < until) {
		try {
			const found = caughtMail().find((m) => m.to.includes(to) && subject.test(m.subject));
			if (found) return found;
		} catch {
			// the mail folder appears with the first message
		}
		await new Promise((done) => setTimeout(done, 200));
	}
	throw new Error(`no mail to ${to} matching ${subject}`);
}

export function linkIn(mail: { text: string }, path: string) {
	const match = new RegExp(`https?://\\S+${path.replace(/[/?]/g, '\\$&')}\\S*`).exec(mail.text);
	if (!match) throw new Error(`no ${path} link in: ${mail.text}`);
	return new URL(match[0]).pathname + new URL(match[0]).search;
}

/** A JSON API call as a script would make it: a Bearer token and no Origin header. */
export function bearerCall(token: string, method: string, path: string, body?: unknown) {
	return apiCall(method, path, body, { authorization: `Bearer ${token}` });
}

async function apiCall(
	method: string,
	path: string,
	body: unknown,
	headers: Record<string, string>
) {
	return fetch(new URL(`/api/v1${path}`, baseUrl), {
		method,
		headers: body === undefined ? headers : { ...headers, 'content-type': 'application/json' },
		body: body === undefined ? undefined : JSON.stringify(body)
	});
}

export const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/** Signs up and confirms a new account through the real pages and mail, then signs in. */
export async function newVerifiedUser(client: Client, name = 'Ada Reviewer') {
	const email = `user-${unique()}@example.test`;
	const password = 'pump housing bore 18';
	await client.submit('/signup', { name, email, password });
	const mail = await waitForMail(email, /Confirm your e-mail/);
	await client.get(linkIn(mail, '/verify'));
	await client.signIn(email, password);
	return { email, password };
}
