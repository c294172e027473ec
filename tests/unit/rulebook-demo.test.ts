/*
 * The demo pump (PRODUCT.md §8): exactly the findings its deliberate mistakes call for, and the
 * README's demo table lists exactly those.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { evaluate } from '../../src/lib/tolerance/rulebook';
import {
	bracket,
	bushing,
	demoDrawings,
	housing,
	pumpAssembly,
	shaft,
	type DemoDrawing
} from './fixtures/demo-drawings';

function keys(d: DemoDrawing): string[] {
	return evaluate(d).map((r) => `${r.key} ${r.severity}`);
}

/** The rows of the README's demo findings table: drawing, rule, severity, feature or fit. */
function readmeFindings(): string[][] {
	const readme = readFileSync(join(process.cwd(), 'README.md'), 'utf8');
	const start = readme.indexOf('<!-- demo findings: start -->');
	const end = readme.indexOf('<!-- demo findings: end -->');
	expect(start, 'README demo findings table').toBeGreaterThan(0);
	expect(end).toBeGreaterThan(start);
	const rows = readme
		.slice(start, end)
		.split('\n')
		.filter((line) => line.startsWith('|'))
		.map((line) =>
			line
				.slice(1, -1)
				.split('|')
				.map((cell) => cell.trim())
		);
	expect(rows[0]).toEqual(['drawing', 'rule', 'severity', 'feature or fit', 'why']);
	// Drop the header and the separator; the last column is prose for the reader.
	return rows.slice(2).map((row) => row.slice(0, 4));
}

/** What the rulebook finds on a demo drawing, as the README writes it. */
function findingsAsRows(d: DemoDrawing): string[][] {
	const labels = new Map(d.features.map((f) => [f.id, f.label]));
	// A label must name one feature, or the README's rows would be ambiguous.
	expect(new Set(labels.values()).size, `${d.number} labels`).toBe(labels.size);
	return evaluate(d).map((r) => [
		d.number,
		r.rule,
		r.severity,
		r.subject === 'drawing'
			? 'drawing'
			: r.subject === 'fit'
				? r.fitId!
				: (labels.get(r.featureId!) ?? r.featureId!)
	]);
}

describe('the demo scenario', () => {
	it('KF-1001 housing alone: the reference-only slot, and the withdrawn ISO 2768-2', () => {
		const results = evaluate(housing);
		expect(results.map((r) => `${r.key} ${r.severity}`)).toEqual([
			// ISO 2768-mK cites class K of ISO 2768-2, withdrawn in 2021 (ISO 22081 replaces it).
			'DOC-02|drawing|withdrawn-iso-2768-2 minor',
			// Deliberate: the slot's width is only a reference dimension (8). ISO 129-1 (recalled):
			// a reference dimension is given for information and is not toleranced, so ISO 2768-m
			// does not cover it and the slot has no limits at all.
			'LIM-01|feature:kf1001-slot|reference critical'
		]);
		const slot = results.find((r) => r.rule === 'LIM-01')!;
		expect(slot.message).toBe('Slot width has no limits of size.');
		expect(slot.line).toBe('(8): reference dimension: information only, no tolerance');
		expect(slot.fix).toBe(
			'Dimension the feature with a toleranced size, not a reference or basic one.'
		);
	});

	it('KF-1002 shaft alone: the straightness larger than g6 is no finding by itself', () => {
		expect(keys(shaft)).toEqual(['DOC-02|drawing|withdrawn-iso-2768-2 minor']);
	});

	it('KF-1003 bushing alone', () => {
		expect(keys(bushing)).toEqual(['DOC-02|drawing|withdrawn-iso-2768-2 minor']);
	});

	it('the pump head fits: both bores without Ⓔ, the journal at its VC, the press fit when warm', () => {
		const results = evaluate(pumpAssembly);
		expect(results.map((r) => `${r.key} ${r.severity}`)).toEqual([
			// The housing's drawing, which cites ISO 2768-mK; the shaft and bushing members are
			// judged under their own drawings (the same ISO 8015 and ISO 2768-mK here).
			'DOC-02|drawing|withdrawn-iso-2768-2 minor',
			// Deliberate: KF-1001's bushing bore Ø18 H7 has no Ⓔ; the bushing is pressed into it.
			'ENV-02|feature:kf1001-bore|unbounded major',
			// The housing's slot, as on the housing alone.
			'LIM-01|feature:kf1001-slot|reference critical',
			// Deliberate: KF-1003's bore Ø12 H7 has no Ⓔ; the journal runs in it.
			'ENV-02|feature:kf1003-bore|unbounded major',
			// Deliberate: journal VC 11.994 + 0.020 = 12.014 against the bore's 12.000.
			'FIT-02|fit:fit-journal|boundary critical',
			// Deliberate: the press fit is lost at the pump's 80 °C.
			'FIT-03|fit:fit-bushing|clearance-at-temperature major'
		]);
		const journal = results.find((r) => r.rule === 'FIT-02')!;
		expect(journal.line).toBe(
			'MMC bore 12.000 (nothing bounds it; taken at its smallest size) − VC shaft 12.014 = −0.014, required > 0 for a running fit'
		);
		// Ø18 H7 = 18.000/18.018, p6 = 18.018/18.029 (ISO 286-2:2010 tables, recalled):
		// max clearance 0 at 20 °C. At 80 °C, Δθ = 60 K: hole 18.018 × (1 + 23.4e-6 × 60) =
		// 18.043297, shaft 18.018 × (1 + 18.5e-6 × 60) = 18.038000, clearance 0.0053 (rounded
		// to the drawing's grid as the fit's text shows it).
		const warm = results.find((r) => r.rule === 'FIT-03')!;
		expect(warm.line).toBe(
			'maximum clearance 0.0053 at 80 °C (hole α 23.4, shaft α 18.5 × 10⁻⁶/K, from 20 °C), required ≤ 0 for an interference fit: a transition fit'
		);
		// Every fit member is located or is a datum feature: no FIT-06. The dowels sit in their
		// H7 holes (H7/m6 transition), and the cover bolts' Ø0.2 Ⓜ fits H − F = 6.4 − 6.0.
		expect(results.filter((r) => r.rule === 'FIT-06')).toEqual([]);
		expect(results.filter((r) => r.fitId === 'fit-dowel')).toEqual([]);
		expect(results.filter((r) => r.fitId === 'fit-cover-bolt')).toEqual([]);
	});

	it('KF-2001 bracket: unequal places, a flatness the envelope already holds, no allowance', () => {
		const results = evaluate(bracket);
		expect(results.map((r) => `${r.key} ${r.severity}`)).toEqual([
			// Deliberate: Ø.250-.2515 has 3 and 4 places.
			'LIM-03|feature:kf2001-pivot-hole|limits minor',
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

	it("the README's demo table lists exactly these findings", () => {
		const found = [...demoDrawings, pumpAssembly].flatMap(findingsAsRows);
		expect(readmeFindings()).toEqual(found);
	});
});
