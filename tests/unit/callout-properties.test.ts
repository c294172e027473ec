import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	PER_INCH,
	PER_MM,
	toLength,
	formatCallout,
	parseCallout,
	type CalloutSpec,
	type Modifier,
	type Tolerance,
	type Units,
	type WrittenValue
} from '../../src/lib/tolerance';

const units = fc.constantFrom<Units>('mm', 'in');

/** A written value with `places` decimals: an integer count of its last place. */
function written(u: Units, minCount: number, maxCount: number) {
	return fc
		.tuple(
			fc.integer({ min: 0, max: u === 'mm' ? 4 : 5 }),
			fc.integer({ min: minCount, max: maxCount })
		)
		.map(([places, count]): WrittenValue => {
			const per = u === 'mm' ? PER_MM : PER_INCH;
			return { value: toLength(count * (per / 10 ** places)), places };
		});
}

function tolerance(u: Units, hasNominal: boolean): fc.Arbitrary<Tolerance | null> {
	const size = written(u, 1, 99_999);
	const dev = written(u, -9_999, 9_999);
	const limits = fc
		.tuple(size, size, fc.boolean())
		// Whole-inch limits stacked high over low (5/3) read as a fraction; not generated.
		.filter(
			([a, b, upperFirst]) =>
				a.value !== b.value && !(u === 'in' && upperFirst && a.places + b.places === 0)
		)
		.map(([a, b, upperFirst]): Tolerance => {
			const [lower, upper] = a.value < b.value ? [a, b] : [b, a];
			return { type: 'limits', lower, upper, upperFirst };
		});
	if (!hasNominal) return limits;
	return fc.oneof(
		fc.constant(null),
		written(u, 1, 9_999).map((deviation): Tolerance => ({ type: 'bilateral', deviation })),
		fc
			.tuple(dev, dev)
			.filter(([a, b]) => a.value !== b.value)
			.map(([a, b]): Tolerance => {
				const [lower, upper] = a.value < b.value ? [a, b] : [b, a];
				return { type: 'deviations', upper, lower };
			}),
		fc.constantFrom<Tolerance>({ type: 'single', limit: 'min' }, { type: 'single', limit: 'max' })
	);
}

const holeClasses = ['H7', 'G6', 'JS9', 'K6', 'ZC11', 'CD8', 'A18', 'H01', 'N0'];
const shaftClasses = ['g6', 'h7', 'js6', 'k5', 'zc10', 'ef4', 'p6'];
function toleranceClass(code: string) {
	const grade = code.replace(/^[A-Za-z]+/, '');
	const deviation = code.slice(0, code.length - grade.length);
	return {
		code,
		deviation,
		grade,
		feature: deviation === deviation.toUpperCase() ? ('hole' as const) : ('shaft' as const)
	};
}

const modifiers = fc.uniqueArray(
	fc.constantFrom<Modifier>(
		'envelope',
		'independency',
		'freeState',
		'statistical',
		'continuousFeature',
		'twoPointSize',
		'leastSquaresSize',
		'volumeDiameter'
	),
	{ maxLength: 3 }
);

/** Toleranced sizes, built as specs rather than as text. */
const sizeSpec: fc.Arbitrary<CalloutSpec> = units.chain((u) =>
	fc
		.record({
			quantity: fc.option(fc.integer({ min: 1, max: 99 }), { nil: null }),
			symbol: fc.constantFrom(null, 'diameter', 'radius', 'sphericalDiameter', 'sphericalRadius'),
			hasNominal: fc.boolean(),
			nominal: written(u, 1, 999_999),
			iso: fc.constantFrom(null, 'class', 'fit'),
			hole: fc.constantFrom(...holeClasses),
			shaft: fc.constantFrom(...shaftClasses),
			after: fc.boolean(),
			modifiers,
			hole_: fc.constantFrom('none', 'thru', 'depth'),
			depth: written(u, 1, 99_999),
			comma: fc.boolean()
		})
		.chain((r) =>
			tolerance(u, r.hasNominal)
				.map((t): CalloutSpec => {
					const radius = r.symbol === 'radius' || r.symbol === 'sphericalRadius';
					const iso = r.hasNominal && !radius && t?.type !== 'single' ? r.iso : null;
					const cls = iso === 'class' ? toleranceClass(r.after ? r.shaft : r.hole) : null;
					const fit =
						iso === 'fit' && t === null
							? { hole: toleranceClass(r.hole), shaft: toleranceClass(r.shaft) }
							: null;
					return {
						kind: 'size',
						units: u,
						quantity: r.quantity,
						symbol: r.symbol,
						nominal: r.hasNominal ? r.nominal : null,
						tolerance: t,
						toleranceClass: cls,
						fit,
						classPlacement: cls && t ? (r.after ? 'after' : 'before') : null,
						modifiers: r.modifiers,
						thread: null,
						thru: r.hole_ === 'thru',
						depth: r.hole_ === 'depth' ? r.depth : null,
						decimalSeparator: '.'
					};
				})
				.map((spec) => {
					// The comma only shows where the callout has a decimal place to show it.
					if (r.comma && /\.\d/.test(formatCallout(spec))) spec.decimalSeparator = ',';
					return spec;
				})
		)
);

