/*
 * The board's findings through the JSON API (`$lib/api-client`): every answer becomes
 * `{ok: true, value}` or the API's error body.
 */
import { call } from '$lib/api-client';
import type { CommentJson, FindingChanges, FindingJson, NewFinding } from '$lib/findings';

/** The findings of one revision: `base` is `/api/v1/teams/{team}/drawings/{number}/revisions/{letter}`. */
export function findingApi(base: string) {
	const findings = `${base}/findings`;
	return {
		list: () => call<FindingJson[]>(findings, { method: 'GET' }),
		get: (id: string) => call<FindingJson, FindingJson>(`${findings}/${id}`, { method: 'GET' }),
		raise: (input: NewFinding) =>
			call<FindingJson, FindingJson>(findings, { method: 'POST', body: input }),
		change: (id: string, changes: FindingChanges) =>
			call<FindingJson, FindingJson>(`${findings}/${id}`, { method: 'PATCH', body: changes }),
		comments: (id: string) => call<CommentJson[]>(`${findings}/${id}/comments`, { method: 'GET' })
	};
}

export type FindingApi = ReturnType<typeof findingApi>;
