/**
 * The shape every form action of ours hands back when it refuses: messages per field, the values
 * to show again, and a message for the whole form. Pages read it with `fieldErrors` and
 * `formMessage`; actions build it with `src/lib/server/forms.ts`.
 */
export type FieldErrors = Partial<Record<string, string[]>>;

interface Refusal {
	errors?: FieldErrors;
	message?: string;
}

/** The field messages of an action's result (none when it succeeded or nothing was sent). */
export function fieldErrors(form: Refusal | null | undefined): FieldErrors {
	return form?.errors ?? {};
}

/** The message for the whole form, if the action gave one. */
export function formMessage(form: Refusal | null | undefined): string | null {
	return form?.message ?? null;
}
