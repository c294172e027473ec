import { fail } from '@sveltejs/kit';
import { z } from 'zod';

/**
 * Parses a form with a zod schema. On failure returns the `fail(400)` to hand back, echoing
 * only the fields named in `echo` (never passwords).
 */
export async function parseForm<S extends z.ZodType>(
	request: Request,
	schema: S,
	echo: string[] = []
) {
	const form = Object.fromEntries(await request.formData());
	const parsed = schema.safeParse(form);
	const values = Object.fromEntries(echo.map((k) => [k, String(form[k] ?? '')]));
	if (!parsed.success) {
		const errors = z.flattenError(parsed.error).fieldErrors as Record<string, string[]>;
		return { ok: false as const, failure: fail(400, { values, errors }), values };
	}
	return { ok: true as const, data: parsed.data as z.infer<S>, values };
}
