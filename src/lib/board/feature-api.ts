/*
 * The board's writes through the JSON API (`$lib/api-client`): every answer becomes
 * `{ok: true, value}` or the API's error body.
 */
import { call as callApi, type Answer as Answer_, type ApiError as Base } from '$lib/api-client';
import type { FeatureChanges, FeatureJson, NewFeature } from '$lib/features';

export type ApiError = Base<FeatureJson>;
export type Answer<T> = Answer_<T, FeatureJson>;

/** The features of one revision: `base` is `/api/v1/teams/{team}/drawings/{number}/revisions/{letter}`. */
export function featureApi(base: string) {
	const features = `${base}/features`;
	const call = <T>(url: string, init: Parameters<typeof callApi>[1]) =>
		callApi<T, FeatureJson>(url, init);
	return {
		list: () => call<FeatureJson[]>(features, { method: 'GET' }),
		get: (id: string) => call<FeatureJson>(`${features}/${id}`, { method: 'GET' }),
		create: (input: NewFeature) => call<FeatureJson>(features, { method: 'POST', body: input }),
		edit: (id: string, version: number, changes: Omit<FeatureChanges, 'version'>) =>
			call<FeatureJson>(`${features}/${id}`, {
				method: 'PATCH',
				body: { ...changes, version }
			}),
		remove: (id: string, version: number) =>
			call<void>(`${features}/${id}?version=${version}`, { method: 'DELETE' })
	};
}

export type FeatureApi = ReturnType<typeof featureApi>;
