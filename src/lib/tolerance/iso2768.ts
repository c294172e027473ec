/*
 * ISO 2768-1 and -2 general tolerances, read from ./tables/iso2768.ts. Sizes and results are
 * exact Lengths; sizes outside a table, or in its gaps, come back as "not covered".
 */
import { formatLength, parseDecimal, type Length } from './decimal';
import {
	ANGULAR,
	BROKEN_EDGES,
	CIRCULAR_RUNOUT,
	ISO_2768_2_STATUS,
	LINEAR,
	PERPENDICULARITY,
	STRAIGHTNESS_FLATNESS,
	SYMMETRY,
	type GeometricClass,
	type LinearClass,
	type Table
} from './tables/iso2768';

export type { GeometricClass, LinearClass } from './tables/iso2768';
export { ISO_2768_2_STATUS, LINEAR_CLASSES, GEOMETRIC_CLASSES } from './tables/iso2768';

export interface NotCovered {
	ok: false;
	reason: string;
}

export interface SizeRange {
	/** Inclusive when `fromInclusive`, else "over". */
	over: Length;
	fromInclusive: boolean;
	/** null: no upper bound. */
	upTo: Length | null;
}

export interface GeneralLinear {
	ok: true;
	/** The permissible deviation: the limits are size ± deviation. */
	deviation: Length;
	/** The published value, as printed (mm). */
	published: string;
	range: SizeRange;
}

export interface GeneralGeometric {
	ok: true;
	tolerance: Length;
	published: string;
	range: SizeRange | null;
	/** ISO 2768-2 is a withdrawn reference (2021, replaced by ISO 22081). */
	withdrawn: true;
	note: string;
}

export interface GeneralAngular {
	ok: true;
	/** Permissible deviation (±) in minutes of arc. */
	minutes: number;
	/** As printed: '1°', '0°30′'. */
	published: string;
	range: SizeRange;
}

const LINEAR_CLASSES: readonly string[] = ['f', 'm', 'c', 'v'];
const GEOMETRIC_CLASSES: readonly string[] = ['H', 'K', 'L'];

function mm(text: string): Length {
	const parsed = parseDecimal(text, 'mm');
	if (parsed === null) throw new Error(`bad table value ${text}`);
	return parsed.value;
}

function sizeText(text: string | null): string {
	return text === null ? '' : `${text} mm`;
}

// The tables as Lengths, read from their text once, on first use: a table's bounds (keyed by
// its upTo column) and each class's column of values.
const boundsRead = new WeakMap<readonly (string | null)[], (Length | null)[]>();
const valuesRead = new WeakMap<readonly (string | null)[], (Length | null)[]>();
const startsRead = new Map<string, Length>();

function lengths(column: readonly (string | null)[], read: typeof boundsRead): (Length | null)[] {
	let values = read.get(column);
	if (values === undefined) {
		values = column.map((text) => (text === null ? null : mm(text)));
		read.set(column, values);
	}
	return values;
}

/** Index of the range holding `size`, or a reason. */
function locate(
	upTo: readonly (string | null)[],
	from: string,
	size: Length,
	what: string
): { index: number; range: SizeRange } | NotCovered {
	if (!Number.isSafeInteger(size))
		return { ok: false, reason: `not covered: ${what} is not a length` };
	let start = startsRead.get(from);
	if (start === undefined) startsRead.set(from, (start = mm(from)));
	if (start > 0 ? size < start : size <= 0) {
		return {
			ok: false,
			reason:
				start > 0
					? `not covered: ${what} starts at ${from} mm; smaller sizes need their own tolerance`
					: `not covered: ${what} needs a length above 0`
		};
	}
	const bounds = lengths(upTo, boundsRead);
	for (let i = 0; i < bounds.length; i++) {
		const bound = bounds[i];
		if (bound === null || size <= bound) {
			return {
				index: i,
				range: {
					over: i === 0 ? start : (bounds[i - 1] as Length),
					fromInclusive: i === 0 && start > 0,
					upTo: bound
				}
			};
		}
	}
	return {
		ok: false,
		reason: `not covered: ${what} ends at ${sizeText(upTo[upTo.length - 1])}`
	};
}

function lookup<C extends string>(
	table: Table<C>,
	cls: C,
	size: Length,
	what: string
): { published: string; value: Length; range: SizeRange } | NotCovered {
	const at = locate(table.upTo, table.from, size, what);
	if ('ok' in at) return at;
	const column = table.values[cls];
	const published = column[at.index];
	if (published === null) {
		const { range } = at;
		const span = ` ${formatBound(range)}`;
		return { ok: false, reason: `not covered: ${what} has no class ${cls} value${span}` };
	}
	const value = lengths(column, valuesRead)[at.index] as Length;
	return { published, value, range: at.range };
}

