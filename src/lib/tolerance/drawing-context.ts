/*
 * What a drawing states that every size on it is read under: its unit, its governing standard
 * and its general tolerance. Defined once here; the input schemas (src/lib/schemas) and the
 * database columns (src/lib/server/db/schema.ts) are typed from these lists, so adding a
 * standard is one edit.
 */
import type { Units } from './decimal';
import type { GeometricClass, LinearClass } from './tables/iso2768';
import type { DecimalPlacesTolerance } from './title-block';

/** In the order a list offers them. */
export const GOVERNING_STANDARDS = [
	'iso-8015',
	'asme-y14.5-2018',
	'asme-y14.5-2009',
	'unstated'
] as const;

export type GoverningStandard = (typeof GOVERNING_STANDARDS)[number];

/** Each standard in words, and whether it is an ASME Y14.5 edition. */
export const STANDARDS: Readonly<Record<GoverningStandard, { label: string; asme: boolean }>> = {
	'iso-8015': { label: 'ISO GPS (ISO 8015)', asme: false },
	'asme-y14.5-2018': { label: 'ASME Y14.5-2018', asme: true },
	'asme-y14.5-2009': { label: 'ASME Y14.5-2009', asme: true },
	unstated: { label: 'Not stated on the drawing', asme: false }
};

export function isAsme(standard: GoverningStandard): boolean {
	return STANDARDS[standard].asme;
}

/** An ISO 2768 general note: "ISO 2768-mK", with "-E" when it asks for the envelope. */
export interface Iso2768General {
	kind: 'iso2768';
	linear: LinearClass;
	geometric?: GeometricClass;
	envelope?: boolean;
}

export type GeneralTolerance = Iso2768General | DecimalPlacesTolerance;

/** The drawing a size sits on, as far as reading the size needs it. */
export interface DrawingContext {
	units: Units;
	standard: GoverningStandard;
	generalTolerance?: GeneralTolerance | null;
	/** Drawing notes; "PERFECT FORM AT MMC NOT REQD" lifts Rule #1. */
	notes?: string;
}

/** A general tolerance as a title block would state it: `ISO 2768-mK`, `2 places ±0.01`. */
export function describeGeneralTolerance(g: GeneralTolerance | null): string {
	if (!g) return 'none stated';
	if (g.kind === 'iso2768')
		return `ISO 2768-${g.linear}${g.geometric ?? ''}${g.envelope ? '-E' : ''}`;
	const byPlaces = Object.entries(g.byPlaces)
		.map(([n, v]) => `${n} places ±${v}`)
		.join(', ');
	return `${byPlaces}${g.angle ? `, angles ±${g.angle}°` : ''}`;
}
