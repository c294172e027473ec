import { expect } from 'vitest';
import { twoSheetPdf } from '../fixtures/pdfs';
import { unique } from '../shared';
import { Client, newVerifiedUser } from './client';

/** A new drawing with revision A (draft) in `team`, uploaded by `client`; its API path. */
export async function draftRevision(
	client: Client,
	team: string,
	drawing: Record<string, unknown> = {}
) {
	const number = `F-${unique()}`.toUpperCase();
	const created = await client.api('POST', `/teams/${team}/drawings`, {
		number,
		title: 'Bushing for feature tests',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' },
		...drawing
	});
	expect(created.status).toBe(201);
	const form = new FormData();
	form.set(
		'file',
		new Blob([(await twoSheetPdf(number)) as BlobPart], { type: 'application/pdf' })
	);
	const uploaded = await client.send('POST', `/teams/${team}/drawings/${number}/revisions`, form);
	expect(uploaded.status).toBe(201);
	return { number, path: `/teams/${team}/drawings/${number}/revisions/A` };
}

export type Actor = 'signedOut' | 'admin' | 'drafter' | 'checker' | 'quality' | 'outsider';
export const actors: Actor[] = ['signedOut', 'admin', 'drafter', 'checker', 'quality', 'outsider'];

/** A client per role of the demo team, one signed out, and an outsider with a team of their own. */
export async function roleClients() {
	const clients = {} as Record<Actor, Client>;
	for (const actor of actors) clients[actor] = new Client();
	for (const role of ['admin', 'drafter', 'checker', 'quality'] as const) {
		await clients[role].signIn(`${role}@example.test`);
	}
	await newVerifiedUser(clients.outsider, 'Olu Elsewhere');
	const outsiderTeam = `elsewhere-${unique()}`;
	const team = await clients.outsider.api('POST', '/teams', {
		name: 'Elsewhere Pumps',
		slug: outsiderTeam
	});
	expect(team.status).toBe(201);
	return { clients, outsiderTeam };
}
