import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { firstIssue } from '$lib/schemas/calc';

/**
 * Reads a JSON body, and validates it given a schema; a bad one is a 400 `invalid` naming the
 * fields. Only a body declared `application/json` is read (415 otherwise): a browser cannot send
 * that cross-site without a CORS preflight, which the app never grants. The one way every API
 * route (the calculator's too) reads JSON.
 */
export async function readJson(request: Request): Promise<unknown>;
export async function readJson<S extends z.ZodType>(
	request: Request,
	schema: S
): Promise<z.infer<S>>;
export async function readJson(request: Request, schema?: z.ZodType) {
	requireJsonType(request);
	let body: unknown;
	try {
		body = await request.json();
	} catch {
		error(400, { message: 'The body must be JSON', code: 'invalid' });
	}
	return schema ? parseOrRefuse(schema, body) : body;
}

/** A body not declared `application/json` is a 415, before it is read. */
export function requireJsonType(request: Request) {
	const type = request.headers.get('content-type')?.split(';')[0].trim().toLowerCase();
	if (type !== 'application/json') {
		error(415, { message: 'Send the body as application/json', code: 'unsupported_media_type' });
	}
}

/**
 * Reads and validates query parameters (empty ones count as absent); a bad one is a 400
 * `invalid` naming it, never a fault further down.
 */
export function readQuery<S extends z.ZodType>(url: URL, schema: S): z.infer<S> {
	const values: Record<string, string> = {};
	for (const [name, value] of url.searchParams) if (value !== '') values[name] = value;
	return parseOrRefuse(schema, values);
}

/** Validates input against a schema; a bad one is the API's one 400 `invalid` shape. */
export function parseOrRefuse<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
	const parsed = schema.safeParse(input);
	if (!parsed.success) refuseInvalid(parsed.error);
	return parsed.data;
}

/**
 * The 400 for input a schema refused: the first issue as the message, `fields` (messages by
 * top-level name) and `issues` (each with its full path).
 */
export function refuseInvalid(zodError: z.ZodError): never {
	error(400, {
		message: firstIssue(zodError),
		code: 'invalid',
		fields: z.flattenError(zodError).fieldErrors,
		issues: zodError.issues
	} as App.Error);
}

/** Ids in paths are UUIDs; anything else cannot name a row, so the route answers 404. */
export const isUuid = (id: string) =>
	/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id);
