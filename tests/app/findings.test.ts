import { beforeAll, describe, expect, it } from 'vitest';
import { actors, draftRevision, roleClients, type Actor } from './revisions';

let clients: Awaited<ReturnType<typeof roleClients>>['clients'];
let outsiderTeam = '';
const ids = {} as Record<'drafter' | 'checker' | 'quality', string>;

const finding = {
	text: 'The keyway depth is missing',
	severity: 'major',
	location: { sheet: 1, x: 0.2, y: 0.3, w: 0.1, h: 0.05 }
};

beforeAll(async () => {
	({ clients, outsiderTeam } = await roleClients());
	for (const role of ['drafter', 'checker', 'quality'] as const) {
		ids[role] = (await (await clients[role].api('GET', '/me')).json()).id;
	}
});

describe('who may raise, read and comment on findings of a draft revision', () => {
	// Supplier quality may not raise findings (403 before anything is looked up) and reads and
	// comments on released revisions only: a draft is not found for them.
	const expected: Record<
		Actor,
		[raise: number, read: number, comment: number, editOwn: number, move: number]
	> = {
		signedOut: [401, 401, 401, 401, 401],
		admin: [201, 200, 201, 200, 200],
		drafter: [201, 200, 201, 200, 403],
		checker: [201, 200, 201, 200, 200],
		quality: [403, 404, 404, 404, 404],
		outsider: [404, 404, 404, 404, 404]
	};
	for (const actor of actors) {
		it(actor, async () => {
			const { path } = await draftRevision(clients.drafter, 'kestrel');
			const own = await clients.checker.api('POST', `${path}/findings`, finding);
			expect(own.status).toBe(201);
			const { id } = await own.json();
			const client = clients[actor];
			const comment = await client.api('POST', `${path}/findings/${id}/comments`, {
				body: `From ${actor}`
			});
			const commentId = comment.ok
				? (await comment.json()).id
				: '00000000-0000-4000-8000-0000000000c0';
			const seen = [
				(await client.api('POST', `${path}/findings`, { ...finding, text: actor })).status,
				(await client.api('GET', `${path}/findings/${id}`)).status,
				comment.status,
				(
					await client.api('PATCH', `${path}/findings/${id}/comments/${commentId}`, {
						body: 'Edited'
					})
				).status,
				(
					await client.api('PATCH', `${path}/findings/${id}`, {
						state: 'withdrawn',
						message: 'Raised twice',
						version: 1
					})
				).status
			];
			expect(seen).toEqual(expected[actor]);
			const list = await (await clients.drafter.api('GET', `${path}/findings`)).json();
			const raised = expected[actor][0] === 201;
			expect(list.map((f: { text: string }) => f.text)).toEqual(
				raised ? [finding.text, actor] : [finding.text]
			);
		});
	}
});

