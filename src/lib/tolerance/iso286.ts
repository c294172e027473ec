/*
 * ISO 286-1/-2:2010 limits and fits read from the tables in ./tables/iso286.ts. Every result is
 * an exact Length; whatever the standard leaves blank comes back as "not defined" with the
 * reason, never extrapolated.
 */
import {
	PER_MICROMETRE,
	PER_MM,
	ZERO,
	add,
	formatLength,
	mulDiv,
	neg,
	parseDecimal,
	sub,
	toLength,
	type Length
} from './decimal';
import {
	DELTA,
	GRADES,
	J_HOLE,
	J_SHAFT,
	K_SHAFT_IT4_TO_IT7,
	M6_250_TO_315_ES,
	MAIN_RANGES_MM,
	SHAFT_DEVIATIONS,
	STANDARD_TOLERANCES,
	type Grade,
	type Steps
} from './tables/iso286';

export type { Grade } from './tables/iso286';
export { GRADES } from './tables/iso286';

export interface NotDefined {
	ok: false;
	reason: string;
}

export interface IsoLimits {
	ok: true;
	/** The code as read, e.g. 'H7', 'js5'. */
	code: string;
	/** Fundamental deviation letter(s) as written: 'H', 'js', 'ZC'. */
	letter: string;
	grade: Grade;
	/** True for a hole (upper-case letter), false for a shaft. */
	internal: boolean;
	/** The standard tolerance of the grade at this size. */
	it: Length;
	fundamentalDeviation: Length;
	upperDeviation: Length;
	lowerDeviation: Length;
	upper: Length;
	lower: Length;
}

export type IsoLimitsResult = IsoLimits | NotDefined;

const MAX_SIZE = 3150 * PER_MM;
const SIZE_500 = 500 * PER_MM;

const SHAFT_LETTERS = [
	'a',
	'b',
	'c',
	'cd',
	'd',
	'e',
	'ef',
	'f',
	'fg',
	'g',
	'h',
	'js',
	'j',
	'k',
	'm',
	'n',
	'p',
	'r',
	's',
	't',
	'u',
	'v',
	'x',
	'y',
	'z',
	'za',
	'zb',
	'zc'
] as const;

export const SHAFT_POSITIONS: readonly string[] = SHAFT_LETTERS;
export const HOLE_POSITIONS: readonly string[] = SHAFT_LETTERS.map((l) => l.toUpperCase());

function micrometres(text: string): Length {
	const parsed = parseDecimal(text, 'mm');
	if (parsed === null) throw new Error(`bad table value ${text}`);
	return mulDiv(parsed.value, 1, 1000, 'nearest');
}

function mm(size: Length): string {
	return `${formatLength(size, 'mm', 4).replace(/\.?0+$/, '')} mm`;
}

function outOfRange(size: Length): NotDefined | null {
	if (!Number.isSafeInteger(size) || size <= 0) {
		return { ok: false, reason: 'not defined: ISO 286 sizes start above 0 mm' };
	}
	if (size > MAX_SIZE) {
		return { ok: false, reason: `not defined: ISO 286 covers sizes up to 3150 mm (${mm(size)})` };
	}
	return null;
}

const MAIN_BOUNDS: readonly Length[] = MAIN_RANGES_MM.map((upTo) => toLength(upTo * PER_MM));

function mainRangeIndex(size: Length): number {
	for (let i = 0; i < MAIN_BOUNDS.length; i++) if (size <= MAIN_BOUNDS[i]) return i;
	return -1;
}

// Tables 1 and 3 as Lengths, read from their text once, on first use.
let standardTolerances: (Length | null)[][] | null = null;
let deltas: Length[][] | null = null;

function standardToleranceAt(range: number, gradeIndex: number): Length | null {
	standardTolerances ??= STANDARD_TOLERANCES.map((row) =>
		row.map((text) => (text === null ? null : micrometres(text)))
	);
	return standardTolerances[range][gradeIndex];
}

function deltaAt(range: number, column: number): Length {
	deltas ??= DELTA.map((row) => row.map(micrometres));
	return deltas[range][column];
}

const GRADE_INDEX = new Map<string, number>(GRADES.map((g, i) => [g, i]));

/** A column of table 2 or 3 as Lengths: range bounds and the deviation in each range. */
interface Column {
	bounds: Length[];
	values: (Length | null)[];
}

// Each column is converted to Lengths once, on first use.
const columns = new WeakMap<Steps, Column>();

