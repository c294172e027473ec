import { fail, type RequestEvent } from '@sveltejs/kit';
import { z } from 'zod';
import type { FieldErrors } from '$lib/forms';

/** zod's messages per field, in the shape our pages read (`$lib/forms`). */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
	return z.flattenError(error).fieldErrors;
}

/** A refused form: `fail(status)` with the field messages and the values to show again. */
export function refuseForm<V extends Record<string, unknown>>(
	status: number,
	errors: FieldErrors,
	values: V
) {
	return fail(status, { values, errors });
}

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
		return {
			ok: false as const,
			failure: refuseForm(400, fieldErrorsOf(parsed.error), values),
			values
		};
	}
	return { ok: true as const, data: parsed.data as z.infer<S>, values };
}

/** How long to wait, in words: "Try again in 40 seconds." */
export function tryAgainIn(seconds: number) {
	const minutes = Math.ceil(seconds / 60);
	return seconds < 90 ? `Try again in ${seconds} seconds.` : `Try again in ${minutes} minutes.`;
}

/** A form refused by a rate limit: 429, Retry-After, and the values to show again. */
export function tooManyAttempts(
	event: Pick<RequestEvent, 'setHeaders'>,
	retryAfter: number,
	values: Record<string, string> = {},
	what = 'Too many attempts.'
) {
	event.setHeaders({ 'retry-after': String(retryAfter) });
	return fail(429, { values, message: `${what} ${tryAgainIn(retryAfter)}` });
}
