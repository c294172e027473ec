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
