import { inject } from 'vitest';
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

export const baseUrl = inject('baseUrl');
export const dataDir = inject('dataDir');
import { demoPassword } from '../e2e/browser';
import { linkIn, unique, waitForMail } from '../shared';

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

	/** A raw API call (CSV, multipart) with the session cookie and Origin. */
	async send(method: string, path: string, body?: BodyInit, contentType?: string) {
		return fetch(new URL(`/api/v1${path}`, baseUrl), {
			method,
			headers: {
				cookie: this.cookieHeader(),
				origin: new URL(baseUrl).origin,
				...(contentType ? { 'content-type': contentType } : {})
			},
			body
		});
	}

	/** Opens an address-confirmation link, then presses its button (posts `token` to the link). */
	async confirmAddress(link: string) {
		await this.get(link);
		const token = new URL(link, baseUrl).searchParams.get('token') ?? '';
		return this.submit(link, { token });
	}

	async signIn(email: string, password = demoPassword) {
		return this.submit('/signin?/password', { email, password });
	}

	async me() {
		return this.get('/api/v1/me');
	}
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

/** Signs up and confirms a new account through the real pages and mail, then signs in. */
export async function newVerifiedUser(client: Client, name = 'Ada Reviewer') {
	const email = `user-${unique()}@example.test`;
	const password = 'pump housing bore 18';
	await client.submit('/signup', { name, email, password });
	const mail = await waitForMail(email, /Confirm your e-mail/);
	await client.confirmAddress(linkIn(mail, '/verify'));
	await client.signIn(email, password);
	return { email, password };
}

/** What storage and the temp folder hold: nothing may be left behind by a refused upload. */
export function leftovers() {
	const files = (dir: string): string[] => {
		try {
			return readdirSync(dir).flatMap((name) => {
				const path = join(dir, name);
				return statSync(path).isDirectory() ? files(path) : [path];
			});
		} catch {
			return [];
		}
	};
	return { objects: files(join(dataDir, 's3')).length, temp: files(join(dataDir, 'tmp')).length };
}
