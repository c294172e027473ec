import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Client } from './client';
import { actors, draftRevision, roleClients, type Actor } from './revisions';

let clients: Awaited<ReturnType<typeof roleClients>>['clients'];
let outsiderTeam = '';

const bore = { kind: 'bore', label: 'Bushing bore', callout: 'Ø12 H7' };
const journal = { kind: 'shaft', label: 'Journal', callout: 'Ø12 g6' };

/** The bore on an ISO 8015 bushing drawing and the journal on an ASME Y14.5 shaft drawing. */
async function twoDrawings() {
	const bushing = await draftRevision(clients.drafter, 'kestrel');
	const shaft = await draftRevision(clients.drafter, 'kestrel', {
		title: 'Shaft',
		standard: 'asme-y14.5-2018',
		generalTolerance: null
	});
	const hole = await (await clients.drafter.api('POST', `${bushing.path}/features`, bore)).json();
	const pin = await (await clients.drafter.api('POST', `${shaft.path}/features`, journal)).json();
	return { bushing, shaft, hole, pin };
}

/** A CSV answer: UTF-8 with a byte order mark (fetch's text() drops it, so read the bytes). */
async function table(response: Response) {
	const bytes = new Uint8Array(await response.arrayBuffer());
	expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
	return Papa.parse<Record<string, string>>(new TextDecoder().decode(bytes), {
		header: true,
		skipEmptyLines: true
	}).data;
}

beforeAll(async () => {
	({ clients, outsiderTeam } = await roleClients());
});

describe('who may create, read, edit and delete fits on a draft revision', () => {
	const expected: Record<Actor, [create: number, read: number, edit: number, remove: number]> = {
		signedOut: [401, 401, 401, 401],
		admin: [201, 200, 200, 204],
		drafter: [201, 200, 200, 204],
		checker: [201, 200, 200, 204],
		quality: [403, 404, 403, 403],
		outsider: [404, 404, 404, 404]
	};
	for (const actor of actors) {
		it(actor, async () => {
			const { bushing, hole, pin } = await twoDrawings();
			const body = { holeFeatureId: hole.id, shaftFeatureId: pin.id, intent: 'running' };
			const own = await clients.drafter.api('POST', `${bushing.path}/fits`, body);
			expect(own.status).toBe(201);
			const { id } = await own.json();
			const client = clients[actor];
			const seen = [
				(await client.api('POST', `${bushing.path}/fits`, body)).status,
				(await client.api('GET', `${bushing.path}/fits/${id}`)).status,
				(
					await client.api('PATCH', `${bushing.path}/fits/${id}`, {
						version: 1,
						requiredMinClearance: '0.002'
					})
				).status,
				(await client.api('DELETE', `${bushing.path}/fits/${id}?version=2`)).status
			];
			expect(seen).toEqual(expected[actor]);
		});
	}
});

describe('fits through the API', () => {
	it('compute a fit across two drawings, each member under its own standard', async () => {
		const { bushing, shaft, hole, pin } = await twoDrawings();
		const created = await clients.checker.api('POST', `${bushing.path}/fits`, {
			holeFeatureId: hole.id,
			shaftFeatureId: pin.id,
			intent: 'running'
		});
		expect(created.status).toBe(201);
		const fit = await created.json();
		// ISO 286-2:2010: H7 over 10 to 18 mm is 0/+0.018, g6 is -0.006/-0.017.
		expect(fit).toMatchObject({
			minClearance: '0.006',
			maxClearance: '0.035',
			classification: 'clearance',
			owned: true,
			version: 1,
			hole: { upper: '12.018', lower: '12.000' },
			shaft: { upper: '11.994', lower: '11.983' }
		});
		// The fit diagram: our own SVG with both zones' limits written on it.
		expect(fit.diagramSvg).toMatch(/^<svg [^>]*role="img"/);
		expect(fit.diagramSvg).toContain('12.018');
		expect(fit.diagramSvg).not.toContain('<script');
		// ISO 8015 on the bushing: no envelope; ASME Y14.5 on the shaft drawing: Rule #1.
		expect(fit.hole.envelope.applies).toBe(false);
		expect(fit.shaft.envelope.applies).toBe(true);

		const onShaft = await (await clients.drafter.api('GET', `${shaft.path}/fits`)).json();
		expect(onShaft).toHaveLength(1);
		expect(onShaft[0]).toMatchObject({ id: fit.id, owned: false, minClearance: '0.006' });
		const elsewhere = await clients.drafter.api('PATCH', `${shaft.path}/fits/${fit.id}`, {
			version: 1,
			sharedDatumFrame: true
		});
		expect(elsewhere.status).toBe(409);
		expect((await elsewhere.json()).error).toMatchObject({ code: 'not_owner' });

		const inUse = await clients.drafter.api('DELETE', `${shaft.path}/features/${pin.id}?version=1`);
		expect(inUse.status).toBe(409);
		expect((await inUse.json()).error).toMatchObject({ code: 'in_use', fits: [fit.id] });

		const stale = await clients.drafter.api('DELETE', `${bushing.path}/fits/${fit.id}?version=7`);
		expect(stale.status).toBe(409);
		expect((await stale.json()).error).toMatchObject({ code: 'stale', current: { id: fit.id } });

		// fits.csv carries the API's values.
		const csv = await clients.drafter.send('GET', `${bushing.path}/export/fits.csv`);
		expect(csv.headers.get('content-type')).toContain('text/csv');
		const [row] = await table(csv);
		expect(row).toMatchObject({
			id: fit.id,
			minClearance: '0.006',
			maxClearance: '0.035',
			classification: 'clearance',
			verdict: fit.verdict,
			intent: 'running'
		});
	});

	it("answer 404 for another team's fit and refuse another team's feature as the shaft", async () => {
		const { bushing, hole, pin } = await twoDrawings();
		const theirs = await draftRevision(clients.outsider, outsiderTeam);
		const theirPin = await (
			await clients.outsider.api('POST', `${theirs.path}/features`, journal)
		).json();
		const refused = await clients.drafter.api('POST', `${bushing.path}/fits`, {
			holeFeatureId: hole.id,
			shaftFeatureId: theirPin.id
		});
		expect(refused.status).toBe(400);
		const fit = await (
			await clients.drafter.api('POST', `${bushing.path}/fits`, {
				holeFeatureId: hole.id,
				shaftFeatureId: pin.id
			})
		).json();
		expect((await clients.outsider.api('GET', `${theirs.path}/fits/${fit.id}`)).status).toBe(404);
	});
});

