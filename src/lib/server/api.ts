import { error, type Handle } from '@sveltejs/kit';
import { RevisionFrozen, StaleWrite } from './db/queries/revision-writes';

const codeForStatus: Record<number, string> = {
	400: 'invalid',
	401: 'unauthenticated',
	403: 'forbidden',
	404: 'not_found',
	405: 'method_not_allowed',
	409: 'conflict',
	413: 'too_large',
	415: 'unsupported_media_type',
	422: 'unprocessable',
	429: 'rate_limited',
	500: 'internal'
};

/**
 * The API's error shape is `{error: {code, message, …}}` (PRODUCT.md §6). Routes throw
 * SvelteKit's `error(status, {message, code, …})`; this puts the body into that shape.
 */
export const apiErrors: Handle = async ({ event, resolve }) => {
	const api = event.url.pathname.startsWith('/api/');
	// SvelteKit answers a route's `error()` as an HTML page unless the client asks for JSON;
	// a script that sends no Accept header still gets the message.
	if (api && !event.request.headers.get('accept')?.includes('application/json')) {
		event.request.headers.set('accept', 'application/json');
	}
	const response = await resolve(event);
	if (!api || response.status < 400) return response;
	const type = response.headers.get('content-type') ?? '';
	if (!type.includes('application/json')) {
		// An HTML error page (an unknown path, for one) is no message for a script.
		const text = type.includes('text/html') ? '' : (await response.text()).trim();
		const message =
			text && text.length <= 300
				? text
				: response.status === 404
					? `No such API path: ${event.request.method} ${event.url.pathname}`
					: response.statusText || 'Request failed';
		return jsonError(response, { message });
	}
	const body = (await response.json()) as Record<string, unknown>;
	if (body && typeof body.error === 'object') return jsonError(response, null, body);
	return jsonError(response, body);
};

function jsonError(
	response: Response,
	detail: Record<string, unknown> | null,
	already?: Record<string, unknown>
) {
	const headers = new Headers(response.headers);
	headers.set('content-type', 'application/json');
	headers.delete('content-length');
	const { message, code, ...rest } = detail ?? {};
	// A refusal that says when to come back (429 rate_limited) says it in the header too.
	const retryAfter = rest.retryAfter ?? (already?.error as { retryAfter?: unknown })?.retryAfter;
	if (typeof retryAfter === 'number') headers.set('retry-after', String(retryAfter));
	const body = already ?? {
		error: {
			code: code ?? codeForStatus[response.status] ?? 'error',
			message: message ?? 'Request failed',
			...rest
		}
	};
	return new Response(JSON.stringify(body), { status: response.status, headers });
}

/** Throws a service's refusal (`{status, code, message, …}`) as the API's error. */
export function refuse(refusal: { status: number; code: string; message: string }): never {
	const { status, ...body } = refusal as typeof refusal & { ok?: boolean };
	delete body.ok;
	error(status, body as App.Error);
}

/**
 * The refusal for a write to a revision's content that lost (features, fits, …): the revision
 * froze (409 `frozen`), the row changed meanwhile (409 `stale` with the current one, shown by
 * `present`) or went (404 `not_found`). Any other error is thrown on.
 */
export async function writeRefusal<Row, Shown>(
	err: unknown,
	noun: string,
	present: (row: Row) => Promise<Shown>
) {
	if (err instanceof RevisionFrozen) {
		const { letter, state } = err.revision;
		return refusal(409, 'frozen', `Revision ${letter} is ${state}: its ${noun}s no longer change.`);
	}
	if (err instanceof StaleWrite) {
		const current = (err as StaleWrite<Row>).current;
		if (!current) return refusal(404, 'not_found', `${err.message}.`);
		return {
			...refusal(
				409,
				'stale',
				`${err.message}: your edit was not applied. Here is the current ${err.noun}.`
			),
			current: await present(current)
		};
	}
	throw err;
}

const refusal = <S extends 404 | 409, C extends 'frozen' | 'stale' | 'not_found'>(
	status: S,
	code: C,
	message: string
) => ({ ok: false as const, status, code, message });
