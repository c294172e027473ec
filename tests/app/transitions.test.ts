import { beforeAll, describe, expect, it } from 'vitest';
import type { Client } from './client';
import { actors, draftRevision, roleClients, type Actor } from './revisions';

let clients: Awaited<ReturnType<typeof roleClients>>['clients'];

const bore = {
	kind: 'hole',
	label: 'Bore',
	callout: 'Ø12 H7',
	location: { sheet: 1, x: 0.5, y: 0.4 }
};
const pin = {
	kind: 'pin',
	label: 'Pin',
	callout: 'Ø12 g6',
	location: { sheet: 1, x: 0.3, y: 0.4 }
};

beforeAll(async () => {
	({ clients } = await roleClients());
});

async function move(client: Client, path: string, to: string, message = '') {
	return client.api('POST', `${path}/transitions`, { to, message });
}

async function errorOf(response: Response) {
	return (await response.json()).error as Record<string, unknown>;
}

describe('POST …/transitions', () => {
	// A drafter's draft: supplier quality and other teams do not see it (404), nobody signed
	// out may ask (401); the drafter submits, and only a checker or admin approves.
	const expected: Record<Actor, [submit: number, history: number]> = {
		signedOut: [401, 401],
		admin: [201, 200],
		drafter: [201, 200],
		checker: [403, 200],
		quality: [404, 404],
		outsider: [404, 404]
	};
	for (const actor of actors) {
		it(`submit and read the history: ${actor}`, async () => {
			const { path } = await draftRevision(clients.drafter, 'kestrel');
			const submitted = await move(clients[actor], path, 'in-check');
			const history = await clients[actor].api('GET', `${path}/transitions`);
			expect([submitted.status, history.status]).toEqual(expected[actor]);
		});
	}

	it('runs the loop with messages, refuses what the machine lacks, and keeps the history', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const drafterId = (await (await clients.drafter.api('GET', '/me')).json()).id;
		const checkerId = (await (await clients.checker.api('GET', '/me')).json()).id;

		const early = await move(clients.checker, path, 'approved');
		expect(early.status).toBe(409);
		expect(await errorOf(early)).toMatchObject({ code: 'invalid_transition' });

		const submitted = await move(clients.drafter, path, 'in-check', 'Ready for check');
		expect(submitted.status).toBe(201);
		expect(await submitted.json()).toMatchObject({
			from: 'draft',
			to: 'in-check',
			name: 'submit',
			by: drafterId,
			message: 'Ready for check',
			revision: { state: 'in-check' }
		});

		const silent = await move(clients.checker, path, 'returned');
		expect(silent.status).toBe(400);
		expect(await errorOf(silent)).toMatchObject({ code: 'invalid', field: 'message' });
		const bad = await clients.checker.api('POST', `${path}/transitions`, { to: 'shipped' });
		expect(bad.status).toBe(400);
		expect(await errorOf(bad)).toMatchObject({
			code: 'invalid',
			fields: { to: [expect.any(String)] }
		});

		expect((await move(clients.checker, path, 'returned', 'Bore needs a chamfer')).status).toBe(
			201
		);
		expect((await move(clients.drafter, path, 'in-check')).status).toBe(201);
		// The drafter submitted it: the drafter may not approve (nor may the role), the checker may.
		expect((await move(clients.drafter, path, 'approved')).status).toBe(403);
		const approved = await move(clients.checker, path, 'approved');
		expect(approved.status).toBe(201);
		const released = await move(clients.checker, path, 'released');
		expect(released.status).toBe(201);
		const revision = await (await clients.quality.api('GET', path)).json();
		expect(revision).toMatchObject({
			state: 'released',
			approvedBy: checkerId,
			releasedBy: checkerId
		});
		expect(Date.parse(revision.releasedAt)).toBeGreaterThanOrEqual(Date.parse(revision.approvedAt));

		const history = await (await clients.quality.api('GET', `${path}/transitions`)).json();
		expect(history.map((t: { name: string }) => t.name)).toEqual([
			'submit',
			'return',
			'resubmit',
			'approve',
			'release'
		]);
		expect(history[1]).toMatchObject({
			message: 'Bore needs a chamfer',
			by: checkerId,
			byName: expect.any(String)
		});
		const superseding = await move(clients.checker, path, 'superseded');
		expect(superseding.status).toBe(409);
		expect(await errorOf(superseding)).toMatchObject({ code: 'invalid_transition' });
		const quality = await move(clients.quality, path, 'superseded');
		expect(quality.status).toBe(403);
	});

	it('refuses an approval with an open critical finding (409 open_findings), passes once resolved', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const raised = await clients.checker.api('POST', `${path}/findings`, {
			text: 'The bore has no tolerance',
			severity: 'critical',
			assigneeId: (await (await clients.drafter.api('GET', '/me')).json()).id
		});
		const finding = await raised.json();
		expect((await move(clients.drafter, path, 'in-check')).status).toBe(201);
		const refused = await move(clients.checker, path, 'approved');
		expect(refused.status).toBe(409);
		expect(await errorOf(refused)).toMatchObject({
			code: 'open_findings',
			findings: [{ id: finding.id, number: finding.number, severity: 'critical', state: 'raised' }]
		});
		const answered = await clients.drafter.api('PATCH', `${path}/findings/${finding.id}`, {
			state: 'answered',
			message: 'Toleranced H7',
			version: finding.version
		});
		expect(answered.status).toBe(200);
		const resolved = await clients.checker.api('PATCH', `${path}/findings/${finding.id}`, {
			state: 'resolved',
			version: (await answered.json()).version
		});
		expect(resolved.status).toBe(200);
		expect((await move(clients.checker, path, 'approved')).status).toBe(201);
	});
});

