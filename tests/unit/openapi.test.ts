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
			// `export const GET = …`, or handlers shared by several routes: `export const { GET, POST } = …`.
			for (const [, one, several] of readFileSync(file, 'utf8').matchAll(
				/export const (?:(GET|POST|PATCH|DELETE)\b|\{([^}]*)\})/g
			)) {
				for (const method of one ? [one] : several.split(',').map((m) => m.trim())) {
					fromFiles.push(`${method.toLowerCase()} ${path}`);
				}
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

describe('the features routes in the OpenAPI document', () => {
	const path = '/teams/{team}/drawings/{number}/revisions/{letter}/features';
	type Described = {
		requestBody?: { content: { 'application/json': { schema: Record<string, unknown> } } };
		responses: Record<string, { content?: { 'application/json': { schema?: unknown } } }>;
	};

	it('describes the answer of every feature route with the fields of PRODUCT.md §6', () => {
		const document = openApiDocument('http://localhost:3000');
		const one = (document.paths[`${path}/{id}`].get as Described).responses['200'].content![
			'application/json'
		].schema as { properties: Record<string, unknown> };
		expect(Object.keys(one.properties)).toEqual(
			expect.arrayContaining([
				'id',
				'balloon',
				'label',
				'kind',
				'internal',
				'boughtOut',
				'datumFeature',
				'carried',
				'callout',
				'quantity',
				'controls',
				'overrides',
				'location',
				'notes',
				'version',
				'upper',
				'lower',
				'tolerance',
				'mmc',
				'lmc',
				'envelope',
				'gauges',
				'virtualCondition',
				'findings'
			])
		);
		const list = (document.paths[path].get as Described).responses['200'].content![
			'application/json'
		].schema as { type: string };
		expect(list.type).toBe('array');
		const patch = document.paths[`${path}/{id}`].patch as Described;
		expect(patch.requestBody!.content['application/json'].schema).toMatchObject({
			required: ['version']
		});
	});
});
