/*
 * The JSON API of PRODUCT.md §6 from the browser: fetch, same-origin, with the session cookie.
 * Every answer becomes `{ok: true, value}` or the API's error body (`{error: {code, message,
 * …}}`) with its status, never a thrown fault.
 */

export interface ApiError<Current = unknown> {
	status: number;
	code: string;
	message: string;
	/** A callout that does not read: the character at fault. */
	position?: number;
	field?: string;
	/** 409 stale: the object as it stands now. */
	current?: Current | null;
	/** 422 invalid_rows: each bad CSV row by its line in the file. */
	rows?: { line: number; reason: string }[];
}

export type Answer<T, Current = unknown> =
	{ ok: true; value: T } | ({ ok: false } & ApiError<Current>);

/** `body`: an object is sent as JSON, FormData as multipart. */
export async function call<T, Current = unknown>(
	url: string,
	init: { method: 'GET' | 'POST' | 'PATCH' | 'DELETE'; body?: unknown }
): Promise<Answer<T, Current>> {
	const json = init.body !== undefined && !(init.body instanceof FormData);
	let response: Response;
	try {
		response = await fetch(url, {
			method: init.method,
			body: json ? JSON.stringify(init.body) : (init.body as FormData | undefined),
			headers: {
				accept: 'application/json',
				...(json ? { 'content-type': 'application/json' } : {})
			}
		});
	} catch {
		return { ok: false, status: 0, code: 'offline', message: 'The server could not be reached.' };
	}
	if (response.status === 204) return { ok: true, value: undefined as T };
	const body = await response.json().catch(() => null);
	if (response.ok) return { ok: true, value: body as T };
	const error = (body?.error ?? {}) as Partial<ApiError<Current>>;
	return {
		...error,
		ok: false,
		status: response.status,
		code: error.code ?? 'error',
		message: error.message ?? `The server answered ${response.status}.`
	};
}

/** `/api/v1/teams/{team}/drawings/{number}/revisions/{letter}`. */
export const revisionUrl = (team: string, number: string, letter: string) =>
	`/api/v1/teams/${encodeURIComponent(team)}/drawings/${encodeURIComponent(number)}/revisions/${encodeURIComponent(letter)}`;