describe('an approved revision is frozen on every write route', () => {
	it('features, fits, findings, comments and settings answer 409 frozen; a released one takes comments', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const d = clients.drafter;
		const hole = await (await d.api('POST', `${path}/features`, bore)).json();
		const shaft = await (await d.api('POST', `${path}/features`, pin)).json();
		const fit = await (
			await d.api('POST', `${path}/fits`, {
				holeFeatureId: hole.id,
				shaftFeatureId: shaft.id,
				intent: 'running'
			})
		).json();
		const finding = await (
			await clients.checker.api('POST', `${path}/findings`, { text: 'Chamfer', severity: 'minor' })
		).json();
		const comment = await (
			await clients.checker.api('POST', `${path}/findings/${finding.id}/comments`, { body: 'See' })
		).json();
		const revision = await (await d.api('GET', path)).json();
		expect((await move(d, path, 'in-check')).status).toBe(201);
		// The pair has no envelope requirement under ISO 8015: the rulebook's majors are waived
		// by the checker, as the approval gate asks (PRODUCT.md §3).
		const rule = await (await clients.checker.api('GET', `${path}/findings?kind=rule`)).json();
		for (const f of rule as { id: string; version: number; severity: string; state: string }[]) {
			if (!['critical', 'major'].includes(f.severity) || !['raised', 'answered'].includes(f.state))
				continue;
			const waived = await clients.checker.api('PATCH', `${path}/findings/${f.id}`, {
				version: f.version,
				waiver: { reason: 'Accepted for this test' }
			});
			expect(waived.status).toBe(200);
		}
		expect((await move(clients.checker, path, 'approved')).status).toBe(201);

		const c = clients.checker;
		const writes: [string, () => Promise<Response>][] = [
			['add a feature', () => d.api('POST', `${path}/features`, bore)],
			[
				'edit a feature',
				() => d.api('PATCH', `${path}/features/${hole.id}`, { version: hole.version, label: 'x' })
			],
			[
				'delete a feature',
				() => d.api('DELETE', `${path}/features/${shaft.id}?version=${shaft.version}`)
			],
			[
				'import features',
				() =>
					d.send(
						'POST',
						`${path}/features/import`,
						'label,kind,internal,callout,quantity,notes\nBore,bore,,Ø8 H7,1,',
						'text/csv'
					)
			],
			[
				'add a fit',
				() =>
					d.api('POST', `${path}/fits`, {
						holeFeatureId: hole.id,
						shaftFeatureId: shaft.id,
						intent: 'running'
					})
			],
			[
				'edit a fit',
				() =>
					d.api('PATCH', `${path}/fits/${fit.id}`, {
						version: fit.version,
						intent: 'locational-clearance'
					})
			],
			['delete a fit', () => d.api('DELETE', `${path}/fits/${fit.id}?version=${fit.version}`)],
			[
				'raise a finding',
				() => c.api('POST', `${path}/findings`, { text: 'Late', severity: 'minor' })
			],
			[
				'edit a finding',
				() =>
					c.api('PATCH', `${path}/findings/${finding.id}`, { version: finding.version, text: 'x' })
			],
			[
				'move a finding',
				() =>
					c.api('PATCH', `${path}/findings/${finding.id}`, {
						version: finding.version,
						state: 'withdrawn',
						message: 'x'
					})
			],
			[
				'comment on a finding',
				() => c.api('POST', `${path}/findings/${finding.id}/comments`, { body: 'Late' })
			],
			[
				'edit a comment',
				() => c.api('PATCH', `${path}/findings/${finding.id}/comments/${comment.id}`, { body: 'x' })
			],
			[
				'comment on a feature',
				() => c.api('POST', `${path}/features/${hole.id}/comments`, { body: 'Late' })
			],
			[
				'change the settings',
				() => d.api('PATCH', path, { version: revision.version + 2, settings: { units: 'in' } })
			]
		];
		for (const [what, write] of writes) {
			const response = await write();
			expect([what, response.status]).toEqual([what, 409]);
			expect([what, (await errorOf(response)).code]).toEqual([what, 'frozen']);
		}

		expect((await move(clients.checker, path, 'released')).status).toBe(201);
		// The release packet's conversation: supplier quality and the team comment on it.
		const asked = await clients.quality.api('POST', `${path}/features/${hole.id}/comments`, {
			body: 'Is the bore reamed?'
		});
		expect(asked.status).toBe(201);
		expect(
			(await d.api('POST', `${path}/features/${hole.id}/comments`, { body: 'Yes' })).status
		).toBe(201);
		expect((await d.api('POST', `${path}/features`, bore)).status).toBe(409);
	});
});
