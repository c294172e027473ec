import { describe, expect, it } from 'vitest';
import { caughtMail, linkIn, unique, waitForMail } from '../shared';
import { bearerCall, Client, newVerifiedUser } from './client';

const attackerPassword = 'attacker knows this one';
const ownerPassword = 'the owner chose this';

/** The `n`th message (oldest first) to `to` matching `subject`, waiting for it to arrive. */
async function nthMail(to: string, subject: RegExp, n: number) {
	const until = Date.now() + 15_000;
	while (Date.now() < until) {
		try {
			const found = caughtMail()
				.filter((m) => m.to.includes(to) && subject.test(m.subject))
				.reverse();
			if (found.length >= n) return found[n - 1];
		} catch {
			// the mail folder appears with the first message
		}
		await new Promise((done) => setTimeout(done, 200));
	}
	throw new Error(`no message ${n} to ${to} matching ${subject}`);
}

/** Someone signs up with another person's address and a password of their own. */
async function preRegister() {
	const email = `owner-${unique()}@example.test`;
	const attacker = new Client();
	await attacker.submit('/signup', { name: 'Not The Owner', email, password: attackerPassword });
	const first = await nthMail(email, /Confirm your e-mail/, 1);
	return { email, attacker, firstLink: linkIn(first, '/verify') };
}

describe('an address signed up by someone else first', () => {
	it('a second sign-up replaces the pending password and name; its link alone confirms', async () => {
		const { email, firstLink } = await preRegister();
		const owner = new Client();
		await owner.submit('/signup', { name: 'Rightful Owner', email, password: ownerPassword });
		const second = await nthMail(email, /Confirm your e-mail/, 2);
		// The first sign-up's link (in the owner's mailbox) no longer confirms anything.
		expect(await owner.confirmAddress(firstLink)).toMatchObject({ type: 'failure', status: 400 });
		expect(await owner.confirmAddress(linkIn(second, '/verify'))).toMatchObject({
			type: 'redirect',
			location: '/signin?verified=1'
		});

		expect(await new Client().signIn(email, attackerPassword)).toMatchObject({ status: 401 });
		expect(await owner.signIn(email, ownerPassword)).toMatchObject({ type: 'redirect' });
		expect(await (await owner.me()).json()).toMatchObject({ email, name: 'Rightful Owner' });
	});

	it('an e-mailed sign-in link proves the address and ends the password set before', async () => {
		const { email } = await preRegister();
		const owner = new Client();
		await owner.submit('/signin?/link', { email });
		const mail = await waitForMail(email, /sign-in link/);
		await owner.follow(linkIn(mail, '/auth/callback/nodemailer'));
		expect(await (await owner.me()).json()).toMatchObject({ email });
		expect(await new Client().signIn(email, attackerPassword)).toMatchObject({ status: 401 });
	});

	it('accepting an invitation from the link replaces the pending sign-up', async () => {
		const { email } = await preRegister();
		const admin = new Client();
		await admin.signIn('admin@example.test');
		const invited = await admin.api('POST', '/teams/kestrel/members', { email, role: 'checker' });
		expect(invited.status).toBe(202);
		const link = linkIn(await waitForMail(email, /invited you to/), '/invitations/');

		const owner = new Client();
		expect(await (await owner.get(link)).text()).not.toContain('You have an account');
		const joined = await owner.submit(`${link}?/join`, {
			name: 'Rightful Owner',
			password: ownerPassword
		});
		expect(joined).toMatchObject({ type: 'redirect', location: '/teams/kestrel' });
		expect(await (await owner.me()).json()).toMatchObject({ email, name: 'Rightful Owner' });
		expect(await new Client().signIn(email, attackerPassword)).toMatchObject({ status: 401 });
		expect(await new Client().signIn(email, ownerPassword)).toMatchObject({ type: 'redirect' });
	});
});

describe('personal API tokens', () => {
	async function userWithToken() {
		const client = new Client();
		const { email, password } = await newVerifiedUser(client);
		const created = await client.api('POST', '/me/tokens', { name: 'script' });
		expect(created.status).toBe(201);
		const { token } = (await created.json()) as { token: string };
		expect((await bearerCall(token, 'GET', '/me')).status).toBe(200);
		return { client, email, password, token };
	}

	it('cannot create further tokens with a token', async () => {
		const { token } = await userWithToken();
		const minted = await bearerCall(token, 'POST', '/me/tokens', { name: 'escape hatch' });
		expect(minted.status).toBe(403);
		expect((await minted.json()).error.code).toBe('forbidden');
	});

	it('end with a password reset', async () => {
		const { email, token } = await userWithToken();
		await new Client().submit('/reset', { email });
		const mail = await waitForMail(email, /new Checkplate password/);
		const resetToken = new URLSearchParams(linkIn(mail, '/reset/new').split('?')[1]).get('token')!;
		expect(
			await new Client().submit('/reset/new', { token: resetToken, password: 'fresh passphrase 9' })
		).toMatchObject({ type: 'redirect' });
		expect((await bearerCall(token, 'GET', '/me')).status).toBe(401);
	});

	it('end with a password change and with "sign out everywhere"', async () => {
		const changed = await userWithToken();
		expect(
			await changed.client.submit('/account?/password', {
				currentPassword: changed.password,
				password: 'fresh passphrase 9'
			})
		).toMatchObject({ type: 'success' });
		expect((await bearerCall(changed.token, 'GET', '/me')).status).toBe(401);

		const everywhere = await userWithToken();
		await everywhere.client.submit('/account?/everywhere', {});
		expect((await bearerCall(everywhere.token, 'GET', '/me')).status).toBe(401);
	});
});