describe('finding a feature to pair with across the team', () => {
	it('matches every word against number, label, callout or balloon, holes or shafts only', async () => {
		const { bushing, shaft, hole, pin } = await twoDrawings();
		const find = async (client: Client, query: string) => {
			const response = await client.api('GET', `/teams/kestrel/features?${query}`);
			return { status: response.status, body: await response.json() };
		};
		const byWords = await find(clients.checker, `q=${encodeURIComponent(`${shaft.number} journ`)}`);
		expect(byWords.status).toBe(200);
		expect(byWords.body).toEqual([
			{
				featureId: pin.id,
				drawing: shaft.number,
				title: 'Shaft',
				letter: 'A',
				state: 'draft',
				balloon: 1,
				label: 'Journal',
				kind: 'shaft',
				internal: false,
				callout: 'Ø12 g6',
				quantity: 1
			}
		]);
		const byBalloon = await find(clients.drafter, `q=${bushing.number}+%231`);
		expect(byBalloon.body.map((f: { featureId: string }) => f.featureId)).toEqual([hole.id]);
		const shaftsOnly = await find(clients.drafter, `q=${bushing.number}&internal=false`);
		expect(shaftsOnly.body).toEqual([]);
		// A LIKE wildcard is a character to look for, not "anything".
		expect((await find(clients.drafter, `q=${bushing.number}%25`)).body).toEqual([]);
		// Supplier quality finds released revisions only; these are drafts.
		expect((await find(clients.quality, `q=${shaft.number}`)).body).toEqual([]);
		expect((await find(clients.outsider, `q=${shaft.number}`)).status).toBe(404);
		expect((await find(clients.signedOut, `q=${shaft.number}`)).status).toBe(401);
		const empty = await find(clients.drafter, 'q=');
		expect(empty.status).toBe(400);
		expect(empty.body.error.code).toBe('invalid');
		expect((await find(clients.drafter, 'q=x&limit=500')).status).toBe(400);
	});
});

describe('features CSV', () => {
	const header = 'label,kind,internal,callout,quantity,notes';

	it('imports nothing when one row is bad, and names its line', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const text = [
			header,
			'Bore,bore,,Ø12 H7,1,',
			'Pin,pin,false,Ø12 g6x,1,',
			'Slot,slot,,8 H9,2,'
		].join('\r\n');
		const refused = await clients.drafter.send('POST', `${path}/features/import`, text, 'text/csv');
		expect(refused.status).toBe(422);
		const { error } = await refused.json();
		expect(error.code).toBe('invalid_rows');
		expect(error.rows).toHaveLength(1);
		expect(error.rows[0].line).toBe(3);
		expect(error.rows[0].reason).toContain('callout');
		expect(await (await clients.drafter.api('GET', `${path}/features`)).json()).toEqual([]);

		const missing = await clients.drafter.send(
			'POST',
			`${path}/features/import`,
			'label,kind\nBore,bore',
			'text/csv'
		);
		expect(missing.status).toBe(422);
		expect((await missing.json()).error.rows).toEqual([
			{ line: 1, reason: 'the header lacks internal, callout, quantity' }
		]);
	});

	it('imports a multipart file, unplaced, and exports the API values with formulas neutralised', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const text = [
			header,
			'Bore,bore,,Ø12 H7,1,pressed',
			'"=HYPERLINK(""http://example.test"",""x"")",pin,false,Ø12 g6,4,'
		].join('\n');
		const form = new FormData();
		form.set('file', new Blob([text], { type: 'text/csv' }), 'features.csv');
		const imported = await clients.checker.send('POST', `${path}/features/import`, form);
		expect(imported.status).toBe(201);
		const created = await imported.json();
		expect(created.map((f: { balloon: number }) => f.balloon)).toEqual([1, 2]);
		expect(created.every((f: { location: unknown }) => f.location === null)).toBe(true);

		const api = await (await clients.drafter.api('GET', `${path}/features`)).json();
		const rows = await table(await clients.drafter.send('GET', `${path}/export/features.csv`));
		expect(rows).toHaveLength(2);
		expect(rows[0]).toMatchObject({
			id: api[0].id,
			label: 'Bore',
			callout: 'Ø12 H7',
			upper: api[0].upper,
			lower: api[0].lower,
			mmc: api[0].mmc,
			lmc: api[0].lmc,
			quantity: '1',
			placed: 'false',
			notes: 'pressed'
		});
		expect(rows[1].label).toBe(`'=HYPERLINK("http://example.test","x")`);
		expect(rows[1].quantity).toBe('4');
		expect(rows[1].lower).toBe(api[1].lower);

		// Supplier quality exports released revisions only: a draft is not found for them.
		expect((await clients.quality.send('GET', `${path}/export/features.csv`)).status).toBe(404);
	});
});
