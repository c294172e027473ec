import { z } from 'zod';
import { generalToleranceInput } from './drawings';
import { UNITS } from '$lib/tolerance/decimal';
import { GOVERNING_STANDARDS, type GoverningStandard } from '$lib/tolerance/drawing-context';
import { CHARACTERISTICS, MATERIAL_MODIFIERS } from '$lib/tolerance/feature';
import { FIT_INTENTS } from '$lib/tolerance/fit';

export const CAUTION =
	"Results are advisory: the governing standard, your organisation's drawing practice and a qualified checker decide.";

const STANDARDS = GOVERNING_STANDARDS;
const SHORT: Record<string, GoverningStandard> = { asme: 'asme-y14.5-2018', iso: 'iso-8015' };

const standardName = z
	.enum([...STANDARDS, 'asme', 'iso'], {
		error: `standard must be one of ${STANDARDS.join(', ')} (or asme, iso)`
	})
	.transform((s): GoverningStandard => SHORT[s] ?? (s as GoverningStandard));

export const standard = standardName.default('unstated');

const unit = z.enum(UNITS, { error: 'units must be mm or in' });
export const units = unit.default('mm');

/** Decimals travel as strings; a JSON number is accepted and read as written. */
export const decimal = z
	.union([z.string().trim().min(1).max(40), z.number().finite()])
	.transform(String);

export const callout = z
	.string({ error: 'callout is required' })
	.trim()
	.min(1, { error: 'callout is required' })
	.max(200, { error: 'a callout is at most 200 characters' });

export const geometricControl = z.object({
	characteristic: z.enum(CHARACTERISTICS),
	value: decimal,
	diameterZone: z.boolean().default(false),
	appliesTo: z.enum(['surface', 'median']).default('median'),
	modifier: z.enum(MATERIAL_MODIFIERS).default('rfs'),
	datums: z.array(z.string().trim().min(1).max(3)).max(3).default([])
});

const geometric = z
	.union([geometricControl, z.array(geometricControl).max(10)])
	.transform((g) => (Array.isArray(g) ? g : [g]));

// The drawing's own general-tolerance shape (PRODUCT.md §6), validated the same way.
export const generalTolerance = generalToleranceInput;

export const overrides = z
	.object({
		envelope: z.boolean().optional(),
		independency: z.boolean().optional(),
		stock: z.boolean().optional(),
		freeState: z.boolean().optional()
	})
	.optional();

const feature = z.enum(['internal', 'external']).optional();

export const sizeQuery = z.object({ callout, units, feature, standard });

export const sizeInput = z.object({
	callout,
	units,
	feature,
	standard,
	geometric: geometric.optional(),
	actual: decimal.optional(),
	generalTolerance: generalTolerance.optional(),
	overrides,
	notes: z.string().max(2000).optional()
});

// A member on another drawing than the fit's gives that drawing's units, standard and
// general tolerance; what it leaves out comes from the fit.
const member = z.object({
	callout,
	units: unit.optional(),
	standard: standardName.optional(),
	generalTolerance: generalTolerance.optional(),
	geometric: geometric.optional(),
	overrides,
	notes: z.string().max(2000).optional()
});

/** A bought fastener as the fit's other member. */
export const fastenerFields = z.object({
	callout,
	units: unit.optional(),
	fixedPosition: decimal.optional(),
	projection: z.object({ P: decimal, D: decimal }).optional()
});

/** Operating temperature in °C and the two materials' coefficients in 10⁻⁶/K. */
export const temperatureInput = z.object({
	operating: decimal,
	holeCoefficient: decimal,
	shaftCoefficient: decimal
});

export const fitInput = z
	.object({
		hole: member,
		shaft: member.optional(),
		fastener: fastenerFields.optional(),
		units,
		standard,
		generalTolerance: generalTolerance.optional(),
		intent: z.enum(FIT_INTENTS).optional(),
		// Both members located by the same datum features: orientation and location controls
		// then enter the boundary check too.
		sharedDatumFrame: z.boolean().default(false),
		requiredMinClearance: decimal.optional(),
		requiredMaxClearance: decimal.optional(),
		temperature: temperatureInput.optional()
	})
	.refine((f) => (f.shaft === undefined) !== (f.fastener === undefined), {
		error: 'give either a shaft or a fastener',
		path: ['shaft']
	});

export const adviseInput = z.object({
	basicSize: decimal,
	units,
	wanted: z.enum(['running', 'locational-clearance', 'transition', 'interference']).optional(),
	basis: z.enum(['hole', 'shaft']).optional()
});

/** The first problem in words, with where it is. */
export function firstIssue(error: z.ZodError): string {
	const issue = error.issues[0];
	const path = issue.path.join('.');
	return path ? `${path}: ${issue.message}` : issue.message;
}
