import { createHash } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { encryptedPdf, notAPdf, truncatedPdf, twoSheetPdf } from '../fixtures/pdfs';
import { unique } from '../shared';
import { baseUrl, bearerCall, Client, leftovers, newVerifiedUser } from './client';

const drafter = new Client();
const checker = new Client();
const quality = new Client();
const outsider = new Client();
let token = '';

beforeAll(async () => {
	await drafter.signIn('drafter@example.test');
	await checker.signIn('checker@example.test');
	await quality.signIn('quality@example.test');
	await newVerifiedUser(outsider, 'Olu Elsewhere');
	token = (await (await drafter.api('POST', '/me/tokens', { name: 'uploads' })).json()).token;
});

const newNumber = () => `T-${unique()}`.toUpperCase();
const drawing = (number: string) => ({
	number,
	title: 'Test plate',
	units: 'mm',
	standard: 'iso-8015',
	generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
});

function upload(
	path: string,
	bytes: Uint8Array,
	fields: Record<string, string> = {},
	name = 'drawing.pdf'
) {
	const form = new FormData();
	for (const [k, v] of Object.entries(fields)) form.set(k, v);
	form.set('file', new Blob([bytes as BlobPart], { type: 'application/pdf' }), name);
	// A script with a token: no cookie, no Origin header.
	return fetch(new URL(`/api/v1${path}`, baseUrl), {
		method: 'POST',
		headers: { authorization: `Bearer ${token}` },
		body: form
	});
}

describe('drawings', () => {
	it('are created, listed and edited with a version; a stale edit gets 409 with the current drawing', async () => {
		const number = newNumber();
		const created = await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		expect(created.status).toBe(201);
		expect(await created.json()).toMatchObject({ number, version: 1, units: 'mm' });
		expect((await drafter.api('POST', '/teams/kestrel/drawings', drawing(number))).status).toBe(
			409
		);

		const first = await drafter.api('PATCH', `/teams/kestrel/drawings/${number}`, {
			version: 1,
			title: 'Test plate, revised'
		});
		expect(await first.json()).toMatchObject({ title: 'Test plate, revised', version: 2 });
		const stale = await checker.api('PATCH', `/teams/kestrel/drawings/${number}`, {
			version: 1,
			title: 'Lost edit'
		});
		expect(stale.status).toBe(403); // checkers do not author drawings
		const staleByDrafter = await drafter.api('PATCH', `/teams/kestrel/drawings/${number}`, {
			version: 1,
			title: 'Lost edit'
		});
		expect(staleByDrafter.status).toBe(409);
		const body = await staleByDrafter.json();
		expect(body.error.code).toBe('stale');
		expect(body.error.current).toMatchObject({ title: 'Test plate, revised', version: 2 });
	});

	it('take inch title-block tolerances by any set of decimal places', async () => {
		const number = newNumber();
		const created = await drafter.api('POST', '/teams/kestrel/drawings', {
			...drawing(number),
			units: 'in',
			standard: 'asme-y14.5-2018',
			generalTolerance: {
				kind: 'decimal-places',
				byPlaces: { '2': '0.01', '3': '0.005' },
				angle: '0.5'
			}
		});
		expect(created.status).toBe(201);
		expect((await created.json()).generalTolerance).toEqual({
			kind: 'decimal-places',
			byPlaces: { '2': '0.01', '3': '0.005' },
			angle: '0.5'
		});
	});

	it('refuses a bad drawing with a clear message and changes nothing', async () => {
		const bad = await drafter.api('POST', '/teams/kestrel/drawings', {
			...drawing('bad number with spaces'),
			units: 'furlongs'
		});
		expect(bad.status).toBe(400);
		expect((await bad.json()).error).toMatchObject({ code: 'invalid' });
	});

	it('are 404 to other teams and invisible to supplier quality until released', async () => {
		const number = newNumber();
		await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		expect((await outsider.api('GET', `/teams/kestrel/drawings/${number}`)).status).toBe(404);
		expect((await quality.api('GET', `/teams/kestrel/drawings/${number}`)).status).toBe(404);
		const list = (await (await quality.api('GET', '/teams/kestrel/drawings')).json()) as {
			number: string;
			latestRevision: { letter: string; state: string };
		}[];
		// The demo's released housing (KF-1001 A) and drawings other tests released, nothing else.
		expect(list.map((d) => d.number)).not.toContain(number);
		expect(list).toContainEqual(
			expect.objectContaining({
				number: 'KF-1001',
				latestRevision: expect.objectContaining({ letter: 'A', state: 'released' })
			})
		);
		for (const listed of list) {
			expect(['released', 'superseded']).toContain(listed.latestRevision.state);
		}
		expect(
			(await checker.api('POST', '/teams/kestrel/drawings', drawing(newNumber()))).status
		).toBe(403);
	});
});