/** Callout text in the many forms drafters write, for round trips and mutation. */
const calloutText: fc.Arbitrary<{ text: string; units: Units }> = fc.oneof(
	fc.constantFrom(
		...[
			'25.000-25.021',
			'25.021/25.000',
			'Ø25 ±0.1',
			'Ø25 +0.021/0',
			'Ø25 0/-0.02',
			'Ø25 H7',
			'25g6',
			'Ø25 H7 (25.000/25.021)',
			'25.000/25.021 (H7)',
			'Ø25 H7/g6',
			'12,5 ±0,1',
			'R0.5 MAX',
			'4X Ø6 H7 THRU',
			'2× R5',
			'SØ20 ±0.05',
			'Ø25 ±0.1 Ⓔ ⟨ST⟩',
			'Ø25 ±0.1 (E)',
			'[Ø25]',
			'(25)',
			'Ø6 ↧10',
			'M6x1-6H',
			'M10-6g',
			'M12x1.25-5g6g-LH ↧20'
		].map((text) => ({ text, units: 'mm' as Units })),
		...[
			'.500 ±.005',
			'.500 +.002/-.000',
			'.998-1.000',
			'1/4 ±1/64',
			'1 1/2 ±1/32',
			'1/4-20 UNC-2B',
			'#10-32 UNF-2A',
			'Ø.750 MAX',
			'4X Ø.250 ±.005 ↧.50'
		].map((text) => ({ text, units: 'in' as Units }))
	),
	sizeSpec.map((spec) => ({ text: formatCallout(spec), units: spec.units }))
);

const alphabet = [
	...'0123456789.,+-−–/ ±ØøⓈ⌀∅RSCMXx×()[]<>⟨⟩ⒺⒾⒻ↧#HhGgJjSsKkZzABCDEFPabcdefpUNCDEPTHRUMINAX',
	'\u00a0',
	'\u2009'
];
const noisyText = fc.oneof(
	fc.string({ unit: fc.constantFrom(...alphabet), maxLength: 24 }),
	fc.string({ unit: 'grapheme', maxLength: 16 }),
	fc.string({ unit: 'binary', maxLength: 16 })
);

const mutated = fc
	.tuple(
		calloutText,
		fc.array(
			fc.tuple(
				fc.nat(),
				fc.constantFrom('insert', 'delete', 'replace'),
				fc.constantFrom(...alphabet)
			),
			{ minLength: 1, maxLength: 4 }
		)
	)
	.map(([{ text, units }, edits]) => {
		let t = text;
		for (const [at, op, ch] of edits) {
			const i = t.length === 0 ? 0 : at % (t.length + 1);
			if (op === 'insert') t = t.slice(0, i) + ch + t.slice(i);
			else if (op === 'delete') t = t.slice(0, i) + t.slice(i + 1);
			else t = t.slice(0, i) + ch + t.slice(i + 1);
		}
		return { text: t, units };
	});

function neverThrows(text: string, u: Units): boolean {
	const r = parseCallout(text, { units: u });
	if (r.ok) {
		// Whatever it accepts it must be able to write back and read again the same way.
		const again = parseCallout(formatCallout(r.spec), { units: u });
		expect(again).toEqual(r);
		return true;
	}
	expect(typeof r.message).toBe('string');
	expect(r.message.length).toBeGreaterThan(0);
	expect(Number.isInteger(r.position)).toBe(true);
	expect(r.position).toBeGreaterThanOrEqual(0);
	expect(r.position).toBeLessThanOrEqual(Math.max(0, text.length - 1));
	return true;
}

describe('callout round trip', () => {
	it('parse(format(spec)) equals spec', () => {
		fc.assert(
			fc.property(sizeSpec, (spec) => {
				const text = formatCallout(spec);
				expect(parseCallout(text, { units: spec.units })).toEqual({ ok: true, spec });
			}),
			{ numRuns: 5_000 }
		);
	});

	it('format is a fixed point: format(parse(format(parse(text)))) is stable', () => {
		fc.assert(
			fc.property(calloutText, ({ text, units }) => {
				const r = parseCallout(text, { units });
				expect(r.ok).toBe(true);
				if (!r.ok) return;
				const canonical = formatCallout(r.spec);
				const again = parseCallout(canonical, { units });
				expect(again).toEqual(r);
				if (again.ok) expect(formatCallout(again.spec)).toBe(canonical);
			}),
			{ numRuns: 2_000 }
		);
	});
});

// 50,000 runs take a few seconds alone and several times that on a busy machine: a limit of a
// minute keeps these from failing on load (the runs, not the time, are what is checked).
describe('the parser never throws', { timeout: 60_000 }, () => {
	it('on random text, and points inside it', () => {
		fc.assert(
			fc.property(noisyText, units, (text, u) => neverThrows(text, u)),
			{ numRuns: 50_000 }
		);
	});

	it('on mutated callouts, and points inside them', () => {
		fc.assert(
			fc.property(mutated, ({ text, units }) => neverThrows(text, units)),
			{ numRuns: 50_000 }
		);
	});

	it('on input that is not text at all', () => {
		for (const bad of [undefined, null, 25, {}, []]) {
			const r = parseCallout(bad as unknown as string, { units: 'mm' });
			expect(r.ok).toBe(false);
		}
		expect(parseCallout('Ø25', undefined as unknown as { units: Units }).ok).toBe(true);
	});
});