function formatBound(range: SizeRange): string {
	const text = (v: Length) => formatLength(v, 'mm', 4).replace(/\.?0+$/, '');
	const upTo = range.upTo === null ? '' : ` up to ${text(range.upTo)} mm`;
	return `${range.fromInclusive ? 'from' : 'over'} ${text(range.over)}${upTo}`;
}

function badClass(cls: string, allowed: readonly string[], part: string): NotCovered | null {
	return allowed.includes(cls)
		? null
		: { ok: false, reason: `not covered: ${part} has no tolerance class '${cls}'` };
}

/** ISO 2768-1 table 1: ± deviation for a linear size without an individual tolerance. */
export function generalLinearTolerance(size: Length, cls: LinearClass): GeneralLinear | NotCovered {
	const bad = badClass(cls, LINEAR_CLASSES, 'ISO 2768-1');
	if (bad) return bad;
	const r = lookup(LINEAR, cls, size, 'ISO 2768-1 table 1 (linear sizes)');
	if ('ok' in r) return r;
	return { ok: true, deviation: r.value, published: r.published, range: r.range };
}

/** ISO 2768-1 table 2: ± deviation for a broken edge (external radius or chamfer height). */
export function brokenEdgeTolerance(size: Length, cls: LinearClass): GeneralLinear | NotCovered {
	const bad = badClass(cls, LINEAR_CLASSES, 'ISO 2768-1');
	if (bad) return bad;
	const r = lookup(BROKEN_EDGES, cls, size, 'ISO 2768-1 table 2 (broken edges)');
	if ('ok' in r) return r;
	return { ok: true, deviation: r.value, published: r.published, range: r.range };
}

function angleText(minutes: number): string {
	const degrees = Math.floor(minutes / 60);
	const rest = minutes % 60;
	return rest === 0 ? `${degrees}°` : `${degrees}°${rest}′`;
}

/** ISO 2768-1 table 3: ± deviation of an angle, by the length of its shorter leg. */
export function angularTolerance(
	shorterLegLength: Length,
	cls: LinearClass
): GeneralAngular | NotCovered {
	const bad = badClass(cls, LINEAR_CLASSES, 'ISO 2768-1');
	if (bad) return bad;
	const at = locate(ANGULAR.upTo, '0', shorterLegLength, 'ISO 2768-1 table 3 (angles)');
	if ('ok' in at) return at;
	const minutes = ANGULAR.values[cls][at.index];
	return { ok: true, minutes, published: angleText(minutes), range: at.range };
}

function geometric(
	table: Table<GeometricClass>,
	cls: GeometricClass,
	length: Length,
	what: string
): GeneralGeometric | NotCovered {
	const bad = badClass(cls, GEOMETRIC_CLASSES, 'ISO 2768-2');
	if (bad) return bad;
	const r = lookup(table, cls, length, what);
	if ('ok' in r) return r;
	return {
		ok: true,
		tolerance: r.value,
		published: r.published,
		range: r.range,
		withdrawn: true,
		note: ISO_2768_2_STATUS.note
	};
}

/** ISO 2768-2 table 1: general straightness and flatness tolerance, by nominal length. */
export function generalStraightnessFlatness(length: Length, cls: GeometricClass) {
	return geometric(
		STRAIGHTNESS_FLATNESS,
		cls,
		length,
		'ISO 2768-2 table 1 (straightness, flatness)'
	);
}

/** ISO 2768-2 table 2: general perpendicularity tolerance, by the shorter side (the datum is the longer). */
export function generalPerpendicularity(shorterSideLength: Length, cls: GeometricClass) {
	return geometric(
		PERPENDICULARITY,
		cls,
		shorterSideLength,
		'ISO 2768-2 table 2 (perpendicularity)'
	);
}

/** ISO 2768-2 table 3: general symmetry tolerance, by nominal length. */
export function generalSymmetry(length: Length, cls: GeometricClass) {
	return geometric(SYMMETRY, cls, length, 'ISO 2768-2 table 3 (symmetry)');
}

/** ISO 2768-2 table 4: general circular run-out tolerance (independent of size). */
export function generalCircularRunout(cls: GeometricClass): GeneralGeometric | NotCovered {
	const bad = badClass(cls, GEOMETRIC_CLASSES, 'ISO 2768-2');
	if (bad) return bad;
	const published = CIRCULAR_RUNOUT[cls];
	return {
		ok: true,
		tolerance: mm(published),
		published,
		range: null,
		withdrawn: true,
		note: ISO_2768_2_STATUS.note
	};
}
