/*
 * The JSON API from the browser: one call, one answer read the same way everywhere. Errors
 * come back as the API shapes them (`{error: {code, message, …}}`), never as a thrown fault.
 */

export interface ApiError {
	code: string;
	message: string;
	/** 422 invalid_rows: each bad CSV row by its line in the file. */
	rows?: { line: number; reason: string }[];
	/** 409 stale: the object as it is now. */
	current?: unknown;
	fields?: Record<string, string[]>;
	field?: string;
}

export type ApiAnswer<T> =
	{ ok: true; status: number; data: T } | { ok: false; status: number; error: ApiError };

/** `path` under /api/v1; a plain object body is sent as JSON, FormData as multipart. */
export async function api<T>(
	method: 'GET' | 'POST' | 'PATCH' | 'DELETE',
	path: string,
	body?: unknown
): Promise<ApiAnswer<T>> {
	const headers: Record<string, string> = { accept: 'application/json' };
	const init: RequestInit = { method, headers };
	if (body instanceof FormData) init.body = body;
	else if (body !== undefined) {
		init.body = JSON.stringify(body);
		headers['content-type'] = 'application/json';
	}
	let response: Response;
	try {
		response = await fetch(`/api/v1${path}`, init);
	} catch {
		return {
			ok: false,
			status: 0,
			error: { code: 'offline', message: 'The server could not be reached. Try again.' }
		};
	}
	const text = await response.text();
	let parsed: unknown = null;
	try {
		parsed = text ? JSON.parse(text) : null;
	} catch {
		parsed = null;
	}
	if (response.ok) return { ok: true, status: response.status, data: parsed as T };
	const error = (parsed as { error?: ApiError } | null)?.error ?? {
		code: 'error',
		message: `The server answered ${response.status}.`
	};
	return { ok: false, status: response.status, error };
}

/** The API path of a revision: `/teams/{team}/drawings/{number}/revisions/{letter}`. */
export const revisionPath = (team: string, number: string, letter: string) =>
	`/teams/${encodeURIComponent(team)}/drawings/${encodeURIComponent(number)}/revisions/${encodeURIComponent(letter)}`;
