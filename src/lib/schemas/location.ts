import { z } from 'zod';

const fraction = z.number().min(0).max(1);

/**
 * Where a marker sits (PRODUCT.md §3): `sheet` 1-based, `x`, `y` in 0..1 from the top-left of
 * the page as displayed (after its rotation, within its crop box); an area marker adds its
 * width `w` and height `h` in 0..1. `null` means not yet placed.
 */
export const markerLocation = z
	.object({
		sheet: z.number().int().min(1),
		x: fraction,
		y: fraction,
		w: fraction.optional(),
		h: fraction.optional()
	})
	.refine((l) => (l.w === undefined) === (l.h === undefined), {
		error: 'An area marker gives both w and h'
	})
	.refine((l) => (l.w ?? 0) + l.x <= 1 + 1e-9 && (l.h ?? 0) + l.y <= 1 + 1e-9, {
		error: 'An area marker stays within its sheet'
	});

export type MarkerLocation = z.infer<typeof markerLocation>;