describe('findings through the API', () => {
	it('go raised → answered → resolved → verified, each move kept with who, when and why', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const raised = await clients.checker.api('POST', `${path}/findings`, {
			...finding,
			assigneeId: ids.drafter
		});
		const body = await raised.json();
		expect(body).toMatchObject({
			number: 1,
			kind: 'manual',
			rule: null,
			state: 'raised',
			severity: 'major',
			assigneeId: ids.drafter,
			raisedBy: ids.checker,
			location: finding.location,
			waiver: null,
			version: 1,
			history: []
		});
		const at = `${path}/findings/${body.id}`;
		const move = (client: Actor, state: string, version: number, message = '') =>
			clients[client].api('PATCH', at, { state, message, version });
		expect((await move('checker', 'answered', 1)).status).toBe(403);
		expect((await move('drafter', 'resolved', 1)).status).toBe(403);
		const skipped = await move('checker', 'verified', 1);
		expect(skipped.status).toBe(409);
		expect((await skipped.json()).error).toMatchObject({
			code: 'invalid_transition',
			current: { state: 'raised', version: 1 }
		});
		expect((await move('drafter', 'answered', 1, 'Depth added')).status).toBe(200);
		const stale = await move('checker', 'resolved', 1);
		expect(stale.status).toBe(409);
		expect((await stale.json()).error).toMatchObject({ code: 'stale', current: { version: 2 } });
		expect((await move('checker', 'resolved', 2)).status).toBe(200);
		const noReason = await move('checker', 'raised', 3);
		expect(noReason.status).toBe(400);
		expect((await noReason.json()).error).toMatchObject({ code: 'invalid', field: 'message' });
		const verified = await move('checker', 'verified', 3, 'Checked on the sheet');
		expect(verified.status).toBe(200);
		const done = await verified.json();
		expect(done.history.map((m: { to: string; by: string }) => [m.to, m.by])).toEqual([
			['answered', ids.drafter],
			['resolved', ids.checker],
			['verified', ids.checker]
		]);
		const open = await (await clients.drafter.api('GET', `${path}/findings?state=open`)).json();
		expect(open).toEqual([]);
		const closed = await (
			await clients.drafter.api(
				'GET',
				`${path}/findings?state=verified&severity=major&kind=manual&assigneeId=${ids.drafter}`
			)
		).json();
		expect(closed.map((f: { id: string }) => f.id)).toEqual([body.id]);
		const bad = await clients.drafter.api('GET', `${path}/findings?severity=huge`);
		expect(bad.status).toBe(400);
	});

	it('refuse bad input with a clear message and store nothing', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const cases: [Record<string, unknown>, string][] = [
			[{ text: '' }, 'text'],
			[{ assigneeId: '00000000-0000-4000-8000-000000000000' }, 'assigneeId'],
			[{ assigneeId: ids.quality }, 'assigneeId'],
			[{ location: { sheet: 9, x: 0.5, y: 0.5 } }, 'location']
		];
		for (const [change, field] of cases) {
			const refused = await clients.checker.api('POST', `${path}/findings`, {
				...finding,
				...change
			});
			expect(refused.status).toBe(400);
			const { error } = await refused.json();
			expect(error.code).toBe('invalid');
			expect(error.message).toMatch(new RegExp(`^${field}: `));
		}
		expect(await (await clients.drafter.api('GET', `${path}/findings`)).json()).toEqual([]);
	});

	it("answer 404 for another team's finding and its comments, whichever path they are asked through", async () => {
		const ours = await draftRevision(clients.drafter, 'kestrel');
		const theirs = await draftRevision(clients.outsider, outsiderTeam);
		const theirFinding = await (
			await clients.outsider.api('POST', `${theirs.path}/findings`, finding)
		).json();
		const theirComment = await (
			await clients.outsider.api('POST', `${theirs.path}/findings/${theirFinding.id}/comments`, {
				body: 'Ours'
			})
		).json();
		const through = `${ours.path}/findings/${theirFinding.id}`;
		expect((await clients.checker.api('GET', through)).status).toBe(404);
		expect((await clients.checker.api('GET', `${through}/comments`)).status).toBe(404);
		expect(
			(await clients.checker.api('POST', `${through}/comments`, { body: 'Hello' })).status
		).toBe(404);
		expect(
			(
				await clients.checker.api('PATCH', `${through}/comments/${theirComment.id}`, {
					body: 'Hello'
				})
			).status
		).toBe(404);
		expect(
			(await clients.checker.api('GET', `${theirs.path}/findings/${theirFinding.id}/comments`))
				.status
		).toBe(404);
		const thread = await (
			await clients.outsider.api('GET', `${theirs.path}/findings/${theirFinding.id}/comments`)
		).json();
		expect(thread.map((c: { body: string }) => c.body)).toEqual(['Ours']);
	});

	it('keep threads on features too, with mentions of members only and your own comments editable', async () => {
		const { path } = await draftRevision(clients.drafter, 'kestrel');
		const feature = await (
			await clients.drafter.api('POST', `${path}/features`, { kind: 'hole', callout: 'Ø12 H7' })
		).json();
		const thread = `${path}/features/${feature.id}/comments`;
		const posted = await clients.checker.api('POST', thread, {
			body: '@tomas is this the **datum**? <img src=x onerror="alert(1)">'
		});
		expect(posted.status).toBe(201);
		const comment = await posted.json();
		expect(comment).toMatchObject({ authorId: ids.checker, editedAt: null });
		expect(comment.html).toContain(`data-user-id="${ids.drafter}"`);
		expect(comment.html).toContain('<strong>datum</strong>');
		expect(comment.html).not.toMatch(/<img|<[^>]*\sonerror=/i);
		const byOther = await clients.drafter.api('PATCH', `${thread}/${comment.id}`, { body: 'x' });
		expect(byOther.status).toBe(403);
		const edited = await clients.checker.api('PATCH', `${thread}/${comment.id}`, {
			body: 'Is this the datum?'
		});
		expect(edited.status).toBe(200);
		expect((await edited.json()).editedAt).not.toBeNull();
		const list = await (await clients.quality.api('GET', thread)).json();
		expect(list.error?.code).toBe('not_found');
	});
});
