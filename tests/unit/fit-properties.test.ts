import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { PER_MICROMETRE, PER_THOU, formatLength, toLength } from '../../src/lib/tolerance/decimal';
import { evaluateFeature, type GeometricControl } from '../../src/lib/tolerance/feature';
import { evaluateFit, type FitEvaluation } from '../../src/lib/tolerance/fit';

/** A limit pair in whole micrometres around a nominal in whole millimetres. */
const limitsMm = fc
	.record({
		nominal: fc.integer({ min: 1, max: 500 }),
		low: fc.integer({ min: -400, max: 400 }),
		width: fc.integer({ min: 1, max: 300 })
	})
	.map(({ nominal, low, width }) => {
		const lower = nominal * 10_000_000 + low * PER_MICROMETRE;
		return { lower, upper: lower + width * PER_MICROMETRE };
	});

const text = (l: { lower: number; upper: number }, units: 'mm' | 'in', places: number) =>
	`Ø${formatLength(toLength(l.lower), units, places)}-${formatLength(toLength(l.upper), units, places)}`;

function fit(hole: string, shaft: string, units: 'mm' | 'in', shaftUnits = units): FitEvaluation {
	const r = evaluateFit({
		hole: { callout: hole },
		shaft: { callout: shaft, units: shaftUnits },
		units,
		standard: 'iso-8015'
	});
	if (!r.ok) throw new Error(`${hole} / ${shaft}: ${r.message}`);
	return r;
}

describe('fit properties', () => {
	test('max clearance ≥ min clearance, and the classification agrees with the signs', () => {
		fc.assert(
			fc.property(limitsMm, fc.integer({ min: -500, max: 500 }), limitsMm, (hole, shift, shaft) => {
				// Bring the shaft near the hole so every classification turns up.
				const s = {
					lower: hole.lower + shift * PER_MICROMETRE,
					upper: hole.lower + shift * PER_MICROMETRE + (shaft.upper - shaft.lower)
				};
				const r = fit(text(hole, 'mm', 3), text(s, 'mm', 3), 'mm');
				const min = r.minClearance!;
				const max = r.maxClearance!;
				expect(max).toBeGreaterThanOrEqual(min);
				const expected = min >= 0 ? 'clearance' : max <= 0 ? 'interference' : 'transition';
				expect(r.classification).toBe(expected);
				expect(max - min).toBe(r.hole.tolerance! + r.shaft.tolerance!);
			}),
			{ numRuns: 400 }
		);
	});

	test('inch and mm results agree after conversion', () => {
		// Inch limits to 4 places convert to mm exactly at 5 places (0.0001 in = 0.00254 mm).
		const limitsIn = fc
			.record({
				nominal: fc.integer({ min: 1, max: 200 }),
				low: fc.integer({ min: -100, max: 100 }),
				width: fc.integer({ min: 1, max: 50 })
			})
			.map(({ nominal, low, width }) => {
				const lower = nominal * 25_400_000 + low * (PER_THOU / 10);
				return { lower, upper: lower + width * (PER_THOU / 10) };
			});
		fc.assert(
			fc.property(limitsIn, limitsIn, (hole, shaft) => {
				const inch = fit(text(hole, 'in', 4), text(shaft, 'in', 4), 'in');
				const metric = fit(text(hole, 'mm', 5), text(shaft, 'mm', 5), 'mm');
				const mixed = fit(text(hole, 'mm', 5), text(shaft, 'in', 4), 'mm', 'in');
				for (const r of [metric, mixed]) {
					expect(r.minClearance).toBe(inch.minClearance);
					expect(r.maxClearance).toBe(inch.maxClearance);
					expect(r.classification).toBe(inch.classification);
				}
			}),
			{ numRuns: 300 }
		);
	});

	test('boundaries bracket the limits as the formulas say', () => {
		const control = fc.record({
			value: fc.integer({ min: 0, max: 500 }),
			modifier: fc.constantFrom('mmc' as const, 'lmc' as const, 'rfs' as const)
		});
		fc.assert(
			fc.property(limitsMm, fc.boolean(), control, (limits, internal, c) => {
				const t = c.value * PER_MICROMETRE;
				const g: GeometricControl = {
					characteristic: 'position',
					value: formatLength(toLength(t), 'mm', 3),
					diameterZone: true,
					appliesTo: 'median',
					modifier: c.modifier,
					datums: ['A']
				};
				const f = evaluateFeature({
					callout: text(limits, 'mm', 3),
					internal,
					units: 'mm',
					standard: 'asme-y14.5-2018',
					controls: [g]
				});
				if (!f.ok) throw new Error(f.message);
				const b = f.controls[0].boundaries!;
				const [mmc, lmc, T] = [f.mmc!, f.lmc!, f.tolerance!];
				expect(b.innerBoundary).toBeLessThanOrEqual(Math.min(mmc, lmc));
				expect(b.outerBoundary).toBeGreaterThanOrEqual(Math.max(mmc, lmc));
				// The boundaries are t (RFS) or t + T (MMC/LMC) beyond the limits on each side.
				const spread = b.outerBoundary - b.innerBoundary;
				expect(spread).toBe(c.modifier === 'rfs' ? T + 2 * t : 2 * T + 2 * t);
				if (c.modifier === 'mmc') {
					expect(b.virtualCondition).toBe(internal ? mmc - t : mmc + t);
					expect(b.resultantCondition).toBe(internal ? lmc + t + T : lmc - t - T);
				} else if (c.modifier === 'lmc') {
					expect(b.virtualCondition).toBe(internal ? lmc + t : lmc - t);
					expect(b.resultantCondition).toBe(internal ? mmc - t - T : mmc + t + T);
				} else {
					expect(b.virtualCondition).toBeNull();
				}
			}),
			{ numRuns: 400 }
		);
	});

	test('clearances at the boundaries never exceed those from the limits on the tight side', () => {
		fc.assert(
			fc.property(limitsMm, limitsMm, fc.integer({ min: 0, max: 100 }), (hole, shaft, tUm) => {
				const r = evaluateFit({
					hole: {
						callout: text(hole, 'mm', 3),
						controls: [
							{
								characteristic: 'position',
								value: formatLength(toLength(tUm * PER_MICROMETRE), 'mm', 3),
								diameterZone: true,
								appliesTo: 'median',
								modifier: 'mmc',
								datums: ['A']
							}
						]
					},
					shaft: { callout: text(shaft, 'mm', 3) },
					units: 'mm',
					standard: 'asme-y14.5-2018',
					// Both located in one datum frame, so the hole's position enters the boundary.
					sharedDatumFrame: true
				});
				if (!r.ok) throw new Error(r.message);
				expect(r.minClearanceAtBoundary!).toBeLessThanOrEqual(r.minClearance!);
				expect(r.maxClearanceAtBoundary!).toBeGreaterThanOrEqual(r.maxClearance!);
			}),
			{ numRuns: 300 }
		);
	});
});
