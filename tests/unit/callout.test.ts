import { describe, expect, it } from 'vitest';
import {
	calloutLimits,
	formatCallout,
	parseCallout,
	parseDecimal,
	type CalloutSpec,
	type Modifier,
	type Units
} from '../../src/lib/tolerance';

/*
 * Sources named beside each case. Clause numbers marked "recalled" were written from memory
 * and should be checked against the standard before they are quoted to a customer.
 * ASME_1_6_1 etc. name ASME Y14.5-2018 clauses.
 */
const ASME_METRIC =
	'ASME Y14.5-2018 §4 (recalled; §1.6.1 in 2009): metric values keep the leading zero';
const ASME_INCH = 'ASME Y14.5-2018 §4 (recalled; §1.6.2 in 2009): inch values have no leading zero';
const ASME_UNILATERAL_MM =
	'ASME Y14.5-2018 §4 (recalled; §1.6.1(a) in 2009): a nil metric deviation is a single 0 without sign';
const ASME_UNILATERAL_IN =
	'ASME Y14.5-2018 §4 (recalled; §1.6.2(b) in 2009): a nil inch deviation has the same places and a sign';
const ASME_LIMITS =
	'ASME Y14.5-2018 §5 tolerancing of size (recalled; §2.2(a) in 2009): limits stacked high over low, or low-high on one line';
const ASME_BILATERAL = 'ASME Y14.5-2018 §5 (recalled; §2.2(b) in 2009): plus-and-minus tolerancing';
const ASME_SINGLE = 'ASME Y14.5-2018 §5 (recalled; §2.2(c) in 2009): single limits MIN, MAX';
const ASME_SYMBOLS =
	'ASME Y14.5-2018 §6 symbology (recalled; §3.3 in 2009): Ø, R, CR, SØ, SR, depth ↧, places 4X';
const ASME_BASIC =
	'ASME Y14.5-2018 §3 definitions and §6 symbology (recalled; §1.3 and §3.3 in 2009): basic dimension in a frame';
const ASME_REFERENCE =
	'ASME Y14.5-2018 §4 (recalled; §1.7 in 2009): reference dimension in parentheses';
const ASME_MODIFIERS =
	'ASME Y14.5-2018 §6 symbology (recalled; §3.3 in 2009): Ⓕ free state, ⟨ST⟩, Ⓘ, ⟨CF⟩';
const ISO_129 = 'ISO 129-1:2018 (recalled): the decimal comma; metric leading zero';
const ISO_286 = 'ISO 286-1:2010 §4 (recalled): a tolerance class is deviation letter(s) + grade';
const ISO_286_FIT = 'ISO 286-1:2010 §4 (recalled): a fit is the hole class then the shaft class';
const ISO_286_LIMITS = 'ISO 286-1:2010 (recalled): deviations or limits may follow the class';
const ISO_14405 = 'ISO 14405-1:2016 (recalled): Ⓔ envelope and size modifiers (LP) (GG) …';
const ISO_965 = 'ISO 965-1 (recalled): M nominal x pitch - tolerance class, e.g. M6x1-6H';
const ASME_B1_1 = 'ASME B1.1 (recalled): unified threads, e.g. 1/4-20 UNC-2B, number sizes';
const INCH_FRACTION = 'older inch drawings (recalled): common fractions such as 1/4 ±1/64';
const CHECKPLATE = 'Checkplate reading (our own convention, not a standard)';

interface Expected {
	kind?: CalloutSpec['kind'];
	quantity?: number | null;
	symbol?: CalloutSpec['symbol'];
	nominal?: string;
	places?: number[];
	limits?: [string | null, string | null];
	tolerance?: string;
	upperFirst?: boolean;
	code?: string;
	feature?: 'hole' | 'shaft';
	fit?: string;
	placement?: 'before' | 'after';
	modifiers?: Modifier[];
	thru?: boolean;
	depth?: string;
	thread?: Record<string, unknown>;
	comma?: boolean;
	canonical?: string;
}

type Case = [text: string, units: Units, source: string, expected: Expected];

