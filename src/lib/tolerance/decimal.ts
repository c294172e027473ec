/*
 * Exact lengths. A length is an integer count of 0.1 nm (1e-7 mm): 1 mm = 10^7 and, since
 * 1 in = 25.4 mm exactly, 1 in = 254 × 10^6. Every decimal a drawing can carry (mm to seven
 * places, inch to six) is an exact integer, so sums, differences and comparisons are plain
 * integer arithmetic on JS numbers, exact up to ±900 m. We chose this over a decimal library
 * for speed: the core evaluates 100,000 features in well under a second with no allocation
 * per operation. Text is parsed digit by digit; no float ever holds a size.
 */

export const UNITS = ['mm', 'in'] as const;
export type Units = (typeof UNITS)[number];

declare const exact: unique symbol;

/**
 * An exact length: an integer count of 0.1 nm (1e-7 mm). 1 in = 254_000_000 exactly. Branded,
 * so a plain number (a float read from somewhere) cannot be passed where a Length is expected:
 * lengths come from parseDecimal and the table readers, and arithmetic on them goes through
 * add, sub, neg and times below (plain `+` and `-` give a number).
 */
export type Length = number & { readonly [exact]: true };

/** An integer count of 0.1 nm as a Length (tables, tests). Throws on anything else. */
export function toLength(count: number): Length {
	if (!Number.isSafeInteger(count)) throw new RangeError(`${count} is not an exact length`);
	return (count + 0) as Length;
}

export const ZERO = 0 as Length;

export function add(a: Length, b: Length): Length {
	return (a + b) as Length;
}

export function sub(a: Length, b: Length): Length {
	return (a - b) as Length;
}

export function neg(a: Length): Length {
	return (0 - a) as Length;
}

/** a × k for a whole number k. */
export function times(a: Length, k: number): Length {
	return (a * k) as Length;
}

export type Rounding = 'nearest' | 'up' | 'down';

export const PER_MM = 10_000_000;
export const PER_INCH = 254_000_000;
export const PER_MICROMETRE = 10_000;
/** One inch thousandth ("thou", 0.001 in). */
export const PER_THOU = 254_000;

/** Places beyond which a decimal in that unit is no longer on the integer grid in general. */
const EXACT_PLACES: Record<Units, number> = { mm: 7, in: 6 };

const POW10 = [
	1, 10, 100, 1_000, 10_000, 100_000, 1_000_000, 10_000_000, 100_000_000, 1_000_000_000,
	10_000_000_000, 100_000_000_000, 1_000_000_000_000, 10_000_000_000_000, 100_000_000_000_000,
	1_000_000_000_000_000
];

export function perUnit(units: Units): number {
	return units === 'mm' ? PER_MM : PER_INCH;
}

/**
 * Reads a decimal written in `units`: optional sign (+, -, U+2212), digits, and a point or
 * the ISO decimal comma ('25.021', '.875', '0,875', '-0.02', '+.002'). Returns null for
 * anything else, or for a value the 0.1 nm grid cannot hold exactly.
 */
export function parseDecimal(text: string, units: Units): { value: Length; places: number } | null {
	const end = text.length;
	let i = 0;
	let negative = false;
	const c0 = text.charCodeAt(0);
	if (c0 === 43 /* + */) i = 1;
	else if (c0 === 45 /* - */ || c0 === 0x2212) {
		negative = true;
		i = 1;
	}
	const r = scanDecimal(text, i, end, units);
	if (r === null || r.end !== end) return null;
	return { value: negative ? ((-r.value || 0) as Length) : r.value, places: r.places };
}

/**
 * Scans an unsigned decimal at `start` (stopping at the first character that cannot continue
 * it, no further than `end`). Used by the callout scanner to avoid slicing strings.
 */
export function scanDecimal(
	text: string,
	start: number,
	end: number,
	units: Units
): { value: Length; places: number; end: number } | null {
	let i = start;
	let whole = 0;
	let wholeDigits = 0;
	while (i < end) {
		const c = text.charCodeAt(i) - 48;
		if (c < 0 || c > 9) break;
		whole = whole * 10 + c;
		wholeDigits++;
		i++;
	}
	let places = 0;
	let fraction = 0;
	let significantPlaces = 0;
	if (i < end) {
		const sep = text.charCodeAt(i);
		if (sep === 46 /* . */ || sep === 44 /* , */) {
			const next = i + 1 < end ? text.charCodeAt(i + 1) - 48 : -1;
			if (next >= 0 && next <= 9) {
				i++;
				while (i < end) {
					const c = text.charCodeAt(i) - 48;
					if (c < 0 || c > 9) break;
					places++;
					if (places > 15) return null;
					fraction = fraction * 10 + c;
					if (c !== 0) significantPlaces = places;
					i++;
				}
			}
		}
	}
	if (wholeDigits === 0 && places === 0) return null;
	if (wholeDigits > 9) return null;
	// Drop trailing zeros so '25.0000000' still lands on the grid.
	const sig = fraction / POW10[places - significantPlaces];
	const per = units === 'mm' ? PER_MM : PER_INCH;
	let fractionValue = 0;
	if (significantPlaces > 0) {
		if (significantPlaces <= EXACT_PLACES[units]) {
			fractionValue = (sig * per) / POW10[significantPlaces];
		} else {
			const num = BigInt(sig) * BigInt(per);
			const den = BigInt(POW10[significantPlaces]);
			if (num % den !== 0n) return null;
			fractionValue = Number(num / den);
		}
	}
	const value = whole * per + fractionValue;
	if (!Number.isSafeInteger(value)) return null;
	return { value: value as Length, places, end: i };
}

