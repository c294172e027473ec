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
	private base: string;
	private extra: Record<string, string>;

	/** `base`: another app than the test app; `headers`: sent with every request (a proxy's). */
	constructor(options: { base?: string; headers?: Record<string, string> } = {}) {
		this.base = options.base ?? baseUrl;
		this.extra = options.headers ?? {};
	}

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
		const response = await fetch(new URL(path, this.base), {
			headers: { cookie: this.cookieHeader(), ...this.extra, ...headers },
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
		const response = await this.post(path, fields, {
			accept: 'application/json',
			'x-sveltekit-action': 'true'
		});
		const result = (await response.json()) as {
			type: 'success' | 'failure' | 'redirect' | 'error';
			status: number;
			location?: string;
			data?: string;
		};
		return result;
	}

	/**
	 * A same-origin form post; by default as a browser without scripts sends it, the answer
	 * being the page (or a redirect).
	 */
	async post(
		path: string,
		fields: Record<string, string>,
		headers: Record<string, string> = { accept: 'text/html' }
	) {
		const response = await fetch(new URL(path, this.base), {
			method: 'POST',
			headers: {
				...this.extra,
				cookie: this.cookieHeader(),
				origin: new URL(this.base).origin,
				'content-type': 'application/x-www-form-urlencoded',
				...headers
			},
			body: new URLSearchParams(fields),
			redirect: 'manual'
		});
		this.keep(response);
		return response;
	}

	/** A JSON API call with the session cookie (and the Origin a browser sends). */
	async api(method: string, path: string, body?: unknown) {
		return apiCall(
			method,
			path,
			body,
			{ ...this.extra, cookie: this.cookieHeader(), origin: new URL(this.base).origin },
			this.base
		);
	}

	/** A raw API call (CSV, multipart) with the session cookie and Origin. */
	async send(method: string, path: string, body?: BodyInit, contentType?: string) {
		return fetch(new URL(`/api/v1${path}`, this.base), {
			method,
			headers: {
				...this.extra,
				cookie: this.cookieHeader(),
				origin: new URL(this.base).origin,
				...(contentType ? { 'content-type': contentType } : {})
			},
			body
		});
	}

	/** Opens an address-confirmation link, then presses its button (posts `token` to the link). */
	async confirmAddress(link: string) {
		await this.get(link);
		const token = new URL(link, this.base).searchParams.get('token') ?? '';
		return this.submit(link, { token });
	}

	async signIn(email: string, password = demoPassword) {
		return this.submit('/signin?/password', { email, password });
	}

	/** The password sign-in form posted without scripts: the page's status and headers. */
	async signInResponse(email: string, password = demoPassword) {
		return this.post('/signin?/password', { email, password });
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
	headers: Record<string, string>,
	base = baseUrl
) {
	return fetch(new URL(`/api/v1${path}`, base), {
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
