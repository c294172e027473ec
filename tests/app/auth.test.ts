import { describe, expect, it } from 'vitest';
import { linkIn, unique, waitForMail } from '../shared';
import { Client } from './client';

async function signUpAndVerify(client: Client, password = 'pump housing bore 18') {
	const email = `user-${unique()}@example.test`;
	const result = await client.submit('/signup', { name: 'Ada Reviewer', email, password });
	expect(result).toMatchObject({ type: 'redirect', location: '/signup?sent=1' });
	const mail = await waitForMail(email, /Confirm your e-mail/);
	const verified = await client.confirmAddress(linkIn(mail, '/verify'));
	expect(verified).toMatchObject({ type: 'redirect', location: '/signin?verified=1' });
	return { email, password };
}

describe('/api/v1/me', () => {
	it('answers 401 JSON signed out and the user signed in', async () => {
		const client = new Client();
		const signedOut = await client.me();
		expect(signedOut.status).toBe(401);
		expect(await signedOut.json()).toEqual({
			error: { code: 'unauthenticated', message: 'Sign in first' }
		});
		expect(await client.signIn('admin@example.test')).toMatchObject({ type: 'redirect' });
		const signedIn = await client.me();
		expect(signedIn.status).toBe(200);
		expect(await signedIn.json()).toMatchObject({
			email: 'admin@example.test',
			name: 'Ines Marlow'
		});
	});
});

describe('sign-up and e-mail verification', () => {
	it('sends a verification link that confirms the address once; before it, sign-in is refused', async () => {
		const client = new Client();
		const email = `user-${unique()}@example.test`;
		await client.submit('/signup', { name: 'Bo Checker', email, password: 'dowel hole six mm' });
		const refused = await client.signIn(email, 'dowel hole six mm');
		expect(refused).toMatchObject({ type: 'failure', status: 401 });
		expect(refused.data).toContain('Confirm your e-mail address first');

		const mail = await waitForMail(email, /Confirm your e-mail/);
		expect(mail.html).toContain('/verify?token=');
		const link = linkIn(mail, '/verify');
		// Opening the link (as a mail scanner does) uses nothing up: the page shows a button.
		const page = await client.get(link);
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Confirm my address');
		expect(await client.signIn(email, 'dowel hole six mm')).toMatchObject({ status: 401 });
		expect(await client.confirmAddress(link)).toMatchObject({
			type: 'redirect',
			location: '/signin?verified=1'
		});
		// Used: the page explains, nothing more.
		expect(await client.confirmAddress(link)).toMatchObject({ type: 'failure', status: 400 });
		expect(await (await client.get(link)).text()).not.toContain('Confirm my address');
		expect(await client.signIn(email, 'dowel hole six mm')).toMatchObject({ type: 'redirect' });
		expect((await client.me()).status).toBe(200);
	});

	it('shows field errors for a weak password and a bad address, beside the fields', async () => {
		const result = await new Client().submit('/signup', {
			name: '',
			email: 'not-an-address',
			password: 'short'
		});
		expect(result).toMatchObject({ type: 'failure', status: 400 });
		expect(result.data).toContain('Enter your name');
		expect(result.data).toContain('Enter a valid e-mail address');
		expect(result.data).toContain('Use at least 10 characters');
	});
});

describe('password sign-in', () => {
	it('answers a wrong password with a form error and no session', async () => {
		const client = new Client();
		const result = await client.signIn('checker@example.test', 'not the password');
		expect(result).toMatchObject({ type: 'failure', status: 401 });
		expect(result.data).toContain('do not match an account');
		expect((await client.me()).status).toBe(401);
	});
});

describe('sessions', () => {
	it('"sign out everywhere" ends a second session at once', async () => {
		const laptop = new Client();
		const phone = new Client();
		const { email, password } = await signUpAndVerify(laptop);
		await laptop.signIn(email, password);
		await phone.signIn(email, password);
		expect((await phone.me()).status).toBe(200);
		expect(await laptop.submit('/account?/everywhere', {})).toMatchObject({ type: 'redirect' });
		expect((await phone.me()).status).toBe(401);
		expect((await laptop.me()).status).toBe(401);
	});

	it('signs in with an e-mailed link', async () => {
		const client = new Client();
		const { email } = await signUpAndVerify(client);
		expect(await client.submit('/signin?/link', { email })).toMatchObject({
			type: 'redirect',
			location: '/signin?sent=1'
		});
		const mail = await waitForMail(email, /sign-in link/);
		await client.follow(linkIn(mail, '/auth/callback/nodemailer'));
		expect(await (await client.me()).json()).toMatchObject({ email });
	});

	it('sends no link to an address without an account, and says the same', async () => {
		const result = await new Client().submit('/signin?/link', {
			email: `nobody-${unique()}@example.test`
		});
		expect(result).toMatchObject({ type: 'redirect', location: '/signin?sent=1' });
	});
});

describe('password reset', () => {
	it('works once, signs in with the new password, and ends other sessions', async () => {
		const other = new Client();
		const { email, password } = await signUpAndVerify(other);
		await other.signIn(email, password);
		expect((await other.me()).status).toBe(200);

		const client = new Client();
		expect(await client.submit('/reset', { email })).toMatchObject({
			type: 'redirect',
			location: '/reset?sent=1'
		});
		const mail = await waitForMail(email, /new Checkplate password/);
		const token = new URLSearchParams(linkIn(mail, '/reset/new').split('?')[1]).get('token')!;
		const newPassword = 'a brand new passphrase';
		expect(await client.submit('/reset/new', { token, password: newPassword })).toMatchObject({
			type: 'redirect',
			location: '/signin?reset=1'
		});
		const again = await client.submit('/reset/new', { token, password: 'another passphrase 2' });
		expect(again).toMatchObject({ type: 'failure', status: 400 });
		expect(again.data).toContain('already used');

		expect((await other.me()).status).toBe(401);
		expect(await client.signIn(email, password)).toMatchObject({ status: 401 });
		expect(await client.signIn(email, newPassword)).toMatchObject({ type: 'redirect' });
	});

	it('answers the same for an address without an account', async () => {
		const result = await new Client().submit('/reset', {
			email: `nobody-${unique()}@example.test`
		});
		expect(result).toMatchObject({ type: 'redirect', location: '/reset?sent=1' });
	});
});
