import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openApiDocument, operations } from '../../src/lib/server/openapi';

const root = 'src/routes/api/v1';

function routeFiles(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const path = join(dir, name);
		if (statSync(path).isDirectory()) return routeFiles(path);
		return name === '+server.ts' ? [path] : [];
	});
}

describe('the OpenAPI document', () => {
	it('lists every API route and method, and nothing else', () => {
		const fromFiles: string[] = [];
		for (const file of routeFiles(root)) {
			const path =
				'/' +
				relative(root, file)
					.replace(/\/?\+server\.ts$/, '')
					.replace(/\[(\w+)\]/g, '{$1}');
			if (path === '/openapi.json') continue;
			for (const [, method] of readFileSync(file, 'utf8').matchAll(
				/export const (GET|POST|PATCH|DELETE)\b/g
			)) {
				fromFiles.push(`${method.toLowerCase()} ${path}`);
			}
		}
		const documented = Object.entries(operations).flatMap(([path, methods]) =>
			Object.keys(methods).map((method) => `${method} ${path}`)
		);
		expect(documented.sort()).toEqual(fromFiles.sort());
	});

	it('describes request bodies from the zod schemas', () => {
		const document = openApiDocument('http://localhost:3000');
		const post = document.paths['/teams/{team}/drawings'].post as {
			requestBody: {
				content: { 'application/json': { schema: { properties: Record<string, unknown> } } };
			};
		};
		const properties = post.requestBody.content['application/json'].schema.properties;
		expect(Object.keys(properties)).toEqual(
			expect.arrayContaining(['number', 'title', 'units', 'standard', 'generalTolerance'])
		);
	});
});