function columnOf(steps: Steps): Column {
	let column = columns.get(steps);
	if (column === undefined) {
		column = {
			bounds: steps.map(([upTo]) => toLength(upTo * PER_MM)),
			values: steps.map(([, value]) => (value === null ? null : toLength(value * PER_MICROMETRE)))
		};
		columns.set(steps, column);
	}
	return column;
}

/** The deviation for a size, or undefined when the column ends below it, null when blank. */
function stepAt(steps: Steps, size: Length): Length | null | undefined {
	const { bounds, values } = columnOf(steps);
	for (let i = 0; i < bounds.length; i++) if (size <= bounds[i]) return values[i];
	return undefined;
}

export function parseGrade(text: string): Grade | null {
	const g = text.toUpperCase().startsWith('IT') ? text.toUpperCase() : `IT${text}`;
	return (GRADES as readonly string[]).includes(g) ? (g as Grade) : null;
}

function gradeNumber(grade: Grade): number {
	// IT01 → -1, IT0 → 0, IT1 → 1 …, read from the digits without making a substring.
	const tens = grade.charCodeAt(2) - 48;
	if (grade.length === 3) return tens;
	return tens === 0 ? -1 : tens * 10 + grade.charCodeAt(3) - 48;
}

/** ISO 286-1 table 1: the standard tolerance of a grade at a nominal size. */
export function standardTolerance(
	size: Length,
	grade: Grade | string | number
): { ok: true; value: Length; grade: Grade } | NotDefined {
	const g =
		typeof grade === 'string' && GRADE_INDEX.has(grade)
			? (grade as Grade)
			: parseGrade(String(grade));
	if (g === null) return { ok: false, reason: `not defined: no standard tolerance grade ${grade}` };
	const bad = outOfRange(size);
	if (bad) return bad;
	const n = gradeNumber(g);
	if (n >= 14 && size <= PER_MM) {
		return { ok: false, reason: `not defined: ${g} is not used for sizes up to 1 mm` };
	}
	const value = standardToleranceAt(mainRangeIndex(size), n + 1);
	if (value === null) {
		return { ok: false, reason: `not defined: ${g} is not tabulated above 500 mm` };
	}
	return { ok: true, value, grade: g };
}

/** ISO 286-1 table 3: Δ for grades IT3 to IT8, sizes up to 500 mm. */
function delta(size: Length, grade: Grade): Length | null {
	const n = gradeNumber(grade);
	if (n < 3 || n > 8 || size > SIZE_500) return null;
	return deltaAt(mainRangeIndex(size), n - 3);
}

const CODE = /^([A-Za-z]{1,2})(01|0|[1-9]|1[0-8])$/;
const A_TO_H = ['a', 'b', 'c', 'cd', 'd', 'e', 'ef', 'f', 'fg', 'g', 'h'];

interface IsoCode {
	letter: string;
	grade: Grade;
	internal: boolean;
	/** As written back: letter and grade number ('H7'). */
	code: string;
	/** Holes A–H and shafts a–h. */
	aToH: boolean;
}

function readIsoCode(code: string): IsoCode | null {
	const m = CODE.exec(code.trim());
	if (!m) return null;
	const letter = m[1];
	const lower = letter.toLowerCase();
	if (!(SHAFT_LETTERS as readonly string[]).includes(lower)) return null;
	// 'Js' or 'jS' says neither hole nor shaft.
	if (letter !== lower && letter !== letter.toUpperCase()) return null;
	return {
		letter,
		grade: `IT${m[2]}` as Grade,
		internal: letter !== lower,
		code: `${letter}${m[2]}`,
		aToH: A_TO_H.includes(lower)
	};
}

// Codes read so far. Only valid codes written without spaces are kept, so it stays small
// (at most one entry per letter and grade).
const isoCodes = new Map<string, IsoCode>();

function isoCode(code: string): IsoCode | null {
	const known = isoCodes.get(code);
	if (known !== undefined) return known;
	const parsed = readIsoCode(code);
	if (parsed !== null && parsed.code === code) isoCodes.set(code, parsed);
	return parsed;
}

export function parseIsoCode(
	code: string
): { letter: string; grade: Grade; internal: boolean } | null {
	const parsed = isoCode(code);
	if (parsed === null) return null;
	return { letter: parsed.letter, grade: parsed.grade, internal: parsed.internal };
}

type Deviation = { value: Length } | NotDefined;

