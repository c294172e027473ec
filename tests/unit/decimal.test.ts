import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	PER_INCH,
	PER_MM,
	abs,
	compare,
	toLength,
	convertLimitsInward,
	formatLength,
	fromMicrometres,
	fromThousandths,
	max,
	min,
	mulDiv,
	parseDecimal,
	roundToPlaces,
	type Units
} from '../../src/lib/tolerance/decimal';

const value = (text: string, units: Units = 'mm') => parseDecimal(text, units)!.value;

describe('parseDecimal', () => {
	it.each([
		['25.021', 'mm', 250_210_000, 3],
		['25', 'mm', 250_000_000, 0],
		['.875', 'in', 222_250_000, 3],
		['0.875', 'in', 222_250_000, 3],
		['0,875', 'mm', 8_750_000, 3], // ISO 129-1: the decimal comma
		['-0.02', 'mm', -200_000, 2],
		['−0.02', 'mm', -200_000, 2], // U+2212 minus sign
		['+.002', 'in', 508_000, 3],
		['-0.000', 'mm', 0, 3],
		['1', 'in', PER_INCH, 0],
		['25.4', 'mm', PER_INCH, 1],
		['3150', 'mm', 31_500_000_000, 0],
		['0.0000001', 'mm', 1, 7],
		['0.000001', 'in', 254, 6],
		['1.25000000', 'in', 317_500_000, 8]
	] as const)('reads %s %s exactly', (text, units, expected, places) => {
		expect(parseDecimal(text, units)).toEqual({ value: expected, places });
	});

	it.each([
		'',
		'.',
		'-',
		'+',
		'1.',
		'1..2',
		'1.2.3',
		'a',
		'1e3',
		' 1',
		'1 ',
		'0x10',
		'--1',
		'Infinity'
	])('rejects %j', (text) => {
		expect(parseDecimal(text, 'mm')).toBeNull();
	});

	it('rejects what the 0.1 nm grid cannot hold', () => {
		expect(parseDecimal('0.00000001', 'mm')).toBeNull();
		expect(parseDecimal('0.0000001', 'in')).toBeNull();
		expect(parseDecimal('1234567890', 'mm')).toBeNull();
	});

	it('never goes through a float: 0.875 − 0.874 is 0.001', () => {
		expect(value('0.875', 'in') - value('0.874', 'in')).toBe(value('0.001', 'in'));
		expect(value('0.3') - value('0.1')).toBe(value('0.2'));
	});
});

describe('formatLength', () => {
	it.each([
		[value('.875', 'in'), 'in', 4, { leadingZero: false }, '.8750'], // ASME Y14.5 §1.6.2
		[value('.875', 'in'), 'in', 4, {}, '0.8750'], // JSON keeps the leading zero
		[value('-0.02'), 'mm', 3, {}, '-0.020'],
		[value('-0.02'), 'mm', 3, { leadingZero: false }, '-.020'],
		[0, 'in', 3, { leadingZero: false }, '.000'],
		[0, 'mm', 0, {}, '0'],
		[value('25.0215'), 'mm', 3, {}, '25.022'],
		[value('-25.0215'), 'mm', 3, {}, '-25.022'],
		[value('25.0215'), 'mm', 3, { rounding: 'down' }, '25.021'],
		[value('25.0211'), 'mm', 3, { rounding: 'up' }, '25.022'],
		[value('25.5'), 'mm', 1, { decimalSeparator: ',' }, '25,5'], // ISO 129-1
		[PER_MM, 'in', 5, {}, '0.03937'],
		[PER_MM, 'in', 8, {}, '0.03937008'],
		[PER_INCH, 'mm', 1, {}, '25.4']
	] as const)('%i in %s to %i places', (v, units, places, opts, expected) => {
		expect(formatLength(toLength(v), units, places, opts)).toBe(expected);
	});
});

