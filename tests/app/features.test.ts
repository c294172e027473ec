import { beforeAll, describe, expect, it } from 'vitest';
import { actors, draftRevision, roleClients, type Actor } from './revisions';

let clients: Awaited<ReturnType<typeof roleClients>>['clients'];
let outsiderTeam = '';

const bore = {
	kind: 'hole',
	label: 'Bore',
	callout: 'Ø12 H7',
	location: { sheet: 1, x: 0.5, y: 0.4 }
};

beforeAll(async () => {
	({ clients, outsiderTeam } = await roleClients());
});

describe('who may create, edit and delete features on a draft revision', () => {
	// Supplier quality may not edit features (403, before anything is looked up) and reads
	// released revisions only: a draft is not found for them.
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
			const { path } = await draftRevision(clients.drafter, 'kestrel');
			const own = await clients.drafter.api('POST', `${path}/features`, bore);
			expect(own.status).toBe(201);
			const { id } = await own.json();
			const client = clients[actor];
			const seen = [
				(await client.api('POST', `${path}/features`, { ...bore, label: actor })).status,
				(await client.api('GET', `${path}/features/${id}`)).status,
				(await client.api('PATCH', `${path}/features/${id}`, { version: 1, label: 'edited' }))
					.status,
				(await client.api('DELETE', `${path}/features/${id}?version=2`)).status
			];
			expect(seen).toEqual(expected[actor]);
			const list = await (await clients.drafter.api('GET', `${path}/features`)).json();
			const writes = expected[actor][0] === 201;
			expect(list.map((f: { label: string }) => f.label)).toEqual(writes ? [actor] : ['Bore']);
		});
	}
});

describe('features through the API', () => {
	it('answer with the computed values, a new balloon each, and 409 stale with the current feature', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const created = await clients.checker.api('POST', `${path}/features`, bore);
		const feature = await created.json();
		// ISO 286-2:2010, table 2 (H, over 10 to 18 mm) with IT7 = 18 µm from table 1.
		expect(feature).toMatchObject({
			balloon: 1,
			internal: true,
			boughtOut: false,
			datumFeature: null,
			carried: null,
			quantity: 1,
			upper: '12.018',
			lower: '12.000',
			mmc: '12.000',
			lmc: '12.018',
			location: { sheet: 1, x: 0.5, y: 0.4 },
			version: 1,
			findings: expect.any(Array)
		});
		const second = await (await clients.drafter.api('POST', `${path}/features`, bore)).json();
		expect(second.balloon).toBe(2);

		const moved = await clients.drafter.api('PATCH', `${path}/features/${feature.id}`, {
			version: 1,
			location: { sheet: 2, x: 0.25, y: 0.75 }
		});
		expect(moved.status).toBe(200);
		const stale = await clients.checker.api('PATCH', `${path}/features/${feature.id}`, {
			version: 1,
			label: 'late'
		});
		expect(stale.status).toBe(409);
		const body = await stale.json();
		expect(body.error).toMatchObject({
			code: 'stale',
			current: { id: feature.id, version: 2, location: { sheet: 2, x: 0.25, y: 0.75 } }
		});
		const staleDelete = await clients.checker.api(
			'DELETE',
			`${path}/features/${feature.id}?version=1`
		);
		expect(staleDelete.status).toBe(409);
		expect((await clients.checker.api('DELETE', `${path}/features/${feature.id}`)).status).toBe(
			400
		);
	});

	it('refuse a bad callout with 400 and the position where it fails', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const bad = await clients.drafter.api('POST', `${path}/features`, {
			...bore,
			callout: 'Ø12 H7x'
		});
		expect(bad.status).toBe(400);
		const { error } = await bad.json();
		expect(error).toMatchObject({ code: 'invalid', field: 'callout' });
		expect(error.position).toBeTypeOf('number');
		expect(await (await clients.drafter.api('GET', `${path}/features`)).json()).toEqual([]);
	});

	it("answer 404 for another team's feature, whichever team's path it is asked through", async () => {
		const ours = await draftRevision(clients.drafter, 'kestrel');
		const theirs = await draftRevision(clients.outsider, outsiderTeam);
		const theirFeature = await (
			await clients.outsider.api('POST', `${theirs.path}/features`, bore)
		).json();
		const ourFeature = await (
			await clients.drafter.api('POST', `${ours.path}/features`, bore)
		).json();
		expect(
			(await clients.drafter.api('GET', `${ours.path}/features/${theirFeature.id}`)).status
		).toBe(404);
		expect(
			(
				await clients.drafter.api('PATCH', `${ours.path}/features/${theirFeature.id}`, {
					version: 1,
					label: 'x'
				})
			).status
		).toBe(404);
		expect(
			(await clients.outsider.api('GET', `${theirs.path}/features/${ourFeature.id}`)).status
		).toBe(404);
		expect((await clients.drafter.api('GET', `${ours.path}/features/not-a-uuid`)).status).toBe(404);
	});
});

describe('revision settings', () => {
	it("are the revision's own: editing the drawing's standard leaves them unchanged", async () => {
		const { number, path } = await draftRevision(clients.drafter, 'kestrel');
		const revision = await (await clients.drafter.api('GET', path)).json();
		expect(revision.settings).toEqual({
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm' }
		});
		const drawing = await (
			await clients.drafter.api('GET', `/teams/kestrel/drawings/${number}`)
		).json();
		const edited = await clients.drafter.api('PATCH', `/teams/kestrel/drawings/${number}`, {
			version: drawing.version,
			standard: 'asme-y14.5-2018'
		});
		expect(edited.status).toBe(200);
		expect((await (await clients.drafter.api('GET', path)).json()).settings.standard).toBe(
			'iso-8015'
		);
		const changed = await clients.drafter.api('PATCH', path, {
			version: revision.version,
			settings: { standard: 'asme-y14.5-2009' }
		});
		expect(changed.status).toBe(200);
		expect(await changed.json()).toMatchObject({
			settings: { units: 'mm', standard: 'asme-y14.5-2009' },
			version: revision.version + 1
		});
	});

	it("are edited on the board's settings form by an author only, checked and version-guarded", async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const revision = await (await clients.drafter.api('GET', path)).json();
		const form = {
			version: String(revision.version),
			units: 'mm',
			standard: 'asme-y14.5-2018',
			gtKind: 'iso2768',
			gtLinear: 'f'
		};
		// PRODUCT.md §2: the settings are the author's (admin, drafter); a checker may not.
		expect(await clients.checker.submit(`${path}?/settings`, form)).toMatchObject({
			type: 'error',
			error: { code: 'forbidden' }
		});
		expect(
			await clients.drafter.submit(`${path}?/settings`, { ...form, standard: 'no-such' })
		).toMatchObject({ type: 'failure', status: 400 });
		expect((await (await clients.drafter.api('GET', path)).json()).version).toBe(revision.version);

		expect(await clients.drafter.submit(`${path}?/settings`, form)).toMatchObject({
			type: 'success'
		});
		const saved = await (await clients.drafter.api('GET', path)).json();
		expect(saved.settings).toEqual({
			units: 'mm',
			standard: 'asme-y14.5-2018',
			generalTolerance: { kind: 'iso2768', linear: 'f', envelope: false }
		});
		// The same form again, its version now old: refused, the saved settings kept.
		expect(
			await clients.admin.submit(`${path}?/settings`, { ...form, standard: 'iso-8015' })
		).toMatchObject({ type: 'failure', status: 409 });
		expect((await (await clients.drafter.api('GET', path)).json()).settings.standard).toBe(
			'asme-y14.5-2018'
		);
	});
});
