import { error } from '@sveltejs/kit';
import { z } from 'zod';

/** Reads and validates a JSON body; a bad one is a 400 `invalid` naming the fields. */
export async function readJson<S extends z.ZodType>(
	request: Request,
	schema: S
): Promise<z.infer<S>> {
	let body: unknown;
	try {
		body = await request.json();
	} catch {
		error(400, { message: 'The body must be JSON', code: 'invalid' });
	}
	return validated(schema, body);
}

/** Reads and validates the query string the same way (`?version=` and the like). */
export function readQuery<S extends z.ZodType>(url: URL, schema: S): z.infer<S> {
	return validated(schema, Object.fromEntries(url.searchParams));
}

function validated<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
	const parsed = schema.safeParse(data);
	if (!parsed.success) {
		const fields = z.flattenError(parsed.error).fieldErrors as Record<string, string[]>;
		const first = Object.entries(fields)[0];
		error(400, {
			message: first ? `${first[0]}: ${first[1][0]}` : parsed.error.issues[0]?.message,
			code: 'invalid',
			fields
		} as App.Error);
	}
	return parsed.data;
}

/** Ids in paths are UUIDs; anything else cannot name a row, so the route answers 404. */
export const isUuid = (id: string) =>
	/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id);
