import type { Length, Units } from './decimal';

/**
 * A number as the drafter wrote it: its exact length, how many decimal places the text had
 * (25.000 → 3; trailing zeros carry meaning on a drawing) and, for inch fractions, the
 * fraction itself (1 1/2 → whole 1, numerator 1, denominator 2; places 0).
 */
export interface WrittenValue {
	value: Length;
	places: number;
	fraction?: { whole: number; numerator: number; denominator: number };
}

/** A signed deviation from the nominal size, e.g. +0.021 or −.000. */
export type Deviation = WrittenValue;

export type CalloutSymbol =
	| 'diameter' // Ø, ⌀, DIA
	| 'radius' // R
	| 'controlledRadius' // CR (ASME Y14.5)
	| 'sphericalDiameter' // SØ
	| 'sphericalRadius'; // SR

/**
 * An ISO 286 tolerance class: fundamental deviation letter(s) and IT grade. Upper case is a
 * hole (internal feature), lower case a shaft (external). `grade` is kept as written
 * ('01', '0', '7', '18') because IT01 and IT0 are not numbers in sequence.
 */
export interface ToleranceClass {
	code: string;
	deviation: string;
	grade: string;
	feature: 'hole' | 'shaft';
}

/**
 * The numeric tolerance written on the callout.
 * - `limits`: two limits of size, lower-first with a dash (25.000-25.021) or upper over lower
 *   (25.021/25.000); `upperFirst` records which the drafter wrote first.
 * - `bilateral`: equal ± deviation from the nominal.
 * - `deviations`: unequal or unilateral deviations from the nominal (+0.021/0, 0/−0.02).
 * - `single`: one limit only; the nominal is that limit (25 MIN, R0.5 MAX).
 */
export type Tolerance =
	| { type: 'limits'; lower: WrittenValue; upper: WrittenValue; upperFirst: boolean }
	| { type: 'bilateral'; deviation: WrittenValue }
	| { type: 'deviations'; upper: Deviation; lower: Deviation }
	| { type: 'single'; limit: 'min' | 'max' };

/**
 * Modifiers written after the size. ASME Y14.5 / ISO 14405-1 symbols; the ISO 14405-1 size
 * specification modifiers are kept by their two-letter code.
 */
export type Modifier =
	| 'envelope' // Ⓔ (E)
	| 'independency' // Ⓘ (I)
	| 'freeState' // Ⓕ (F)
	| 'statistical' // ⟨ST⟩
	| 'continuousFeature' // ⟨CF⟩
	| 'twoPointSize' // (LP)
	| 'sphereSize' // (LS)
	| 'leastSquaresSize' // (GG)
	| 'maximumInscribedSize' // (GX)
	| 'minimumCircumscribedSize' // (GN)
	| 'circumferenceDiameter' // (CC)
	| 'areaDiameter' // (CA)
	| 'volumeDiameter'; // (CV)

export interface MetricThread {
	system: 'metric';
	/** Nominal (major) diameter in mm. */
	diameter: WrittenValue;
	/** Pitch in mm when written (M6x1); null for the coarse pitch (M10). */
	pitch: WrittenValue | null;
	/** ISO 965-1 tolerance class as written: '6H', '6g', '5g6g'; null when omitted. */
	toleranceClass: string | null;
	leftHand: boolean;
}

export interface UnifiedThread {
	system: 'unified';
	/** Nominal diameter in inch: a fraction (1/4), a decimal (.250) or a number size (#10). */
	diameter: WrittenValue;
	numberSize: number | null;
	threadsPerInch: number;
	/** UNC, UNF, UNEF, UN, UNS, UNR… as written. */
	series: string;
	/** ASME B1.1 class: '1A', '2A', '3A' (external), '1B', '2B', '3B' (internal). */
	toleranceClass: string | null;
	leftHand: boolean;
}

export type ThreadSpec = MetricThread | UnifiedThread;

/**
 * One size callout, read. Lengths are exact (see decimal.ts); `units` is the drawing's unit
 * the numbers were read in. `formatCallout` writes the canonical text back, and parsing that
 * text gives this same object.
 *
 * - `kind`: `size` (a toleranced or toleranceable size), `basic` ([25], theoretically exact,
 *   no tolerance), `reference` ((25) or 25 REF, information only, no tolerance), `thread`.
 * - `nominal`: the size written before any tolerance; null for a bare limit pair.
 * - `toleranceClass` / `fit`: an ISO 286 class (Ø25 H7) or a fit designation (Ø25 H7/g6).
 *   The parser does not compute their limits; iso286.ts does.
 * - `classPlacement`: when both a class and a numeric tolerance are written, whether the
 *   class came first with the numbers in parentheses ('before': Ø25 H7 (25.000/25.021)) or
 *   the numbers first and the class in parentheses ('after': 25.000/25.021 (H7)).
 * - `decimalSeparator`: ',' when the text used the ISO decimal comma.
 */
export interface CalloutSpec {
	kind: 'size' | 'basic' | 'reference' | 'thread';
	units: Units;
	quantity: number | null;
	symbol: CalloutSymbol | null;
	nominal: WrittenValue | null;
	tolerance: Tolerance | null;
	toleranceClass: ToleranceClass | null;
	fit: { hole: ToleranceClass; shaft: ToleranceClass } | null;
	classPlacement: 'before' | 'after' | null;
	modifiers: Modifier[];
	thread: ThreadSpec | null;
	thru: boolean;
	depth: WrittenValue | null;
	decimalSeparator: '.' | ',';
}

export interface ParseOptions {
	units: Units;
	/** When the caller knows the feature, a class of the wrong case is an error. */
	feature?: 'hole' | 'shaft';
}

export type ParseResult =
	{ ok: true; spec: CalloutSpec } | { ok: false; message: string; position: number };