const notDefined = (reason: string): NotDefined => ({
	ok: false,
	reason: `not defined: ${reason}`
});

/**
 * es for a–h (upper) or ei for j–zc (lower) of a shaft, from table 2. `shown` is the letter
 * named in a reason (the hole's letter when a hole borrows the shaft's value).
 */
function shaftFundamental(letter: string, size: Length, grade: Grade, shown = letter): Deviation {
	const n = gradeNumber(grade);
	if ((letter === 'a' || letter === 'b') && size <= PER_MM) {
		return notDefined(`${shown} is not used for sizes up to 1 mm`);
	}
	if (letter === 'j') {
		const row = n === 5 || n === 6 ? '5-6' : n === 7 ? '7' : n === 8 ? '8' : null;
		if (row === null) return notDefined('j is tabulated for grades 5 to 8 only (j8 up to 3 mm)');
		const v = stepAt(J_SHAFT[row], size);
		if (v === undefined || v === null) {
			return notDefined(
				row === '8' ? 'j8 is tabulated up to 3 mm only' : 'j is not tabulated above 500 mm'
			);
		}
		return { value: v };
	}
	if (letter === 'k') {
		if (size > SIZE_500 || n < 4 || n > 7) return { value: ZERO };
		return { value: stepAt(K_SHAFT_IT4_TO_IT7, size) as Length };
	}
	const v = stepAt(SHAFT_DEVIATIONS[letter], size);
	if (v === undefined) return notDefined(`${shown} is not tabulated above ${lastBound(letter)} mm`);
	if (v === null) return notDefined(`${shown} is not tabulated up to ${firstDefined(letter)} mm`);
	return { value: v };
}

function lastBound(letter: string): number {
	const steps = SHAFT_DEVIATIONS[letter];
	return steps[steps.length - 1][0];
}

function firstDefined(letter: string): number {
	let bound = 0;
	for (const [upTo, v] of SHAFT_DEVIATIONS[letter]) {
		if (v !== null) break;
		bound = upTo;
	}
	return bound;
}

/** ISO 286-1 4.3.2.4 and the js/JS rows of ISO 286-2: half the IT, odd µm rounded down for IT7–IT11. */
function halfTolerance(it: Length, grade: Grade): Length {
	const n = gradeNumber(grade);
	if (n >= 7 && n <= 11 && it % (2 * PER_MICROMETRE) === PER_MICROMETRE) {
		return toLength((it - PER_MICROMETRE) / 2);
	}
	return toLength(it / 2);
}

function holeFundamental(letter: string, size: Length, grade: Grade): Deviation {
	const n = gradeNumber(grade);
	const shaft = letter.toLowerCase();
	if (A_TO_H.includes(shaft)) {
		const es = shaftFundamental(shaft, size, grade, letter);
		return 'value' in es ? { value: neg(es.value) } : es;
	}
	if (letter === 'J') {
		const row = n === 6 ? '6' : n === 7 ? '7' : n === 8 ? '8' : null;
		if (row === null) return notDefined('J is tabulated for grades 6, 7 and 8 only');
		const v = stepAt(J_HOLE[row], size);
		if (v === undefined || v === null) return notDefined('J is not tabulated above 500 mm');
		return { value: v };
	}
	if (letter === 'K' || letter === 'M' || letter === 'N') {
		const ei =
			letter === 'K'
				? size > SIZE_500
					? ZERO
					: (stepAt(K_SHAFT_IT4_TO_IT7, size) as Length)
				: (stepAt(SHAFT_DEVIATIONS[shaft], size) as Length);
		// Above 500 mm one value serves every grade and no Δ is added.
		if (size > SIZE_500) return { value: neg(ei) };
		if (n <= 8) {
			if (letter === 'M' && n === 6 && size > 250 * PER_MM && size <= 315 * PER_MM) {
				return { value: toLength(M6_250_TO_315_ES * PER_MICROMETRE) };
			}
			const d = delta(size, grade);
			if (d === null)
				return notDefined(
					`Δ is tabulated for IT3 to IT8 only, so ${letter}${grade.slice(2)} has no ES`
				);
			return { value: add(neg(ei), d) };
		}
		// ISO 286-2 tabulates K above IT8 only up to 3 mm (ES = 0); larger sizes show no value.
		if (letter === 'K')
			return size <= 3 * PER_MM
				? { value: ZERO }
				: notDefined('K above IT8 is tabulated for sizes up to 3 mm only');
		if (letter === 'M') return { value: neg(ei) };
		if (size <= PER_MM) return notDefined('N above IT8 is not used for sizes up to 1 mm');
		return { value: size <= 3 * PER_MM ? toLength(-4 * PER_MICROMETRE) : ZERO };
	}
	// P to ZC: ES = −ei of the shaft, plus Δ up to IT7 (sizes up to 500 mm).
	const ei = shaftFundamental(shaft, size, grade, letter);
	if (!('value' in ei)) return ei;
	if (n <= 7 && size <= SIZE_500) {
		const d = delta(size, grade);
		if (d === null)
			return notDefined(
				`Δ is tabulated for IT3 to IT8 only, so ${letter}${grade.slice(2)} has no ES`
			);
		return { value: add(neg(ei.value), d) };
	}
	return { value: neg(ei.value) };
}

