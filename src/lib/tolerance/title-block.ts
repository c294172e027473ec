/*
 * Title-block tolerances by decimal places, the usual general tolerance on inch drawings
 * (".X ±.1, .XX ±.01, .XXX ±.005, angles ±.5°"). Each drawing states its own values, so they
 * come from the drawing's generalTolerance (PRODUCT.md §6), never from a built-in table.
 */
import { parseDecimal, type Length, type Units } from './decimal';

export interface DecimalPlacesTolerance {
	kind: 'decimal-places';
	/** Places written → ± tolerance, e.g. { "1": "0.1", "2": "0.01", "3": "0.005" }. */
	byPlaces: Readonly<Record<string, string>>;
	/** ± angle in decimal degrees, e.g. "0.5". */
	angle?: string;
}

export interface NotCovered {
	ok: false;
	reason: string;
}

export interface TitleBlockTolerance {
	ok: true;
	/** The ± deviation applied to a size written with `places` decimals. */
	deviation: Length;
	places: number;
	/** As the drawing states it. */
	published: string;
}

export interface TitleBlockAngle {
	ok: true;
	/** ± decimal degrees, as the drawing states it. */
	degrees: string;
	/** The same in whole seconds of arc, or null when it is not a whole number of them. */
	arcSeconds: number | null;
}

function readValue(text: string): string {
	return text.trim().replace(/^±\s*/, '');
}

/** The ± tolerance a drawing's title block gives a size written with `places` decimals. */
export function titleBlockTolerance(
	places: number,
	generalTolerance: DecimalPlacesTolerance | null | undefined,
	units: Units = 'in'
): TitleBlockTolerance | NotCovered {
	if (!generalTolerance || generalTolerance.kind !== 'decimal-places') {
		return { ok: false, reason: 'not covered: the drawing states no tolerance by decimal places' };
	}
	if (!Number.isInteger(places) || places < 0) {
		return { ok: false, reason: `not covered: ${places} is not a number of decimal places` };
	}
	const text = generalTolerance.byPlaces[String(places)];
	if (text === undefined) {
		const stated = Object.keys(generalTolerance.byPlaces).sort().join(', ');
		return {
			ok: false,
			reason: `not covered: the title block gives no tolerance for ${places} decimal places (it gives ${stated || 'none'})`
		};
	}
	const published = readValue(text);
	const parsed = parseDecimal(published, units);
	if (parsed === null || parsed.value <= 0) {
		return { ok: false, reason: `not covered: '${text}' is not a usable tolerance` };
	}
	return { ok: true, deviation: parsed.value, places, published };
}

/** The ± angular tolerance a drawing's title block states, if any. */
export function titleBlockAngle(
	generalTolerance: DecimalPlacesTolerance | null | undefined
): TitleBlockAngle | NotCovered {
	if (!generalTolerance || generalTolerance.kind !== 'decimal-places' || !generalTolerance.angle) {
		return { ok: false, reason: 'not covered: the title block states no angular tolerance' };
	}
	const degrees = readValue(generalTolerance.angle).replace(/°$/, '');
	// Read as a decimal on the mm grid (1e-7 of a degree), then scale exactly to seconds.
	const parsed = parseDecimal(degrees, 'mm');
	if (parsed === null || parsed.value <= 0) {
		return { ok: false, reason: `not covered: '${generalTolerance.angle}' is not a usable angle` };
	}
	const scaled = parsed.value * 3600;
	const arcSeconds = scaled % 10_000_000 === 0 ? scaled / 10_000_000 : null;
	return { ok: true, degrees, arcSeconds };
}