const cases: Case[] = [
	// Limit pairs
	[
		'25.000-25.021',
		'mm',
		ASME_LIMITS,
		{ limits: ['25.000', '25.021'], upperFirst: false, places: [3, 3] }
	],
	[
		'25.021/25.000',
		'mm',
		ASME_LIMITS,
		{ limits: ['25.000', '25.021'], upperFirst: true, canonical: '25.021/25.000' }
	],
	['25.021-25.000', 'mm', CHECKPLATE, { limits: ['25.000', '25.021'], upperFirst: true }],
	[
		'25.000/25.021',
		'mm',
		CHECKPLATE,
		{ limits: ['25.000', '25.021'], upperFirst: false, canonical: '25.000-25.021' }
	],
	['25.000 - 25.021', 'mm', ASME_LIMITS, { limits: ['25.000', '25.021'] }],
	['25.000–25.021', 'mm', CHECKPLATE, { limits: ['25.000', '25.021'] }],
	['25.021 / 25.000', 'mm', ASME_LIMITS, { limits: ['25.000', '25.021'], upperFirst: true }],
	['Ø25.000-25.021', 'mm', ASME_LIMITS, { symbol: 'diameter', limits: ['25.000', '25.021'] }],
	['Ø10.02/10.00', 'mm', ASME_LIMITS, { limits: ['10.00', '10.02'], places: [2, 2] }],
	['.998-1.000', 'in', ASME_INCH, { limits: ['.998', '1.000'], places: [3, 3] }],
	['1.000/.998', 'in', ASME_INCH, { limits: ['.998', '1.000'], upperFirst: true }],
	['0.998-1.000', 'in', ASME_INCH, { limits: ['.998', '1.000'], canonical: '.998-1.000' }],
	['Ø.5005/.5000', 'in', ASME_INCH, { limits: ['.5000', '.5005'], places: [4, 4] }],
	['2X .250-.252', 'in', ASME_SYMBOLS, { quantity: 2, limits: ['.250', '.252'] }],
	[
		'12,000-12,018',
		'mm',
		ISO_129,
		{ limits: ['12.000', '12.018'], comma: true, canonical: '12,000-12,018' }
	],
	['25.00-25.021', 'mm', ASME_METRIC, { limits: ['25.000', '25.021'], places: [2, 3] }],

	// Equal bilateral
	[
		'Ø25 ±0.1',
		'mm',
		ASME_BILATERAL,
		{ nominal: '25', limits: ['24.9', '25.1'], tolerance: 'bilateral' }
	],
	['25±0.1', 'mm', ASME_BILATERAL, { limits: ['24.9', '25.1'], canonical: '25 ±0.1' }],
	['25 +/-0.1', 'mm', CHECKPLATE, { limits: ['24.9', '25.1'], canonical: '25 ±0.1' }],
	['25 +-0.1', 'mm', CHECKPLATE, { limits: ['24.9', '25.1'] }],
	['25 ± 0.05', 'mm', ASME_BILATERAL, { limits: ['24.95', '25.05'] }],
	['.500 ±.005', 'in', ASME_INCH, { limits: ['.495', '.505'], places: [3, 3] }],
	['0.500 ±0.005', 'in', ASME_INCH, { limits: ['.495', '.505'], canonical: '.500 ±.005' }],
	['1.250 ±.010', 'in', ASME_INCH, { limits: ['1.240', '1.260'] }],
	['32 ±0,2', 'mm', ISO_129, { limits: ['31.8', '32.2'], comma: true, canonical: '32 ±0,2' }],
	['R5 ±0.1', 'mm', ASME_SYMBOLS, { symbol: 'radius', limits: ['4.9', '5.1'] }],
	['SR10 ±0.2', 'mm', ASME_SYMBOLS, { symbol: 'sphericalRadius', limits: ['9.8', '10.2'] }],
	['SØ20 ±0.05', 'mm', ASME_SYMBOLS, { symbol: 'sphericalDiameter', limits: ['19.95', '20.05'] }],
	['CR3 ±0.1', 'mm', ASME_SYMBOLS, { symbol: 'controlledRadius', limits: ['2.9', '3.1'] }],
	['Ø25 ±0.1', 'in', CHECKPLATE, { limits: ['24.9', '25.1'] }],

	// Unequal and unilateral
	['Ø25 +0.021/0', 'mm', ASME_UNILATERAL_MM, { limits: ['25', '25.021'], tolerance: 'deviations' }],
	['Ø25 0/-0.02', 'mm', ASME_UNILATERAL_MM, { limits: ['24.98', '25'], canonical: 'Ø25 0/-0.02' }],
	['32 +0.25/-0.10', 'mm', ASME_METRIC, { limits: ['31.90', '32.25'] }],
	['32 +0.25 -0.10', 'mm', CHECKPLATE, { limits: ['31.90', '32.25'], canonical: '32 +0.25/-0.10' }],
	['32 -0.10/+0.25', 'mm', CHECKPLATE, { limits: ['31.90', '32.25'], canonical: '32 +0.25/-0.10' }],
	['32 −0.10/+0.25', 'mm', CHECKPLATE, { limits: ['31.90', '32.25'] }],
	[
		'.500 +.002/-.000',
		'in',
		ASME_UNILATERAL_IN,
		{ limits: ['.500', '.502'], canonical: '.500 +.002/-.000' }
	],
	['.500 +.000/-.002', 'in', ASME_UNILATERAL_IN, { limits: ['.498', '.500'] }],
	['.500 +.005 -.000', 'in', ASME_UNILATERAL_IN, { limits: ['.500', '.505'] }],
	['25 -0.1/-0.2', 'mm', CHECKPLATE, { limits: ['24.8', '24.9'] }],
	['25 +0.2/+0.1', 'mm', CHECKPLATE, { limits: ['25.1', '25.2'] }],
	['25 0,000/-0,020', 'mm', ISO_129, { limits: ['24.98', '25'], comma: true }],
	['Ø8 +0.1/0 THRU', 'mm', ASME_SYMBOLS, { limits: ['8', '8.1'], thru: true }],

	// ISO 286 classes
	['Ø25 H7', 'mm', ISO_286, { code: 'H7', feature: 'hole', nominal: '25' }],
	['25g6', 'mm', ISO_286, { code: 'g6', feature: 'shaft', canonical: '25 g6' }],
	['Ø25H7', 'mm', ISO_286, { code: 'H7', canonical: 'Ø25 H7' }],
	['Ø40 js6', 'mm', ISO_286, { code: 'js6', feature: 'shaft' }],
	['Ø40 JS7', 'mm', ISO_286, { code: 'JS7', feature: 'hole' }],
	['Ø100 ZC11', 'mm', ISO_286, { code: 'ZC11' }],
	['Ø6 h01', 'mm', ISO_286, { code: 'h01' }],
	['Ø6 H0', 'mm', ISO_286, { code: 'H0' }],
	['Ø500 A18', 'mm', ISO_286, { code: 'A18' }],
	['Ø30 cd9', 'mm', ISO_286, { code: 'cd9' }],
	['Ø12 EF8', 'mm', ISO_286, { code: 'EF8' }],
	[
		'Ø25 H7 (25.000/25.021)',
		'mm',
		ISO_286_LIMITS,
		{
			code: 'H7',
			placement: 'before',
			limits: ['25.000', '25.021'],
			canonical: 'Ø25 H7 (25.000-25.021)'
		}
	],
	['Ø25 H7 (25.021/25.000)', 'mm', ISO_286_LIMITS, { placement: 'before', upperFirst: true }],
	[
		'Ø25 H7 (+0.021/0)',
		'mm',
		ISO_286_LIMITS,
		{ limits: ['25', '25.021'], tolerance: 'deviations' }
	],
	['Ø25 h6 (0/-0.013)', 'mm', ISO_286_LIMITS, { limits: ['24.987', '25'] }],
	['Ø25 g6 (-0.007/-0.020)', 'mm', ISO_286_LIMITS, { limits: ['24.980', '24.993'] }],
	['Ø25 js6 (±0.0065)', 'mm', ISO_286_LIMITS, { limits: ['24.9935', '25.0065'] }],
	[
		'25.000/25.021 (H7)',
		'mm',
		ISO_286_LIMITS,
		{
			code: 'H7',
			placement: 'after',
			limits: ['25.000', '25.021'],
			canonical: '25.000-25.021 (H7)'
		}
	],
	['Ø24.980/24.993 (g6)', 'mm', ISO_286_LIMITS, { code: 'g6', placement: 'after' }],
	['Ø25 +0.021/0 (H7)', 'mm', ISO_286_LIMITS, { code: 'H7', placement: 'after', nominal: '25' }],
	['4X Ø6 H7 THRU', 'mm', ASME_SYMBOLS, { quantity: 4, code: 'H7', thru: true }],
	['Ø8 H7 ↧12', 'mm', ASME_SYMBOLS, { code: 'H7', depth: '12' }],
	['Ø25 H7 Ⓔ', 'mm', ISO_14405, { code: 'H7', modifiers: ['envelope'] }],

	// Fits
	['Ø25 H7/g6', 'mm', ISO_286_FIT, { fit: 'H7/g6' }],
	['25H7/g6', 'mm', ISO_286_FIT, { fit: 'H7/g6', canonical: '25 H7/g6' }],
	['Ø40 H8/f7', 'mm', ISO_286_FIT, { fit: 'H8/f7' }],
	['Ø16 G7/h6', 'mm', ISO_286_FIT, { fit: 'G7/h6' }],
	['Ø50 H7/js6', 'mm', ISO_286_FIT, { fit: 'H7/js6' }],
	['Ø10 H7/p6', 'mm', ISO_286_FIT, { fit: 'H7/p6' }],

	// Single limits
	['25 MIN', 'mm', ASME_SINGLE, { limits: ['25', null], tolerance: 'single' }],
	['R0.5 MAX', 'mm', ASME_SINGLE, { symbol: 'radius', limits: [null, '0.5'] }],
	['R0.5 max.', 'mm', ISO_129, { limits: [null, '0.5'], canonical: 'R0.5 MAX' }],
	['max. R0.5', 'mm', ISO_129, { limits: [null, '0.5'], canonical: 'R0.5 MAX' }],
	['min. 12', 'mm', ISO_129, { limits: ['12', null] }],
	['Ø.750 MAX', 'in', ASME_SINGLE, { limits: [null, '.750'] }],
	['.06 MIN', 'in', ASME_SINGLE, { limits: ['.06', null] }],
	['0,5 max.', 'mm', ISO_129, { limits: [null, '0.5'], comma: true, canonical: '0,5 MAX' }],

	// Quantities and symbols
	['4X Ø6', 'mm', ASME_SYMBOLS, { quantity: 4, symbol: 'diameter', tolerance: undefined }],
	['2× R5', 'mm', ASME_SYMBOLS, { quantity: 2, symbol: 'radius', canonical: '2X R5' }],
	['2XR5', 'mm', CHECKPLATE, { quantity: 2, symbol: 'radius' }],
	['4x Ø6 ±0.1', 'mm', ASME_SYMBOLS, { quantity: 4, limits: ['5.9', '6.1'] }],
	['4 PL Ø6', 'mm', CHECKPLATE, { quantity: 4, canonical: '4X Ø6' }],
	['6 PLACES R2', 'mm', CHECKPLATE, { quantity: 6, symbol: 'radius' }],
	['⌀25 H7', 'mm', ASME_SYMBOLS, { symbol: 'diameter', canonical: 'Ø25 H7' }],
	['ø25 H7', 'mm', CHECKPLATE, { symbol: 'diameter' }],
	['∅25 H7', 'mm', CHECKPLATE, { symbol: 'diameter' }],
	['DIA 25', 'mm', CHECKPLATE, { symbol: 'diameter', canonical: 'Ø25' }],
	['.500 DIA', 'in', CHECKPLATE, { symbol: 'diameter', canonical: 'Ø.500' }],
	['S⌀20', 'mm', ASME_SYMBOLS, { symbol: 'sphericalDiameter' }],
	['Ø25', 'mm', CHECKPLATE, { symbol: 'diameter', nominal: '25', limits: undefined }],
	['25', 'mm', CHECKPLATE, { nominal: '25', places: [0] }],
	['.875', 'in', ASME_INCH, { nominal: '.875', places: [3] }],

	// Inch fractions
	['1/4 ±1/64', 'in', INCH_FRACTION, { limits: ['.234375', '.265625'], canonical: '1/4 ±1/64' }],
	['1 1/2 ±1/32', 'in', INCH_FRACTION, { limits: ['1.46875', '1.53125'] }],
	['Ø3/8 +1/64/-0', 'in', INCH_FRACTION, { limits: ['.375', '.390625'] }],
	['5/8 MAX', 'in', INCH_FRACTION, { limits: [null, '.625'] }],
	['R1/8', 'in', INCH_FRACTION, { symbol: 'radius', nominal: '.125' }],

	// Modifiers
	['Ø25 ±0.1 Ⓔ', 'mm', ISO_14405, { modifiers: ['envelope'] }],
	['Ø25 ±0.1 (E)', 'mm', ISO_14405, { modifiers: ['envelope'], canonical: 'Ø25 ±0.1 Ⓔ' }],
	['Ø25 ±0.1 (H7)', 'mm', CHECKPLATE, { code: 'H7', placement: 'after', limits: ['24.9', '25.1'] }],
	['Ø25 ±0.1 Ⓘ', 'mm', ASME_MODIFIERS, { modifiers: ['independency'] }],
	['Ø25 ±0.1 (I)', 'mm', ASME_MODIFIERS, { modifiers: ['independency'] }],
	['Ø80 ±0.5 Ⓕ', 'mm', ASME_MODIFIERS, { modifiers: ['freeState'] }],
	['Ø25 ±0.1 ⟨ST⟩', 'mm', ASME_MODIFIERS, { modifiers: ['statistical'] }],
	[
		'Ø25 ±0.1 <ST>',
		'mm',
		ASME_MODIFIERS,
		{ modifiers: ['statistical'], canonical: 'Ø25 ±0.1 ⟨ST⟩' }
	],
	['Ø25 ±0.1 ⟨CF⟩', 'mm', ASME_MODIFIERS, { modifiers: ['continuousFeature'] }],
	['Ø25 ±0.1 (LP)', 'mm', ISO_14405, { modifiers: ['twoPointSize'] }],
	['Ø25 ±0.1 (GG)', 'mm', ISO_14405, { modifiers: ['leastSquaresSize'] }],
	['Ø25 h7 (GX)', 'mm', ISO_14405, { modifiers: ['maximumInscribedSize'] }],
	['Ø25 ±0.1 Ⓔ ⟨ST⟩', 'mm', ASME_MODIFIERS, { modifiers: ['envelope', 'statistical'] }],
	['Ø25 ±0.1 Ⓕ (LP)', 'mm', ISO_14405, { modifiers: ['freeState', 'twoPointSize'] }],

	// Basic and reference dimensions
	['[25]', 'mm', ASME_BASIC, { kind: 'basic', nominal: '25', limits: undefined }],
	['[Ø25]', 'mm', ASME_BASIC, { kind: 'basic', symbol: 'diameter' }],
	['[ 40.5 ]', 'mm', ASME_BASIC, { kind: 'basic', canonical: '[40.5]' }],
	['[1.250]', 'in', ASME_BASIC, { kind: 'basic', places: [3] }],
	['4X [Ø12]', 'mm', ASME_BASIC, { kind: 'basic', quantity: 4 }],
	['(25)', 'mm', ASME_REFERENCE, { kind: 'reference', nominal: '25' }],
	['(Ø25)', 'mm', ASME_REFERENCE, { kind: 'reference', symbol: 'diameter' }],
	['(.750)', 'in', ASME_REFERENCE, { kind: 'reference', nominal: '.750' }],
	[
		'25 REF',
		'mm',
		'ASME Y14.5M-1982 (recalled): REF after the value',
		{ kind: 'reference', canonical: '(25)' }
	],

	// Holes: THRU and depth
	['Ø6 THRU', 'mm', ASME_SYMBOLS, { thru: true }],
	['Ø6 thru', 'mm', CHECKPLATE, { thru: true, canonical: 'Ø6 THRU' }],
	['Ø6 ↧10', 'mm', ASME_SYMBOLS, { depth: '10', canonical: 'Ø6 ↧10' }],
	['Ø6 ↧ 10', 'mm', ASME_SYMBOLS, { depth: '10' }],
	['Ø6 12 DEEP', 'mm', CHECKPLATE, { depth: '12', canonical: 'Ø6 ↧12' }],
	['Ø6 DEPTH 12', 'mm', CHECKPLATE, { depth: '12' }],
	['Ø.250 ±.005 ↧.50', 'in', ASME_SYMBOLS, { depth: '.50', limits: ['.245', '.255'] }],

	// Threads
	[
		'M6x1-6H',
		'mm',
		ISO_965,
		{
			kind: 'thread',
			thread: { system: 'metric', toleranceClass: '6H', diameter: { value: 60_000_000, places: 0 } }
		}
	],
	['M10-6g', 'mm', ISO_965, { kind: 'thread', thread: { pitch: null, toleranceClass: '6g' } }],
	['M6X1-6H', 'mm', ISO_965, { kind: 'thread', canonical: 'M6x1-6H' }],
	[
		'M8×1.25-6H',
		'mm',
		ISO_965,
		{ kind: 'thread', thread: { pitch: { value: 12_500_000, places: 2 } } }
	],
	['M12x1.25-5g6g', 'mm', ISO_965, { thread: { toleranceClass: '5g6g' } }],
	['M12x1.5-6H-LH', 'mm', ISO_965, { thread: { leftHand: true } }],
	['M5', 'mm', ISO_965, { kind: 'thread', thread: { pitch: null, toleranceClass: null } }],
	['4X M8-6H THRU', 'mm', ISO_965, { kind: 'thread', quantity: 4, thru: true }],
	['M6x1-6H ↧12', 'mm', ISO_965, { kind: 'thread', depth: '12' }],
	['M6x1-6H', 'in', ISO_965, { kind: 'thread', canonical: 'M6x1-6H' }],
	[
		'1/4-20 UNC-2B',
		'in',
		ASME_B1_1,
		{
			kind: 'thread',
			thread: { system: 'unified', threadsPerInch: 20, series: 'UNC', toleranceClass: '2B' }
		}
	],
	['1/4-28 UNF-2A', 'in', ASME_B1_1, { thread: { series: 'UNF', toleranceClass: '2A' } }],
	[
		'#10-32 UNF-2A',
		'in',
		ASME_B1_1,
		{ thread: { numberSize: 10, diameter: { value: 48_260_000, places: 3 } } }
	],
	['.250-20 UNC-3A', 'in', ASME_B1_1, { thread: { toleranceClass: '3A' } }],
	['1 1/2-6 UNC-2A-LH', 'in', ASME_B1_1, { thread: { threadsPerInch: 6, leftHand: true } }],
	['1/2-13UNC-2B', 'in', ASME_B1_1, { kind: 'thread', canonical: '1/2-13 UNC-2B' }],
	['4X 1/4-20 UNC-2B ↧.50', 'in', ASME_B1_1, { kind: 'thread', quantity: 4, depth: '.50' }]
];