describe('conversions and scaling', () => {
	it('reads ISO 286 micrometres and ANSI thousandths exactly', () => {
		expect(fromMicrometres(0.3)).toBe(3_000); // ISO 286-1 IT01 to 3 mm: 0.3 µm (recalled)
		expect(fromMicrometres(21)).toBe(value('0.021'));
		expect(fromMicrometres(-7)).toBe(value('-0.007'));
		expect(fromThousandths(0.6)).toBe(value('.0006', 'in'));
		expect(fromThousandths(-1.2)).toBe(value('-.0012', 'in'));
	});

	it('converts inward: never widens a limit', () => {
		const { lower, upper } = convertLimitsInward(value('25.000'), value('25.021'), 'in', 4);
		expect(formatLength(lower, 'in', 4)).toBe('0.9843');
		expect(formatLength(upper, 'in', 4)).toBe('0.9850');
		expect(lower).toBeGreaterThanOrEqual(value('25.000'));
		expect(upper).toBeLessThanOrEqual(value('25.021'));
	});

	it('rounds to places in each direction', () => {
		expect(roundToPlaces(value('1.23456'), 'mm', 2, 'nearest')).toBe(value('1.23'));
		expect(roundToPlaces(value('1.235'), 'mm', 2, 'nearest')).toBe(value('1.24'));
		expect(roundToPlaces(value('-1.235'), 'mm', 2, 'nearest')).toBe(value('-1.24'));
		expect(roundToPlaces(value('-1.231'), 'mm', 2, 'up')).toBe(value('-1.23'));
		expect(roundToPlaces(value('-1.231'), 'mm', 2, 'down')).toBe(value('-1.24'));
	});

	it('scales with one rounding', () => {
		expect(mulDiv(value('0.1'), 1, 3, 'nearest')).toBe(333_333);
		expect(mulDiv(value('0.1'), 1, 3, 'up')).toBe(333_334);
		expect(mulDiv(value('-0.1'), 1, 3, 'down')).toBe(-333_334);
		// Past 2^53 in the product the scaling goes through BigInt and stays exact.
		expect(mulDiv(value('3000'), 3_000_000, 3_000_000, 'nearest')).toBe(value('3000'));
		expect(mulDiv(value('3000'), 3_000_001, 3_000_000, 'down')).toBe(value('3000.001'));
	});

	it('compares', () => {
		const [a, b, c] = [toLength(1), toLength(2), toLength(-3)];
		expect(compare(a, b)).toBe(-1);
		expect(compare(b, b)).toBe(0);
		expect(min(c, b)).toBe(-3);
		expect(max(c, b)).toBe(2);
		expect(abs(c)).toBe(3);
	});

	it('a Length is made only from an exact count: a float is refused at compile time and at run time', () => {
		// @ts-expect-error a plain number is not a Length (svelte-check fails if this compiles)
		expect(formatLength(25.4, 'mm', 1)).toBe('0.0');
		expect(() => toLength(0.5)).toThrow(RangeError);
		expect(() => toLength(2 ** 53)).toThrow(RangeError);
		expect(toLength(-0)).toBe(0);
		expect(Object.is(toLength(-0), -0)).toBe(false);
	});
});

describe('properties', () => {
	const length = fc.integer({ min: -40_000_000_000, max: 40_000_000_000 }).map(toLength);
	const mmText = fc
		.tuple(fc.nat({ max: 3150 }), fc.integer({ min: 0, max: 7 }), fc.nat({ max: 9_999_999 }))
		.map(([whole, places, digits]) =>
			places === 0
				? String(whole)
				: `${whole}.${String(digits % 10 ** places).padStart(places, '0')}`
		);

	it('a + b − b = a for any sizes', () => {
		fc.assert(fc.property(length, length, (a, b) => a + b - b === a));
	});

	it('format(parse(text)) gives the text back', () => {
		fc.assert(
			fc.property(mmText, (text) => {
				const parsed = parseDecimal(text, 'mm')!;
				return formatLength(parsed.value, 'mm', parsed.places) === text;
			})
		);
	});

	it('mm → in → mm never widens a pair of limits', () => {
		fc.assert(
			fc.property(mmText, mmText, fc.integer({ min: 0, max: 6 }), (a, b, places) => {
				const x = parseDecimal(a, 'mm')!;
				const y = parseDecimal(b, 'mm')!;
				const lower = min(x.value, y.value);
				const upper = max(x.value, y.value);
				const inch = convertLimitsInward(lower, upper, 'in', places);
				const back = convertLimitsInward(inch.lower, inch.upper, 'mm', 3);
				return (
					inch.lower >= lower && inch.upper <= upper && back.lower >= lower && back.upper <= upper
				);
			})
		);
	});

	it('rounding up and down brackets the value within one place', () => {
		fc.assert(
			fc.property(length, fc.constantFrom<Units>('mm', 'in'), fc.nat({ max: 6 }), (v, units, p) => {
				const up = roundToPlaces(v, units, p, 'up');
				const down = roundToPlaces(v, units, p, 'down');
				const near = roundToPlaces(v, units, p, 'nearest');
				return down <= v && v <= up && (near === up || near === down);
			})
		);
	});
});
