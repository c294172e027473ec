/*
 * The demo pump (PRODUCT.md §8): exactly the findings its deliberate mistakes call for.
 */
import { describe, expect, it } from 'vitest';
import { evaluate } from '../../src/lib/tolerance/rulebook';
import {
	bracket,
	bushing,
	housing,
	pumpAssembly,
	shaft,
	type DemoDrawing
} from './fixtures/demo-drawings';

function keys(d: DemoDrawing): string[] {
	return evaluate(d).map((r) => `${r.key} ${r.severity}`);
}

describe('the demo scenario', () => {
	it('KF-1001 housing alone: only the withdrawn ISO 2768-2 reference', () => {
		expect(keys(housing)).toEqual([
			// ISO 2768-mK cites class K of ISO 2768-2, withdrawn in 2021 (ISO 22081 replaces it).
			'DOC-02|drawing|withdrawn-iso-2768-2 minor'
		]);
		// The slot has no limits of its own: ISO 2768-m gives 8 ±0.2, so LIM-01 does not apply.
	});

	it('KF-1002 shaft alone: the straightness larger than g6 is no finding by itself', () => {
		expect(keys(shaft)).toEqual(['DOC-02|drawing|withdrawn-iso-2768-2 minor']);
	});

	it('KF-1003 bushing alone', () => {
		expect(keys(bushing)).toEqual(['DOC-02|drawing|withdrawn-iso-2768-2 minor']);
	});

	it('the pump head fits: both bores without Ⓔ, and the journal at its virtual condition', () => {
		const results = evaluate(pumpAssembly);
		expect(results.map((r) => `${r.key} ${r.severity}`)).toEqual([
			// The housing's drawing, which cites ISO 2768-mK; the shaft and bushing members are
			// judged under their own drawings (the same ISO 8015 and ISO 2768-mK here).
			'DOC-02|drawing|withdrawn-iso-2768-2 minor',
			// Deliberate: KF-1001's bushing bore Ø18 H7 has no Ⓔ; the bushing is pressed into it.
			'ENV-02|feature:kf1001-bore|unbounded major',
			// Consequences: these fit members carry no position or orientation control, and the
			// ISO 2768-mK note locates nothing (ISO 2768-2 has no position tolerance).
			'FIT-06|feature:kf1001-dowel|unlocated minor',
			'FIT-06|feature:kf1002-journal|unlocated minor',
			// Deliberate: KF-1003's bore Ø12 H7 has no Ⓔ; the journal runs in it.
			'ENV-02|feature:kf1003-bore|unbounded major',
			'FIT-06|feature:kf1003-bore|unlocated minor',
			'FIT-06|feature:kf1003-outside|unlocated minor',
			// Deliberate: journal VC 11.994 + 0.020 = 12.014 against the bore's 12.000.
			'FIT-02|fit:fit-journal|boundary critical'
		]);
		const journal = results.find((r) => r.rule === 'FIT-02')!;
		expect(journal.line).toBe(
			'MMC bore 12.000 (nothing bounds it; taken at its smallest size) − VC shaft 12.014 = −0.014, required > 0 for a running fit'
		);
		// The press fit Ø18 H7/p6 is interference at worst (max clearance 18.018 − 18.018 = 0),
		// the dowels sit in their H7 holes (H7/m6 transition), and the cover bolts' Ø0.2 Ⓜ fits
		// H − F = 6.4 − 6.0.
		expect(results.filter((r) => r.fitId === 'fit-bushing' && r.subject === 'fit')).toEqual([]);
		expect(results.filter((r) => r.fitId === 'fit-dowel').map((r) => r.key)).toEqual([
			'FIT-06|feature:kf1001-dowel|unlocated'
		]);
		expect(results.filter((r) => r.fitId === 'fit-cover-bolt')).toEqual([]);
	});

	it('KF-2001 bracket: unequal places, a flatness the envelope already holds, no allowance', () => {
		const results = evaluate(bracket);
		expect(results.map((r) => `${r.key} ${r.severity}`)).toEqual([
			// Deliberate: Ø.250-.2515 has 3 and 4 places.
			'LIM-03|feature:kf2001-pivot-hole|limits minor',
			// Consequence of the drawing as drawn: the pivot hole is located only by ±.005
			// title-block dimensions, with no perpendicularity to the tab face.
			'FIT-06|feature:kf2001-pivot-hole|unlocated minor',
			// Deliberate: Ø.2500-.249 has 4 and 3 places.
			'LIM-03|feature:kf2001-pivot-pin|limits minor',
			// Deliberate: flatness .015 on a tab whose size tolerance is .010 under Rule #1.
			'ENV-01|feature:kf2001-tab|flatness minor',
			// Deliberate: running fit with MMC hole .2500 = MMC pin .2500.
			'FIT-01|fit:fit-pivot|min-clearance critical'
		]);
		expect(results.find((r) => r.rule === 'FIT-01')!.line).toBe(
			'MMC hole 0.2500 − MMC pin 0.2500 = 0.0000, required > 0 for a running fit'
		);
		expect(results.find((r) => r.rule === 'ENV-01')!.line).toContain(
			'flatness 0.015 ≥ size tolerance 0.010'
		);
	});
});