const errors: [text: string, units: Units, message: string, position: number][] = [
	['', 'mm', 'empty', 0],
	['25 ±', 'mm', 'expected a tolerance after ±', 3],
	['25 ±+0.1', 'mm', '± already gives both signs', 4],
	['25 ±0', 'mm', 'zero', 4],
	['Ø25 Q7', 'mm', 'Q is not an ISO 286 fundamental deviation', 4],
	['Ø25 Js7', 'mm', 'the case says which it is', 4],
	['Ø25 H19', 'mm', 'IT19 is not an ISO 286 tolerance grade', 5],
	['Ø25 H7/G6', 'mm', 'G6 is a hole tolerance class', 7],
	['Ø25 g6/H7', 'mm', 'the hole class comes first', 4],
	['R5 H7', 'mm', 'not a radius', 3],
	['25 +0.1', 'mm', 'expected a second deviation', 6],
	['25 +0.1/0.2', 'mm', 'needs its sign', 8],
	['25.000-25.000', 'mm', 'the two limits are equal', 7],
	['25 +0.1/+0.1', 'mm', 'the two deviations are equal', 8],
	['4X', 'mm', 'expected a size after the quantity', 1],
	['0X Ø6', 'mm', 'at least 1', 0],
	['Ø', 'mm', 'expected a size after the symbol', 0],
	['Ø25 H7 (25.000/25.021', 'mm', 'never closed', 7],
	['(25', 'mm', 'never closed', 0],
	['[25 ±0.1]', 'mm', 'a basic dimension carries no tolerance', 4],
	['(25 H7)', 'mm', 'a reference dimension carries no tolerance', 4],
	['25 ±0.1 REF', 'mm', 'a reference dimension carries no tolerance', 8],
	['Ø6 THRU ↧10', 'mm', 'either THRU or has a depth', 8],
	['Ø25 ±0.1 Ⓔ Ⓔ', 'mm', 'already given', 11],
	['Ø25 ±0.1 TYP', 'mm', "expected the end of the callout, not 'TYP'", 9],
	['±0.1', 'mm', 'expected the size before its tolerance', 0],
	['Ø25 H7 ±0.1', 'mm', "expected the end of the callout, not '±'", 7],
	['Ø25 ±0.1 (Q7)', 'mm', 'Q is not an ISO 286 fundamental deviation', 10],
	['1/3 ±.01', 'in', '1/3 in is not an exact length', 0],
	['1.2345678 ±.001', 'in', 'more decimal places than Checkplate can hold exactly in inches', 0],
	['Ø25 H7 MAX', 'mm', 'cannot also be MAX', 7],
	['#14-20 UNC', 'in', 'not a unified number size', 0],
	['M6x1-6Q', 'mm', 'ISO 965 thread tolerance class', 5],
	['1/4-20 UNC-2C', 'in', 'unified thread class', 11],
	['Ø6 ↧0', 'mm', 'a depth of zero', 4],
	['[25] Ⓔ', 'mm', 'modifiers apply to a toleranced size', 5],
	['25 @', 'mm', "not '@'", 3]
];

