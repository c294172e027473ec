import { z } from 'zod';
import { isRevisionLetter } from '$lib/revision-letters';
import { UNITS } from '$lib/tolerance/decimal';
import { GOVERNING_STANDARDS, type GeneralTolerance } from '$lib/tolerance/drawing-context';
import { GEOMETRIC_CLASSES, LINEAR_CLASSES } from '$lib/tolerance/iso2768';

const decimalText = z.string().regex(/^\d*\.?\d+$/, { error: 'Write a decimal such as 0.005' });

export const generalToleranceInput = z
	.discriminatedUnion('kind', [
		z.object({
			kind: z.literal('iso2768'),
			linear: z.enum(LINEAR_CLASSES),
			geometric: z.enum(GEOMETRIC_CLASSES).optional(),
			envelope: z.boolean().optional()
		}),
		z.object({
			kind: z.literal('decimal-places'),
			// Keys are numbers of decimal places; any subset of them may be given.
			byPlaces: z.record(
				z.string().regex(/^[0-6]$/, { error: 'Places run from 0 to 6' }),
				decimalText
			),
			angle: decimalText.optional()
		})
	])
	.nullable();

// The schema reads exactly the core's shape: a change to either fails to compile until both agree.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const generalToleranceAgrees: Same<
	z.infer<typeof generalToleranceInput>,
	GeneralTolerance | null
> = true;
void generalToleranceAgrees;

export const units = z.enum(UNITS, { error: 'Choose mm or in' });
export const standard = z.enum(GOVERNING_STANDARDS, {
	error: 'Choose the governing standard'
});

export const drawingFields = {
	title: z.string().trim().min(1, { error: 'Give the drawing a title' }).max(200),
	partName: z.string().trim().max(200).default(''),
	material: z.string().trim().max(200).default(''),
	units,
	standard,
	generalTolerance: generalToleranceInput.default(null),
	notes: z.string().max(10_000).default('')
};

export const drawingNumber = z
	.string()
	.trim()
	.min(1, { error: 'Enter the drawing number' })
	.max(60)
	.regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, {
		error: 'Use letters, digits, dots, dashes and underscores'
	});

export const drawingInput = z.object({ number: drawingNumber, ...drawingFields });

export const drawingPatch = z
	.object({
		version: z.number().int().positive({ error: 'Send the version you edited' }),
		...Object.fromEntries(Object.entries(drawingFields).map(([k, v]) => [k, v.optional()]))
	})
	.strict() as z.ZodType<{ version: number } & Partial<z.infer<typeof drawingInput>>>;

export const revisionLetter = z.string().trim().toUpperCase().refine(isRevisionLetter, {
	error:
		'Use a revision letter such as A, B … Y, AA (never I, O, Q, S, X, Z), or - for an initial release'
});

export const revisionFields = z.object({
	reason: z.string().trim().max(2000).default(''),
	// A form sends an empty field for "the next letter".
	letter: z.preprocess((v) => (v === '' ? undefined : v), revisionLetter.optional())
});

/** The drawing form sends the general tolerance as flat fields; this builds the API shape. */
export function generalToleranceFromForm(form: Record<string, FormDataEntryValue>) {
	const kind = String(form.gtKind ?? 'none');
	if (kind === 'iso2768') {
		return {
			kind,
			linear: String(form.gtLinear || 'm'),
			geometric: form.gtGeometric ? String(form.gtGeometric) : undefined,
			envelope: form.gtEnvelope === 'on'
		};
	}
	if (kind === 'decimal-places') {
		const byPlaces: Record<string, string> = {};
		for (const places of ['1', '2', '3', '4']) {
			const value = String(form[`gtPlaces${places}`] ?? '').trim();
			if (value) byPlaces[places] = value;
		}
		const angle = String(form.gtAngle ?? '').trim();
		return { kind, byPlaces, angle: angle || undefined };
	}
	return null;
}

/** A revision's own copy of the drawing's settings (PRODUCT.md §6 `settings`). */
export const revisionSettings = z.object({
	units,
	standard,
	generalTolerance: generalToleranceInput
});

export const revisionPatch = z
	.object({
		version: z.number().int().positive({ error: 'Send the version you edited' }),
		reason: z.string().trim().max(2000).optional(),
		settings: revisionSettings.partial().strict().optional()
	})
	.strict();
