import { z } from 'zod';
import { geometricControl } from './calc';
import { revisionSettings } from './drawings';
import { featureKinds } from '$lib/features';
import { markerLocation } from './location';

/** Datum feature letters: A, B, C … (two letters past Z). */
export const datumLetter = z
	.string()
	.trim()
	.toUpperCase()
	.regex(/^[A-Z]{1,2}$/, { error: 'A datum feature is a letter such as A, B or C' });

export const featureOverrides = z
	.object({
		envelope: z.boolean().default(false),
		independency: z.boolean().default(false),
		stock: z.boolean().default(false),
		freeState: z.boolean().default(false)
	})
	.strict();

const featureFields = {
	label: z.string().trim().max(200).default(''),
	kind: z.enum(featureKinds, { error: `kind is one of ${featureKinds.join(', ')}` }),
	/** Left out: guessed from an ISO 286 code's letter case, else from the kind. */
	internal: z.boolean().optional(),
	boughtOut: z.boolean().default(false),
	datumFeature: datumLetter.nullable().default(null),
	/** As written on the drawing; empty only for a plain datum face, which has no size. */
	callout: z.string().trim().max(200, { error: 'A callout is at most 200 characters' }).default(''),
	/** Left out: the callout's `4X`, else 1. */
	quantity: z.number().int().min(1).max(9999).optional(),
	controls: z.array(geometricControl).max(10).default([]),
	overrides: featureOverrides.default({
		envelope: false,
		independency: false,
		stock: false,
		freeState: false
	}),
	/** `null`: not yet placed. */
	location: markerLocation.nullable().default(null),
	notes: z.string().max(10_000).default('')
};

const needsSize = (f: { callout?: string; datumFeature?: string | null }) =>
	f.callout !== '' || !!f.datumFeature;
const needsSizeIssue = {
	error: 'Write the callout, or mark a plain face as a datum feature',
	path: ['callout']
};

export const featureInput = z.object(featureFields).strict().refine(needsSize, needsSizeIssue);

export const featurePatch = z
	.object({
		version: z.number().int().positive({ error: 'Send the version you edited' }),
		...Object.fromEntries(
			Object.entries(featureFields).map(([k, v]) => [
				k,
				// No defaults on a patch: what is left out stays as it is.
				(v instanceof z.ZodDefault ? v.unwrap() : v).optional()
			])
		)
	})
	.strict() as unknown as z.ZodType<
	{ version: number } & Partial<Omit<z.output<typeof featureInput>, 'internal' | 'quantity'>> & {
			internal?: boolean;
			quantity?: number;
		},
	{ version: number } & Partial<z.input<typeof featureInput>>
>;

export const deleteQuery = z.object({
	version: z.coerce.number({ error: 'Send ?version= of what you delete' }).int().positive()
});

export type FeatureInput = z.output<typeof featureInput>;
export type FeaturePatch = z.output<typeof featurePatch>;

const text = z.string().nullable();

/** What every feature answer holds (the OpenAPI document's response schema). */
export const featureResponse = z.object({
	id: z.uuid(),
	balloon: z.number().int(),
	label: z.string(),
	kind: z.enum(featureKinds),
	internal: z.boolean(),
	boughtOut: z.boolean(),
	datumFeature: z.string().nullable(),
	carried: z.object({ from: z.string(), confirmed: z.boolean() }).nullable(),
	callout: z.string(),
	quantity: z.number().int(),
	controls: z.array(geometricControl),
	overrides: featureOverrides,
	location: markerLocation.nullable(),
	notes: z.string(),
	version: z.number().int(),
	createdAt: z.string(),
	updatedAt: z.string(),
	settings: revisionSettings.describe('The revision settings the values were computed under'),
	canonical: z.string().optional().describe('The callout in canonical form'),
	units: z.enum(['mm', 'in']).optional(),
	limitsSource: z.enum(['callout', 'iso286', 'general', 'none']).optional(),
	limitsNote: text.optional(),
	upper: text.optional(),
	lower: text.optional(),
	tolerance: text.optional(),
	mmc: text.optional(),
	lmc: text.optional(),
	envelope: z.object({ applies: z.boolean(), reason: z.string() }).optional(),
	gauges: z.object({ go: text, noGo: text, note: z.string().optional() }).optional(),
	formDeviation: text.optional(),
	virtualCondition: text.optional(),
	resultantCondition: text.optional(),
	innerBoundary: text.optional(),
	outerBoundary: text.optional(),
	geometric: z.array(z.record(z.string(), z.unknown())).optional(),
	problem: z
		.object({ message: z.string(), field: z.string(), position: z.number().int().nullable() })
		.nullable()
		.describe('Why the values could not be computed (for a plain face: null and no values)'),
	findings: z.array(
		z.object({
			rule: z.string(),
			severity: z.enum(['critical', 'major', 'minor', 'note']),
			message: z.string(),
			line: z.string()
		})
	)
});

/** GET /teams/{team}/features?q=: features of any drawing of the team, to pair in a fit. */
export const featureSearchQuery = z.object({
	q: z
		.string({ error: 'Send ?q= with a drawing number, label, callout or balloon' })
		.trim()
		.min(1, { error: 'Send ?q= with a drawing number, label, callout or balloon' })
		.max(100, { error: 'q is at most 100 characters' }),
	/** true: holes only; false: shafts and pins only; absent: both. */
	internal: z
		.enum(['true', 'false'], { error: 'internal is true or false' })
		.transform((v) => v === 'true')
		.optional(),
	limit: z.coerce
		.number({ error: 'limit must be a number' })
		.int({ error: 'limit must be a whole number' })
		.min(1, { error: 'limit must be between 1 and 50' })
		.max(50, { error: 'limit must be between 1 and 50' })
		.default(20)
});
export type FeatureSearch = z.output<typeof featureSearchQuery>;

/** One feature found by the team search, with where it sits. */
export const featureMatch = z.object({
	featureId: z.uuid(),
	drawing: z.string().describe('The drawing number'),
	title: z.string().describe("The drawing's title"),
	letter: z.string().describe('The revision letter'),
	state: z.string().describe("The revision's state"),
	balloon: z.number().int(),
	label: z.string(),
	kind: z.enum(featureKinds),
	internal: z.boolean(),
	callout: z.string(),
	quantity: z.number().int()
});
export type FeatureMatch = z.output<typeof featureMatch>;
