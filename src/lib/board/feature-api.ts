/*
 * The board's writes: the JSON API of PRODUCT.md §6 by fetch, same-origin, with the session
 * cookie. Every answer becomes `{ok: true, …}` or the API's error body.
 */
import type { FeatureChanges, FeatureJson, NewFeature } from '$lib/features';

export interface ApiError {
	status: number;
	code: string;
	message: string;
	/** A callout that does not read: the character at fault. */
	position?: number;
	field?: string;
	/** 409 stale: the feature as it stands now. */
	current?: FeatureJson | null;
}

export type Answer<T> = { ok: true; value: T } | ({ ok: false } & ApiError);

async function call<T>(url: string, init: RequestInit): Promise<Answer<T>> {
	let response: Response;
	try {
		response = await fetch(url, {
			...init,
			headers: {
				accept: 'application/json',
				...(init.body ? { 'content-type': 'application/json' } : {})
			}
		});
	} catch {
		return { ok: false, status: 0, code: 'offline', message: 'The server could not be reached.' };
	}
	if (response.status === 204) return { ok: true, value: undefined as T };
	const body = await response.json().catch(() => null);
	if (response.ok) return { ok: true, value: body as T };
	const error = (body?.error ?? {}) as Partial<ApiError>;
	return {
		...error,
		ok: false,
		status: response.status,
		code: error.code ?? 'error',
		message: error.message ?? `The server answered ${response.status}.`
	};
}

/** The features of one revision: `base` is `/api/v1/teams/{team}/drawings/{number}/revisions/{letter}`. */
export function featureApi(base: string) {
	const features = `${base}/features`;
	return {
		list: () => call<FeatureJson[]>(features, { method: 'GET' }),
		create: (input: NewFeature) =>
			call<FeatureJson>(features, { method: 'POST', body: JSON.stringify(input) }),
		edit: (id: string, version: number, changes: Omit<FeatureChanges, 'version'>) =>
			call<FeatureJson>(`${features}/${id}`, {
				method: 'PATCH',
				body: JSON.stringify({ ...changes, version })
			}),
		remove: (id: string, version: number) =>
			call<void>(`${features}/${id}?version=${version}`, { method: 'DELETE' })
	};
}

export type FeatureApi = ReturnType<typeof featureApi>;
