import { z } from 'zod';

const unit = z.number().min(0, { error: 'Use 0..1 of the page' }).max(1, {
	error: 'Use 0..1 of the page'
});

/**
 * Where a marker sits (PRODUCT.md §3): `sheet` 1-based, `x`, `y` in 0..1 from the top-left of
 * the page as displayed (after its rotation, within its crop box); an area marker adds its
 * width `w` and height `h` in 0..1 and stays within its sheet. `null` means not yet placed.
 * Features and findings share this one definition.
 */
export const markerLocation = z
	.object({
		sheet: z.number().int().min(1, { error: 'Sheets count from 1' }),
		x: unit,
		y: unit,
		w: unit.optional(),
		h: unit.optional()
	})
	.strict()
	.refine((l) => (l.w === undefined) === (l.h === undefined), {
		error: 'An area marker gives both w and h',
		path: ['w']
	})
	.refine((l) => (l.w ?? 0) + l.x <= 1 + 1e-9 && (l.h ?? 0) + l.y <= 1 + 1e-9, {
		error: 'An area marker stays within its sheet',
		path: ['w']
	});

export type MarkerLocation = z.infer<typeof markerLocation>;