function lengthOf(text: string, units: Units): number {
	const d = parseDecimal(text, units);
	if (d === null) throw new Error(`bad expected value ${text}`);
	return d.value;
}

function check(text: string, units: Units, e: Expected): void {
	const r = parseCallout(text, { units });
	if (!r.ok) throw new Error(`${text}: ${r.message} at ${r.position}`);
	const spec = r.spec;
	if (e.kind) expect(spec.kind).toBe(e.kind);
	else if (!e.thread) expect(spec.kind).toBe('size');
	if (e.quantity !== undefined) expect(spec.quantity).toBe(e.quantity);
	if (e.symbol !== undefined) expect(spec.symbol).toBe(e.symbol);
	if (e.nominal !== undefined) expect(spec.nominal?.value).toBe(lengthOf(e.nominal, units));
	if ('limits' in e) {
		const limits = calloutLimits(spec);
		if (e.limits === undefined) expect(limits).toBeNull();
		else
			expect(limits).toEqual({
				lower: e.limits[0] === null ? null : lengthOf(e.limits[0], units),
				upper: e.limits[1] === null ? null : lengthOf(e.limits[1], units)
			});
	}
	if (e.places) {
		const t = spec.tolerance;
		const places =
			t?.type === 'limits'
				? [t.lower.places, t.upper.places]
				: t?.type === 'bilateral'
					? [spec.nominal?.places ?? -1, t.deviation.places]
					: [spec.nominal?.places ?? -1];
		expect(places).toEqual(e.places);
	}
	if (e.tolerance) expect(spec.tolerance?.type).toBe(e.tolerance);
	if (e.upperFirst !== undefined)
		expect(spec.tolerance).toMatchObject({ type: 'limits', upperFirst: e.upperFirst });
	if (e.code) expect(spec.toleranceClass?.code).toBe(e.code);
	if (e.feature) expect(spec.toleranceClass?.feature).toBe(e.feature);
	if (e.fit) expect(`${spec.fit?.hole.code}/${spec.fit?.shaft.code}`).toBe(e.fit);
	if (e.placement) expect(spec.classPlacement).toBe(e.placement);
	expect(spec.modifiers).toEqual(e.modifiers ?? []);
	expect(spec.thru).toBe(e.thru ?? false);
	if (e.depth) expect(spec.depth?.value).toBe(lengthOf(e.depth, units));
	else expect(spec.depth).toBeNull();
	if (e.thread) expect(spec.thread).toMatchObject(e.thread);
	expect(spec.decimalSeparator).toBe(e.comma ? ',' : '.');
	const canonical = formatCallout(spec);
	if (e.canonical) expect(canonical).toBe(e.canonical);
	const again = parseCallout(canonical, { units });
	expect(again).toEqual({ ok: true, spec });
}