describe('revision uploads', () => {
	it('store a two-sheet PDF with its SHA-256, sizes after rotation, and the next letters', async () => {
		const number = newNumber();
		await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		const bytes = await twoSheetPdf(number);
		const response = await upload(`/teams/kestrel/drawings/${number}/revisions`, bytes, {
			reason: 'First issue'
		});
		expect(response.status).toBe(201);
		const revision = await response.json();
		expect(revision).toMatchObject({
			letter: 'A',
			reason: 'First issue',
			state: 'draft',
			pages: 2
		});
		expect(revision.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
		expect(revision.size).toBe(bytes.length);
		// The A4 sheet is rotated 90°: as displayed it is landscape.
		expect(revision.sheets).toEqual([
			{ width: 1190.55, height: 841.89 },
			{ width: 841.89, height: 595.28 }
		]);

		const second = await upload(
			`/teams/kestrel/drawings/${number}/revisions`,
			await twoSheetPdf(`${number}-2`)
		);
		expect((await second.json()).letter).toBe('B');
		const chosen = await upload(
			`/teams/kestrel/drawings/${number}/revisions`,
			await twoSheetPdf(`${number}-3`),
			{
				letter: 'H'
			}
		);
		expect((await chosen.json()).letter).toBe('H');
		const next = await upload(
			`/teams/kestrel/drawings/${number}/revisions`,
			await twoSheetPdf(`${number}-4`)
		);
		expect((await next.json()).letter).toBe('J'); // ASME Y14.35: I is never used
		const badLetter = await upload(
			`/teams/kestrel/drawings/${number}/revisions`,
			await twoSheetPdf(`${number}-5`),
			{
				letter: 'O'
			}
		);
		expect(badLetter.status).toBe(400);
	});

	it('refuse bad files with their codes and leave nothing behind', async () => {
		const number = newNumber();
		await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		const path = `/teams/kestrel/drawings/${number}/revisions`;
		const good = await twoSheetPdf(number);
		expect((await upload(path, good)).status).toBe(201);
		const before = leftovers();
		const cases: [Uint8Array, number, string][] = [
			[notAPdf(), 415, 'not_pdf'],
			[new Uint8Array(0), 415, 'not_pdf'],
			[await truncatedPdf(), 422, 'unreadable_pdf'],
			[encryptedPdf(), 422, 'encrypted_pdf'],
			[good, 422, 'duplicate_revision'],
			[new Uint8Array(21 * 1024 * 1024).fill(32), 413, 'too_large']
		];
		for (const [bytes, status, code] of cases) {
			const response = await upload(path, bytes);
			expect(response.status, code).toBe(status);
			const body = await response.json();
			expect(body.error.code).toBe(code);
			expect(body.error.message.length).toBeGreaterThan(10);
		}
		const revisions = await (
			await drafter.api('GET', `/teams/kestrel/drawings/${number}/revisions`)
		).json();
		expect(revisions).toHaveLength(1);
		expect(leftovers()).toEqual(before);
	});

	it('serve the file through the app with Range support and its file name', async () => {
		const number = newNumber();
		await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		const bytes = await twoSheetPdf(number);
		await upload(`/teams/kestrel/drawings/${number}/revisions`, bytes);
		const path = `/teams/kestrel/drawings/${number}/revisions/A/file`;
		const whole = await bearerCall(token, 'GET', path);
		expect(whole.status).toBe(200);
		expect(whole.headers.get('content-type')).toBe('application/pdf');
		expect(whole.headers.get('content-disposition')).toContain(`${number}-A.pdf`);
		expect(new Uint8Array(await whole.arrayBuffer())).toEqual(bytes);
		// Opened on its own it runs nothing; every use asks again, so losing access takes effect.
		expect(whole.headers.get('content-security-policy')).toBe('sandbox');
		expect(whole.headers.get('cache-control')).toBe('private, no-cache');
		const etag = whole.headers.get('etag')!;
		expect(etag).toBe(`"${createHash('sha256').update(bytes).digest('hex')}"`);
		const again = await fetch(new URL(`/api/v1${path}`, baseUrl), {
			headers: { authorization: `Bearer ${token}`, 'if-none-match': etag }
		});
		expect(again.status).toBe(304);
		const part = await fetch(new URL(`/api/v1${path}`, baseUrl), {
			headers: { authorization: `Bearer ${token}`, range: 'bytes=100-199' }
		});
		expect(part.status).toBe(206);
		expect(part.headers.get('content-range')).toBe(`bytes 100-199/${bytes.length}`);
		expect(new Uint8Array(await part.arrayBuffer())).toEqual(bytes.slice(100, 200));
		expect((await outsider.get(`/api/v1${path}`)).status).toBe(404);
	});
});

describe('the upload form', () => {
	it('takes an empty letter field as "the next letter"', async () => {
		const number = newNumber();
		await drafter.api('POST', '/teams/kestrel/drawings', drawing(number));
		const response = await upload(
			`/teams/kestrel/drawings/${number}/revisions`,
			await twoSheetPdf(number),
			{
				letter: '',
				reason: ''
			}
		);
		expect(response.status).toBe(201);
		expect((await response.json()).letter).toBe('A');
	});
});