/** Exact for multiples of 0.1 µm (ISO 286 IT01 for sizes to 3 mm is 0.3 µm). */
export function fromMicrometres(um: number): Length {
	return (Math.round(um * 10) * (PER_MICROMETRE / 10)) as Length;
}

/** Inch thousandths (ANSI B4.1 tables), exact for multiples of 0.1 thou. */
export function fromThousandths(thou: number): Length {
	return (Math.round(thou * 10) * (PER_THOU / 10)) as Length;
}

/** Integer division with one rounding: 'up' toward +∞, 'down' toward −∞, 'nearest' half away from zero. */
function divideRounded(numerator: number, denominator: number, rounding: Rounding): number {
	if (denominator < 0) {
		numerator = -numerator;
		denominator = -denominator;
	}
	const q = Math.trunc(numerator / denominator);
	const r = numerator - q * denominator;
	if (r === 0) return q;
	if (rounding === 'up') return r > 0 ? q + 1 : q;
	if (rounding === 'down') return r < 0 ? q - 1 : q;
	const twice = 2 * Math.abs(r);
	if (twice >= denominator) return r > 0 ? q + 1 : q - 1;
	return q;
}

function divideRoundedBig(numerator: bigint, denominator: bigint, rounding: Rounding): bigint {
	if (denominator < 0n) {
		numerator = -numerator;
		denominator = -denominator;
	}
	const q = numerator / denominator;
	const r = numerator - q * denominator;
	if (r === 0n) return q;
	if (rounding === 'up') return r > 0n ? q + 1n : q;
	if (rounding === 'down') return r < 0n ? q - 1n : q;
	const twice = 2n * (r < 0n ? -r : r);
	if (twice >= denominator) return r > 0n ? q + 1n : q - 1n;
	return q;
}

/** value × numerator / denominator with a single rounding at the end (exact when it divides). */
export function mulDiv(
	value: Length,
	numerator: number,
	denominator: number,
	rounding: Rounding
): Length {
	const product = value * numerator;
	if (Number.isSafeInteger(product) && Number.isSafeInteger(denominator) && denominator !== 0) {
		return divideRounded(product, denominator, rounding) as Length;
	}
	return Number(
		divideRoundedBig(BigInt(value) * BigInt(numerator), BigInt(denominator), rounding)
	) as Length;
}

/** value × numerator / denominator for factors beyond a safe integer, with one rounding. */
export function mulDivBig(
	value: Length,
	numerator: bigint,
	denominator: bigint,
	rounding: Rounding
): Length {
	return Number(divideRoundedBig(BigInt(value) * numerator, denominator, rounding)) as Length;
}

/** Count of units of the last place: 25.021 mm at 3 places → 25021. */
function placeCount(value: Length, units: Units, places: number, rounding: Rounding): number {
	const per = perUnit(units);
	if (places <= EXACT_PLACES[units]) return divideRounded(value, per / POW10[places], rounding);
	return Number(divideRoundedBig(BigInt(value) * BigInt(POW10[places]), BigInt(per), rounding));
}

/** The length rounded to `places` decimals of `units`, on the 0.1 nm grid. */
export function roundToPlaces(
	value: Length,
	units: Units,
	places: number,
	rounding: Rounding
): Length {
	if (places <= EXACT_PLACES[units]) {
		const step = perUnit(units) / POW10[places];
		return (divideRounded(value, step, rounding) * step) as Length;
	}
	// Finer than the grid can hold in inch: the grid itself is the rounding.
	const count = placeCount(value, units, places, rounding);
	return mulDiv(count as Length, perUnit(units), POW10[places], rounding);
}

export interface FormatOptions {
	/** Inch drawings omit it (".8750", ASME Y14.5); JSON and metric keep it. Default true. */
	leadingZero?: boolean;
	rounding?: Rounding;
	/** ISO drawings may use the decimal comma. Default '.'. */
	decimalSeparator?: '.' | ',';
}

export function formatLength(
	value: Length,
	units: Units,
	places: number,
	opts: FormatOptions = {}
): string {
	const count = placeCount(value, units, places, opts.rounding ?? 'nearest');
	const negative = count < 0;
	let digits = String(negative ? -count : count);
	if (places > 0 && digits.length <= places)
		digits = '0'.repeat(places - digits.length + 1) + digits;
	let whole = places > 0 ? digits.slice(0, digits.length - places) : digits;
	if (whole === '0' && places > 0 && opts.leadingZero === false) whole = '';
	const text = places > 0 ? whole + (opts.decimalSeparator ?? '.') + digits.slice(-places) : whole;
	return negative ? '-' + text : text;
}

/**
 * Converts a pair of limits to `places` decimals of `toUnits`, rounding the lower limit up and
 * the upper limit down, so the converted zone never reaches outside the original one. A zone
 * narrower than one place may come back with lower > upper; the caller must say so.
 */
export function convertLimitsInward(
	lower: Length,
	upper: Length,
	toUnits: Units,
	places: number
): { lower: Length; upper: Length } {
	return {
		lower: roundToPlaces(lower, toUnits, places, 'up'),
		upper: roundToPlaces(upper, toUnits, places, 'down')
	};
}

export function compare(a: Length, b: Length): -1 | 0 | 1 {
	return a < b ? -1 : a > b ? 1 : 0;
}

export function min(a: Length, b: Length): Length {
	return a < b ? a : b;
}

export function max(a: Length, b: Length): Length {
	return a > b ? a : b;
}

export function abs(a: Length): Length {
	return a < 0 ? neg(a) : a;
}