/** Limits of an ISO 286 tolerance class ('H7', 'g6', 'js5', 'ZC11') at a nominal size. */
export function isoLimits(size: Length, code: string): IsoLimitsResult {
	const parsed = isoCode(code);
	if (parsed === null)
		return { ok: false, reason: `not defined: '${code}' is not an ISO 286 tolerance class` };
	const { letter, grade, internal } = parsed;
	const bad = outOfRange(size);
	if (bad) return bad;
	const tol = standardTolerance(size, grade);
	if (!tol.ok) return tol;
	const it = tol.value;
	let upperDeviation: Length;
	let lowerDeviation: Length;
	let fundamentalDeviation: Length;
	if (letter === 'js' || letter === 'JS') {
		const half = halfTolerance(it, grade);
		upperDeviation = half;
		lowerDeviation = neg(half);
		fundamentalDeviation = internal ? lowerDeviation : upperDeviation;
	} else {
		const dev = internal
			? holeFundamental(letter, size, grade)
			: shaftFundamental(letter, size, grade);
		if (!('value' in dev)) return dev;
		// + 0 turns a −0 from a negated zero into 0.
		fundamentalDeviation = add(dev.value, ZERO);
		// Holes A–H and shafts j–zc take the lower deviation as fundamental.
		if (internal === parsed.aToH) {
			lowerDeviation = fundamentalDeviation;
			upperDeviation = add(fundamentalDeviation, it);
		} else {
			upperDeviation = fundamentalDeviation;
			lowerDeviation = sub(fundamentalDeviation, it);
		}
	}
	return {
		ok: true,
		code: parsed.code,
		letter,
		grade,
		internal,
		it,
		fundamentalDeviation,
		upperDeviation,
		lowerDeviation,
		upper: add(size, upperDeviation),
		lower: add(size, lowerDeviation)
	};
}

export type FitClassification = 'clearance' | 'transition' | 'interference';

export interface IsoFit {
	ok: true;
	hole: IsoLimits;
	shaft: IsoLimits;
	/** Hole lower minus shaft upper: negative means interference. */
	minClearance: Length;
	/** Hole upper minus shaft lower. */
	maxClearance: Length;
	classification: FitClassification;
	system: 'hole-basis' | 'shaft-basis' | 'other';
}

export function classifyFit(minClearance: Length, maxClearance: Length): FitClassification {
	if (minClearance >= 0) return 'clearance';
	if (maxClearance <= 0) return 'interference';
	return 'transition';
}

/** A fit designation such as 'H7/g6' at a nominal size. */
export function isoFit(size: Length, designation: string): IsoFit | NotDefined {
	const [holeCode, shaftCode] = designation.split('/').map((s) => s.trim());
	if (!holeCode || !shaftCode)
		return { ok: false, reason: `not defined: '${designation}' is not hole/shaft` };
	const hole = isoLimits(size, holeCode);
	if (!hole.ok) return hole;
	if (!hole.internal)
		return { ok: false, reason: `not defined: '${holeCode}' is a shaft class, not a hole` };
	const shaft = isoLimits(size, shaftCode);
	if (!shaft.ok) return shaft;
	if (shaft.internal)
		return { ok: false, reason: `not defined: '${shaftCode}' is a hole class, not a shaft` };
	const minClearance = sub(hole.lower, shaft.upper);
	const maxClearance = sub(hole.upper, shaft.lower);
	return {
		ok: true,
		hole,
		shaft,
		minClearance,
		maxClearance,
		classification: classifyFit(minClearance, maxClearance),
		system: hole.letter === 'H' ? 'hole-basis' : shaft.letter === 'h' ? 'shaft-basis' : 'other'
	};
}
