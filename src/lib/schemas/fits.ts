import { z } from 'zod';
import { FIT_INTENTS } from '$lib/tolerance/fit';
import { callout, decimal, temperatureInput } from './calc';

const id = (what: string) => z.uuid({ error: `${what} is a feature id (a UUID)` });

/** A bought fastener stored on a fit: its callout (`M6`, `1/4-20 UNC`) and a label. */
export const storedFastener = z
	.object({
		callout,
		label: z.string().trim().max(200).default(''),
		fixedPosition: decimal.optional(),
		projection: z.object({ P: decimal, D: decimal }).optional()
	})
	.strict();

const fitFields = {
	holeFeatureId: id('holeFeatureId'),
	shaftFeatureId: id('shaftFeatureId').nullable().default(null),
	fastener: storedFastener.nullable().default(null),
	fixedHoleFeatureId: id('fixedHoleFeatureId').nullable().default(null),
	/** Left out: what the limits make of it (clearance → running, and so on). */
	intent: z.enum(FIT_INTENTS, { error: `intent is one of ${FIT_INTENTS.join(', ')}` }).optional(),
	requiredMinClearance: decimal.nullable().default(null),
	requiredMaxClearance: decimal.nullable().default(null),
	sharedDatumFrame: z.boolean().default(false),
	temperature: temperatureInput.nullable().default(null)
};

const oneMember = (f: { shaftFeatureId?: string | null; fastener?: unknown }) =>
	(f.shaftFeatureId === null || f.shaftFeatureId === undefined) !==
	(f.fastener === null || f.fastener === undefined);
const oneMemberIssue = {
	error: 'Give the other member: either shaftFeatureId or a bought fastener',
	path: ['shaftFeatureId']
};

const fitObject = z.object(fitFields);

export const fitCreate = fitObject.strict().refine(oneMember, oneMemberIssue);

export const fitPatch = z
	.object({
		version: z.number().int().positive({ error: 'Send the version you edited' }),
		...Object.fromEntries(
			Object.entries(fitFields)
				.filter(([k]) => k !== 'holeFeatureId')
				.map(([k, v]) => [
					k,
					// No defaults on a patch: what is left out stays as it is.
					(v instanceof z.ZodDefault ? v.unwrap() : v).optional()
				])
		)
	})
	.strict() as unknown as z.ZodType<
	{ version: number } & Partial<Omit<z.output<typeof fitObject>, 'holeFeatureId'>>,
	{ version: number } & Partial<Omit<z.input<typeof fitObject>, 'holeFeatureId'>>
>;

export type FitCreate = z.output<typeof fitCreate>;
export type FitPatch = z.output<typeof fitPatch>;

const text = z.string().nullable();
const memberRef = z.object({
	featureId: z.uuid(),
	drawing: z.string().describe('The drawing number'),
	letter: z.string().describe('The revision letter'),
	balloon: z.number().int(),
	label: z.string(),
	callout: z.string()
});
const size = z
	.record(z.string(), z.unknown())
	.describe('The member as /calc/size answers it, under its own revision settings');

/** What every fit answer holds (the OpenAPI document's response schema). */
export const fitResponse = z.object({
	id: z.uuid(),
	revisionId: z.uuid().describe("The hole's revision, which owns the fit"),
	holeFeatureId: z.uuid(),
	shaftFeatureId: z.uuid().nullable(),
	fastener: storedFastener
		.extend({ size: size.nullable().optional() })
		.nullable()
		.describe('A bought fastener as the other member, with its computed size'),
	fixedHoleFeatureId: z.uuid().nullable(),
	intent: z.enum(FIT_INTENTS),
	requiredMinClearance: text,
	requiredMaxClearance: text,
	sharedDatumFrame: z.boolean(),
	temperature: z
		.object({
			operating: z.string(),
			holeCoefficient: z.string(),
			shaftCoefficient: z.string(),
			minClearance: text.optional(),
			maxClearance: text.optional(),
			classification: z.string().nullable().optional(),
			checks: z.array(z.unknown()).optional()
		})
		.nullable(),
	version: z.number().int(),
	createdAt: z.string(),
	updatedAt: z.string(),
	owned: z.boolean().describe("True on the hole's revision; elsewhere the fit is listed read-only"),
	members: z.object({
		hole: memberRef,
		shaft: memberRef.nullable(),
		fixedHole: memberRef.nullable()
	}),
	problem: z
		.object({
			message: z.string(),
			member: z.string(),
			field: z.string(),
			position: z.number().int().nullable()
		})
		.nullable()
		.describe('Why the values could not be computed'),
	units: z.enum(['mm', 'in']).optional(),
	hole: size.optional(),
	shaft: size.optional(),
	minClearance: text.optional().describe('Negative: interference. In the hole’s unit'),
	maxClearance: text.optional(),
	classification: z.enum(['clearance', 'transition', 'interference']).nullable().optional(),
	countedControls: z
		.array(z.string())
		.optional()
		.describe('The controls counted at the boundaries'),
	minClearanceAtBoundary: text.optional(),
	maxClearanceAtBoundary: text.optional(),
	boundaryNote: z.string().optional(),
	verdict: z.enum(['pass', 'fail', 'undetermined']).optional(),
	checks: z.array(z.object({ what: z.string(), ok: z.boolean(), text: z.string() })).optional(),
	fastenerBudget: z.record(z.string(), z.unknown()).optional(),
	diagramSvg: z
		.string()
		.optional()
		.describe(
			'The fit diagram: an SVG image (320 × 266) of the hole and shaft tolerance zones against the zero line, to scale, with the clearances marked; every text in it escaped'
		),
	caution: z.string().optional()
});