describe('parseCallout reads the drafter’s forms', () => {
	it('has at least 120 callouts in its table', () => {
		expect(cases.length + errors.length).toBeGreaterThanOrEqual(120);
	});

	it.each(cases)('%s (%s) — %s', (text, units, _source, expected) => {
		check(text, units, expected);
	});
});

describe('parseCallout explains what is wrong, and where', () => {
	it.each(errors)('%j (%s): %s at %i', (text, units, message, position) => {
		const r = parseCallout(text, { units });
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.message).toContain(message);
		expect(r.position).toBe(position);
	});

	it('knows a hole class from a shaft class when told the feature', () => {
		expect(parseCallout('Ø25 H7', { units: 'mm', feature: 'shaft' })).toEqual({
			ok: false,
			message: 'H7 is a hole tolerance class; a shaft needs a lower-case letter',
			position: 4
		});
		expect(parseCallout('Ø25 g6', { units: 'mm', feature: 'hole' })).toEqual({
			ok: false,
			message: 'g6 is a shaft tolerance class; a hole needs an upper-case letter',
			position: 4
		});
		expect(parseCallout('Ø25 H7', { units: 'mm', feature: 'hole' }).ok).toBe(true);
	});
});

describe('the spec', () => {
	it('keeps the written places, the unit and the order of the limits', () => {
		const r = parseCallout('25.021/25.000', { units: 'mm' });
		expect(r).toEqual({
			ok: true,
			spec: {
				kind: 'size',
				units: 'mm',
				quantity: null,
				symbol: null,
				nominal: null,
				tolerance: {
					type: 'limits',
					upper: { value: 250_210_000, places: 3 },
					lower: { value: 250_000_000, places: 3 },
					upperFirst: true
				},
				toleranceClass: null,
				fit: null,
				classPlacement: null,
				modifiers: [],
				thread: null,
				thru: false,
				depth: null,
				decimalSeparator: '.'
			}
		});
	});

	it('records an ISO class without computing its limits', () => {
		const r = parseCallout('Ø25 H7', { units: 'mm' });
		expect(r.ok && r.spec.toleranceClass).toEqual({
			code: 'H7',
			deviation: 'H',
			grade: '7',
			feature: 'hole'
		});
		expect(r.ok && calloutLimits(r.spec)).toBeNull();
	});

	it('keeps a fraction as written', () => {
		const r = parseCallout('1 1/2 ±1/32', { units: 'in' });
		expect(r.ok && r.spec.nominal).toEqual({
			value: 381_000_000,
			places: 0,
			fraction: { whole: 1, numerator: 1, denominator: 2 }
		});
	});
});
