import { drawingInput, generalToleranceFromForm } from '$lib/schemas/drawings';
import { fieldErrorsOf } from './forms';

/** Reads the drawing form (flat fields) into the API's drawing shape. */
export async function readDrawingForm(request: Request) {
	const form = Object.fromEntries(await request.formData());
	const candidate = {
		number: form.number,
		title: form.title,
		partName: form.partName ?? '',
		material: form.material ?? '',
		units: form.units,
		standard: form.standard,
		notes: form.notes ?? '',
		generalTolerance: generalToleranceFromForm(form)
	};
	const parsed = drawingInput.safeParse(candidate);
	const values = { ...candidate, version: Number(form.version) || undefined } as Record<
		string,
		unknown
	>;
	if (!parsed.success) return { ok: false as const, values, errors: fieldErrorsOf(parsed.error) };
	return { ok: true as const, data: parsed.data, version: Number(form.version) || 0, values };
}
