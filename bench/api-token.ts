/** Signs in through the sign-in form and creates a personal API token: the benches' way in. */
export async function apiTokenFor(baseUrl: string, email: string, password: string) {
	const signIn = await fetch(`${baseUrl}/signin?/password`, {
		method: 'POST',
		headers: {
			origin: baseUrl,
			'content-type': 'application/x-www-form-urlencoded',
			accept: 'application/json',
			'x-sveltekit-action': 'true'
		},
		body: new URLSearchParams({ email, password }),
		redirect: 'manual'
	});
	const cookie = signIn.headers
		.getSetCookie()
		.map((c) => c.split(';')[0])
		.join('; ');
	const created = await fetch(`${baseUrl}/api/v1/me/tokens`, {
		method: 'POST',
		headers: { cookie, origin: baseUrl, 'content-type': 'application/json' },
		body: JSON.stringify({ name: 'bench' })
	});
	if (!created.ok) throw new Error(`no token: ${created.status} ${await created.text()}`);
	return ((await created.json()) as { token: string }).token;
}
