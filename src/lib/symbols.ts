import type { Characteristic, MaterialModifier } from '$lib/tolerance/feature';

/** The geometric tolerancing symbols the product shows, with the names used in the standards. */
export const geometricSymbols = [
	{ glyph: '⌀', codePoint: 'U+2300', name: 'Diameter' },
	{ glyph: '⏤', codePoint: 'U+23E4', name: 'Straightness' },
	{ glyph: '⏥', codePoint: 'U+23E5', name: 'Flatness' },
	{ glyph: '○', codePoint: 'U+25CB', name: 'Circularity (roundness)' },
	{ glyph: '⌭', codePoint: 'U+232D', name: 'Cylindricity' },
	{ glyph: '⌒', codePoint: 'U+2312', name: 'Profile of a line' },
	{ glyph: '⌓', codePoint: 'U+2313', name: 'Profile of a surface' },
	{ glyph: '⊥', codePoint: 'U+22A5', name: 'Perpendicularity' },
	{ glyph: '∠', codePoint: 'U+2220', name: 'Angularity' },
	{ glyph: '∥', codePoint: 'U+2225', name: 'Parallelism' },
	{ glyph: '⌖', codePoint: 'U+2316', name: 'Position' },
	{ glyph: '◎', codePoint: 'U+25CE', name: 'Concentricity / coaxiality' },
	{ glyph: '⌯', codePoint: 'U+232F', name: 'Symmetry' },
	{ glyph: '↗', codePoint: 'U+2197', name: 'Circular run-out' },
	{ glyph: '⌰', codePoint: 'U+2330', name: 'Total run-out' }
] as const;

export const modifierSymbols = [
	{ glyph: 'Ⓜ', codePoint: 'U+24C2', name: 'Maximum material condition' },
	{ glyph: 'Ⓛ', codePoint: 'U+24C1', name: 'Least material condition' },
	{ glyph: 'Ⓔ', codePoint: 'U+24BA', name: 'Envelope requirement (ISO 14405-1)' },
	{ glyph: 'Ⓘ', codePoint: 'U+24BE', name: 'Independency (ASME Y14.5)' },
	{ glyph: 'Ⓕ', codePoint: 'U+24BB', name: 'Free state' },
	{ glyph: 'Ⓟ', codePoint: 'U+24C5', name: 'Projected tolerance zone' },
	{ glyph: 'Ⓢ', codePoint: 'U+24C8', name: 'Regardless of feature size (former practice)' },
	{ glyph: 'Ⓣ', codePoint: 'U+24C9', name: 'Tangent plane' },
	{ glyph: 'Ⓤ', codePoint: 'U+24CA', name: 'Unequally disposed profile' }
] as const;

/** Each geometric characteristic's symbol and its name in the standards. */
export const characteristicSymbols: Record<Characteristic, { glyph: string; name: string }> = {
	straightness: { glyph: '⏤', name: 'Straightness' },
	flatness: { glyph: '⏥', name: 'Flatness' },
	circularity: { glyph: '○', name: 'Circularity' },
	cylindricity: { glyph: '⌭', name: 'Cylindricity' },
	'profile-of-a-line': { glyph: '⌒', name: 'Profile of a line' },
	'profile-of-a-surface': { glyph: '⌓', name: 'Profile of a surface' },
	angularity: { glyph: '∠', name: 'Angularity' },
	perpendicularity: { glyph: '⊥', name: 'Perpendicularity' },
	parallelism: { glyph: '∥', name: 'Parallelism' },
	position: { glyph: '⌖', name: 'Position' },
	concentricity: { glyph: '◎', name: 'Concentricity / coaxiality' },
	symmetry: { glyph: '⌯', name: 'Symmetry' },
	'circular-runout': { glyph: '↗', name: 'Circular run-out' },
	'total-runout': { glyph: '⌰', name: 'Total run-out' }
};

/** The material condition modifiers as a frame shows them (regardless of size shows nothing). */
export const materialModifierSymbols: Record<MaterialModifier, { glyph: string; name: string }> = {
	mmc: { glyph: 'Ⓜ', name: 'at MMC' },
	lmc: { glyph: 'Ⓛ', name: 'at LMC' },
	rfs: { glyph: '', name: 'regardless of size' }
};
