import { describe, expect, it } from 'vitest';
import { baseUrl } from './client';

describe('/api/v1/openapi.json', () => {
	it('is served without sign-in and names this server', async () => {
		const response = await fetch(new URL('/api/v1/openapi.json', baseUrl));
		expect(response.status).toBe(200);
		const document = await response.json();
		expect(document.openapi).toBe('3.0.3');
		expect(document.servers).toEqual([{ url: `${new URL(baseUrl).origin}/api/v1` }]);
		expect(Object.keys(document.paths)).toContain('/teams/{team}/drawings/{number}/revisions');
	});
});
