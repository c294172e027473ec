import { beforeAll, describe, expect, it } from 'vitest';
import { linkIn, unique, waitForMail } from '../shared';
import { bearerCall, Client, newVerifiedUser } from './client';

type Actor =
	'signedOut' | 'admin' | 'drafter' | 'checker' | 'quality' | 'outsider' | 'token' | 'revokedToken';
const actors: Actor[] = [
	'signedOut',
	'admin',
	'drafter',
	'checker',
	'quality',
	'outsider',
	'token',
	'revokedToken'
];

const clients = {} as Record<Actor, Client>;
let validToken = '';
let revokedToken = '';
let drafterId = '';

async function call(actor: Actor, method: string, path: string, body?: unknown) {
	if (actor === 'token') return bearerCall(validToken, method, path, body);
	if (actor === 'revokedToken') return bearerCall(revokedToken, method, path, body);
	return clients[actor].api(method, path, body);
}

beforeAll(async () => {
	for (const actor of actors) clients[actor] = new Client();
	for (const role of ['admin', 'drafter', 'checker', 'quality'] as const) {
		await clients[role].signIn(`${role}@example.test`);
	}
	await newVerifiedUser(clients.outsider, 'Olu Elsewhere');
	const team = await clients.outsider.api('POST', '/teams', {
		name: 'Elsewhere Pumps',
		slug: `elsewhere-${unique()}`
	});
	expect(team.status).toBe(201);

	const made = await (await clients.admin.api('POST', '/me/tokens', { name: 'CI export' })).json();
	validToken = made.token;
	const toRevoke = await (
		await clients.admin.api('POST', '/me/tokens', { name: 'old laptop', expiresInDays: 7 })
	).json();
	revokedToken = toRevoke.token;
	expect((await clients.admin.api('DELETE', `/me/tokens/${toRevoke.id}`)).status).toBe(204);

	const members = (await (await clients.admin.api('GET', '/teams/kestrel/members')).json()) as {
		userId: string;
		email: string;
	}[];
	drafterId = members.find((m) => m.email === 'drafter@example.test')!.userId;
});

const nobody = '00000000-0000-4000-8000-000000000000';
type Row = [
	method: string,
	path: () => string,
	body: (() => unknown) | null,
	expect: Record<Actor, number>
];
const expected = (
	signedOut: number,
	admin: number,
	drafter: number,
	checker: number,
	quality: number,
	outsider: number,
	token: number,
	revokedToken: number
) => ({ signedOut, admin, drafter, checker, quality, outsider, token, revokedToken });

// PRODUCT.md §2: roles are capabilities; other teams' objects are 404; signed-out API calls 401.
const table: Row[] = [
	['GET', () => '/me', null, expected(401, 200, 200, 200, 200, 200, 200, 401)],
	['GET', () => '/teams', null, expected(401, 200, 200, 200, 200, 200, 200, 401)],
	[
		'POST',
		() => '/teams',
		() => ({ name: 'Scratch team', slug: `scratch-${unique()}` }),
		expected(401, 201, 201, 201, 201, 201, 201, 401)
	],
	['GET', () => '/teams/kestrel/members', null, expected(401, 200, 200, 200, 200, 404, 200, 401)],
	[
		'POST',
		() => '/teams/kestrel/members',
		() => ({ email: `new-${unique()}@example.test`, role: 'checker' }),
		expected(401, 202, 403, 403, 403, 404, 202, 401)
	],
	[
		'PATCH',
		() => `/teams/kestrel/members/${drafterId}`,
		() => ({ role: 'drafter' }),
		expected(401, 200, 403, 403, 403, 404, 200, 401)
	],
	[
		'DELETE',
		() => `/teams/kestrel/members/${nobody}`,
		null,
		expected(401, 404, 403, 403, 403, 404, 404, 401)
	],
	[
		'GET',
		() => '/teams/kestrel/invitations',
		null,
		expected(401, 200, 403, 403, 403, 404, 200, 401)
	],
	[
		'POST',
		() => '/teams/kestrel/invitations',
		() => ({ email: `inv-${unique()}@example.test`, role: 'quality' }),
		expected(401, 201, 403, 403, 403, 404, 201, 401)
	],
	[
		'DELETE',
		() => `/teams/kestrel/invitations/${nobody}`,
		null,
		expected(401, 404, 403, 403, 403, 404, 404, 401)
	],
	[
		'POST',
		() => `/teams/kestrel/invitations/${nobody}/approval`,
		null,
		expected(401, 404, 403, 403, 403, 404, 404, 401)
	],
	['GET', () => '/teams/kestrel/activity', null, expected(401, 200, 200, 200, 403, 404, 200, 401)],
	['GET', () => '/teams/nowhere/activity', null, expected(401, 404, 404, 404, 404, 404, 404, 401)],
	['GET', () => '/me/tokens', null, expected(401, 200, 200, 200, 200, 200, 200, 401)],
	[
		'POST',
		() => '/me/tokens',
		() => ({ name: 'table test' }),
		// A token may not create tokens (a leaked one must not outlive its own revocation).
		expected(401, 201, 201, 201, 201, 201, 403, 401)
	],
	['DELETE', () => `/me/tokens/${nobody}`, null, expected(401, 404, 404, 404, 404, 404, 404, 401)]
];

