/*
 * The findings pages' form actions: the same service as the JSON API, read from form fields
 * (empty selects mean "none") and answered in the shape the pages read (`$lib/forms`).
 */
import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { commentInput, findingInput, findingPatch } from '$lib/schemas/findings';
import { fieldErrorsOf } from './forms';

const optionalIds = ['featureId', 'fitId', 'assigneeId'] as const;

/** A form's fields: strings, with empty ones left out (or null for the optional ids). */
async function fieldsOf(request: Request) {
	const form = Object.fromEntries(await request.formData()) as Record<string, string>;
	const values: Record<string, unknown> = {};
	for (const [k, v] of Object.entries(form)) {
		if (typeof v !== 'string') continue;
		if (v !== '') values[k] = v;
		else if ((optionalIds as readonly string[]).includes(k)) values[k] = null;
	}
	return { form, values };
}

function parsed<S extends z.ZodType>(schema: S, values: unknown, echo: Record<string, string>) {
	const result = schema.safeParse(values);
	if (result.success) return { ok: true as const, data: result.data as z.output<S> };
	return {
		ok: false as const,
		failure: fail(400, { values: echo, errors: fieldErrorsOf(result.error) })
	};
}

/** The raise form: text, severity, feature and assignee (the board places it later). */
export async function readRaiseForm(request: Request) {
	const { form, values } = await fieldsOf(request);
	return parsed(findingInput, values, form);
}

/** A state change: `state`, `message` and the `version` it was made against. */
export async function readMoveForm(request: Request) {
	const { form, values } = await fieldsOf(request);
	return parsed(
		findingPatch,
		{ ...values, version: Number(values.version), message: values.message ?? '' },
		form
	);
}

/** A waiver: `reason` to waive, `take=back` to withdraw it; made against `version`. */
export async function readWaiverForm(request: Request) {
	const { form, values } = await fieldsOf(request);
	const waiver = values.take === 'back' ? null : { reason: values.reason ?? '' };
	const read = parsed(findingPatch, { waiver, version: Number(values.version) }, form);
	if (read.ok || !('waiver' in (read.failure.data.errors ?? {}))) return read;
	return {
		ok: false as const,
		failure: fail(400, { values: form, errors: { reason: ['Say why the finding is waived'] } })
	};
}

/** A comment (`body`), and for an edit the comment's `id`. */
export async function readCommentForm(request: Request) {
	const { form, values } = await fieldsOf(request);
	const read = parsed(commentInput, { body: values.body }, form);
	return { ...read, id: typeof values.id === 'string' ? values.id : null };
}

/** A service's refusal as the page's form message (and the field it names). */
export function refusedForm(
	refusal: { status: number; message: string; field?: string },
	values: Record<string, string> = {}
) {
	const errors = refusal.field ? { [refusal.field]: [refusal.message] } : {};
	return fail(refusal.status, { values, errors, message: refusal.message });
}
