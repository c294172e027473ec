import { beforeAll, describe, expect, it } from 'vitest';
import { manyPagePdf, twoSheetPdf } from '../fixtures/pdfs';
import { unique } from '../shared';
import { baseUrl, Client } from './client';

let token = '';
let path = '';

beforeAll(async () => {
	const drafter = new Client();
	await drafter.signIn('drafter@example.test');
	token = (await (await drafter.api('POST', '/me/tokens', { name: 'pages' })).json()).token;
	const number = `T-${unique()}`.toUpperCase();
	await drafter.api('POST', '/teams/kestrel/drawings', {
		number,
		title: 'Many sheets',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
	});
	path = `/api/v1/teams/kestrel/drawings/${number}/revisions`;
});

function upload(bytes: Uint8Array) {
	const form = new FormData();
	form.set('file', new Blob([bytes as BlobPart], { type: 'application/pdf' }), 'drawing.pdf');
	return fetch(new URL(path, baseUrl), {
		method: 'POST',
		headers: { authorization: `Bearer ${token}` },
		body: form
	});
}

describe('a PDF of 20,000 pages', () => {
	it('is refused with 422 too_many_pages while another client is served', async () => {
		const bytes = manyPagePdf(20_000);
		const other = new Client();
		await other.signIn('checker@example.test');
		let uploadDone = false;
		const refused = upload(bytes).finally(() => (uploadDone = true));
		// Another client keeps asking while the upload is checked.
		const answers: number[] = [];
		while (!uploadDone && answers.length < 50) {
			answers.push((await other.api('GET', '/teams/kestrel/drawings')).status);
		}
		const response = await refused;
		expect(response.status).toBe(422);
		const { error } = await response.json();
		expect(error.code).toBe('too_many_pages');
		expect(error.message).toContain('20,000 pages');
		expect(error.message).toContain('1,000 sheets');
		expect(answers.length).toBeGreaterThan(0);
		expect(answers.every((status) => status === 200)).toBe(true);

		// The check is per upload: a good drawing goes in as usual afterwards.
		expect((await upload(await twoSheetPdf('AFTER-MANY'))).status).toBe(201);
	});
});