describe('who may call what', () => {
	for (const [method, path, body, statuses] of table) {
		it(`${method} ${path().replace(/[0-9a-f-]{36}/, '{id}')}`, async () => {
			const seen = {} as Record<Actor, number>;
			for (const actor of actors) {
				const response = await call(actor, method, path(), body?.());
				seen[actor] = response.status;
				if (response.status >= 400) {
					const error = (await response.json()) as { error: { code: string; message: string } };
					expect(error.error.code, `${actor}: error code`).toBeTypeOf('string');
					expect(error.error.message, `${actor}: error message`).toBeTypeOf('string');
				}
			}
			expect(seen).toEqual(statuses);
		});
	}
});

describe('team rules', () => {
	it('never removes or demotes the last admin', async () => {
		const me = await (await clients.outsider.api('GET', '/me')).json();
		const slug = `solo-${unique()}`;
		await clients.outsider.api('POST', '/teams', { name: 'Solo shop', slug });
		const demote = await clients.outsider.api('PATCH', `/teams/${slug}/members/${me.id}`, {
			role: 'checker'
		});
		expect(demote.status).toBe(409);
		expect((await demote.json()).error.code).toBe('last_admin');
		const remove = await clients.outsider.api('DELETE', `/teams/${slug}/members/${me.id}`);
		expect(remove.status).toBe(409);
	});

	it('invites an address with an account too (202, never a silent add); it joins on accepting', async () => {
		const slug = `roles-${unique()}`;
		await clients.outsider.api('POST', '/teams', { name: 'Roles shop', slug });
		const invited = await clients.outsider.api('POST', `/teams/${slug}/members`, {
			email: 'quality@example.test',
			role: 'quality'
		});
		expect(invited.status).toBe(202);
		expect(await invited.json()).toMatchObject({ email: 'quality@example.test', role: 'quality' });
		// Not a member before accepting: the team does not even show.
		expect((await clients.quality.api('GET', `/teams/${slug}/activity`)).status).toBe(404);
		const mail = await waitForMail('quality@example.test', /invited you to Roles shop/);
		const accepted = await clients.quality.submit(`${linkIn(mail, '/invitations/')}?/accept`, {});
		expect(accepted).toMatchObject({ type: 'redirect', location: `/teams/${slug}` });

		const members = (await (
			await clients.outsider.api('GET', `/teams/${slug}/members`)
		).json()) as {
			userId: string;
			email: string;
		}[];
		const member = members.find((m) => m.email === 'quality@example.test')!;
		expect((await clients.quality.api('GET', `/teams/${slug}/activity`)).status).toBe(403);
		await clients.outsider.api('PATCH', `/teams/${slug}/members/${member.userId}`, {
			role: 'checker'
		});
		// A role change holds at once.
		expect((await clients.quality.api('GET', `/teams/${slug}/activity`)).status).toBe(200);
	});

	it('accepts an invitation once: a new person signs up from the link and joins', async () => {
		const email = `joiner-${unique()}@example.test`;
		const invited = await clients.admin.api('POST', '/teams/kestrel/members', {
			email,
			role: 'checker'
		});
		expect(invited.status).toBe(202);
		const mail = await waitForMail(email, /invited you to Kestrel Fluidics/);
		const link = linkIn(mail, '/invitations/');
		const joiner = new Client();
		const joined = await joiner.submit(`${link}?/join`, {
			name: 'Jo Iner',
			password: 'a long enough phrase'
		});
		expect(joined).toMatchObject({ type: 'redirect', location: '/teams/kestrel' });
		const teams = await (await joiner.api('GET', '/teams')).json();
		expect(teams).toEqual([expect.objectContaining({ slug: 'kestrel', role: 'checker' })]);

		const again = await new Client().submit(`${link}?/join`, {
			name: 'Someone Else',
			password: 'another long phrase'
		});
		expect(again).toMatchObject({ type: 'failure', status: 410 });
	});

	it('an invitation accepted with an account of another address waits for an admin', async () => {
		const invitedAddress = `intended-${unique()}@example.test`;
		const invited = await clients.admin.api('POST', '/teams/kestrel/members', {
			email: invitedAddress,
			role: 'quality'
		});
		expect(invited.status).toBe(202);
		const { id } = await invited.json();
		const link = linkIn(await waitForMail(invitedAddress, /invited you to/), '/invitations/');

		// Someone else who got hold of the link, signed in with their own account.
		const other = new Client();
		const { email: otherAddress } = await newVerifiedUser(other, 'Link Forwarded');
		const asked = await other.submit(`${link}?/accept`, {});
		expect(asked).toMatchObject({ type: 'success' });
		expect(await (await other.get(link)).text()).toContain('has been asked to let you join');
		expect((await other.api('GET', '/teams/kestrel/members')).status).toBe(404);

		const open = (await (await clients.admin.api('GET', '/teams/kestrel/invitations')).json()) as {
			id: string;
			waitingFor: { email: string } | null;
		}[];
		expect(open.find((i) => i.id === id)?.waitingFor).toMatchObject({ email: otherAddress });
		const page = await (await clients.admin.get('/teams/kestrel/members')).text();
		expect(page).toContain(`${otherAddress} asks to accept it with that account`);
		expect(await clients.admin.submit('/teams/kestrel/members?/approve', { id })).toMatchObject({
			type: 'success'
		});
		expect((await other.api('GET', '/teams/kestrel/members')).status).toBe(200);
		// Approved once: the API finds nobody waiting any more.
		const twice = await clients.admin.api('POST', `/teams/kestrel/invitations/${id}/approval`);
		expect(twice.status).toBe(404);
		// Used: the link itself no longer lets anyone in.
		expect(
			await new Client().submit(`${link}?/join`, { name: 'Late', password: 'a long enough phrase' })
		).toMatchObject({ status: 410 });
	});

	it('an admin approves a waiting account through the API; others may not', async () => {
		const invitedAddress = `api-approval-${unique()}@example.test`;
		const invited = await clients.admin.api('POST', '/teams/kestrel/members', {
			email: invitedAddress,
			role: 'checker'
		});
		const { id } = await invited.json();
		const link = linkIn(await waitForMail(invitedAddress, /invited you to/), '/invitations/');
		const path = `/teams/kestrel/invitations/${id}/approval`;
		// Nobody is waiting yet.
		expect((await clients.admin.api('POST', path)).status).toBe(404);
		const other = new Client();
		await newVerifiedUser(other, 'Waiting Person');
		expect(await other.submit(`${link}?/accept`, {})).toMatchObject({ type: 'success' });
		expect((await clients.checker.api('POST', path)).status).toBe(403);
		expect((await clients.admin.api('POST', path)).status).toBe(204);
		const teams = await (await other.api('GET', '/teams')).json();
		expect(teams).toEqual([expect.objectContaining({ slug: 'kestrel', role: 'checker' })]);
	});

	it('keeps cross-site protection for cookie sessions, not for Bearer clients', async () => {
		const response = await fetch(new URL('/teams?/create', (await import('./client')).baseUrl), {
			method: 'POST',
			headers: {
				cookie: [...clients.admin.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
				'content-type': 'application/x-www-form-urlencoded'
			},
			body: 'name=Sneaky&slug=sneaky'
		});
		expect(response.status).toBe(403);
		const form = new FormData();
		form.set('note', 'multipart from a script');
		const multipart = await fetch(new URL('/api/v1/teams', (await import('./client')).baseUrl), {
			method: 'POST',
			headers: { authorization: `Bearer ${validToken}` },
			body: form
		});
		// Past the origin check: the route itself answers that it wants JSON.
		expect(multipart.status).toBe(415);
		expect((await multipart.json()).error.code).toBe('unsupported_media_type');
	});

	it('records every change in the activity trail, newest first', async () => {
		const entries = (await (await clients.admin.api('GET', '/teams/kestrel/activity')).json()) as {
			entity: string;
			action: string;
			actorName: string;
		}[];
		expect(entries.length).toBeGreaterThan(3);
		expect(entries.map((e) => `${e.entity}:${e.action}`)).toContain('invitation:create');
		expect(entries.map((e) => `${e.entity}:${e.action}`)).toContain('membership:add');
	});
});
