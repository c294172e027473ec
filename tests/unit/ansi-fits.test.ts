import { describe, expect, test } from 'vitest';
import { PER_THOU, ZERO, parseDecimal } from '../../src/lib/tolerance/decimal';
import { ANSI_FIT_CLASSES, ansiFit, thousandths } from '../../src/lib/tolerance/ansi-fits';
import { ANSI_B4_1, type AnsiFitClass } from '../../src/lib/tolerance/tables/ansi-b4-1';

const inch = (text: string) => parseDecimal(text, 'in')!.value;
const thou = (n: number) => Math.round(n * 100) * (PER_THOU / 100);

/** [class, basic size in, hole upper, shaft upper, shaft lower, fit low, fit high] (thousandths) */
type Row = [AnsiFitClass, string, number, number, number, number, number];

// Published rows: ANSI B4.1-1967 tables as reprinted in Machinery's Handbook 31st ed.
// (tables 8a, 8b, 9, 10, 12) and 27th ed. (table 11, force and shrink fits).
const published: Row[] = [
	// Running and sliding fits (MH 31st table 8a/8b)
	['RC1', '0.1', 0.2, -0.1, -0.25, 0.1, 0.45],
	['RC1', '0.5', 0.3, -0.25, -0.45, 0.25, 0.75],
	['RC1', '1.5', 0.4, -0.4, -0.7, 0.4, 1.1],
	['RC1', '10', 0.9, -0.8, -1.4, 0.8, 2.3],
	['RC2', '0.2', 0.3, -0.15, -0.35, 0.15, 0.65],
	['RC2', '1', 0.5, -0.3, -0.7, 0.3, 1.2],
	['RC2', '18', 1.6, -1.2, -2.2, 1.2, 3.8],
	['RC3', '0.3', 0.6, -0.5, -0.9, 0.5, 1.5],
	['RC3', '4', 1.4, -1.4, -2.3, 1.4, 3.7],
	['RC3', '16', 2.5, -4.0, -5.6, 4.0, 8.1],
	['RC4', '0.1', 0.6, -0.3, -0.7, 0.3, 1.3],
	['RC4', '2', 1.8, -1.2, -2.4, 1.2, 4.2],
	['RC4', '13', 3.5, -3.0, -5.2, 3.0, 8.7],
	['RC5', '0.75', 1.2, -1.6, -2.4, 1.6, 3.6],
	['RC5', '8', 2.8, -4.0, -5.8, 4.0, 8.6],
	['RC6', '0.1', 1.0, -0.6, -1.2, 0.6, 2.2],
	['RC6', '1.5', 2.5, -2.0, -3.6, 2.0, 6.1],
	['RC7', '0.3', 1.4, -1.6, -2.5, 1.6, 3.9],
	['RC7', '4', 3.5, -5.0, -7.2, 5.0, 10.7],
	['RC8', '0.5', 2.8, -3.5, -5.1, 3.5, 7.9],
	['RC8', '12', 8.0, -12.0, -17.0, 12.0, 25.0],
	['RC9', '0.1', 2.5, -4.0, -5.6, 4.0, 8.1],
	['RC9', '1', 5.0, -7.0, -10.5, 7.0, 15.5],
	['RC9', '19', 16.0, -25.0, -35.0, 25.0, 51.0],
	// Locational clearance fits (MH 31st table 9)
	['LC1', '0.1', 0.25, 0, -0.2, 0, 0.45],
	['LC2', '1', 0.8, 0, -0.5, 0, 1.3],
	['LC3', '3', 1.8, 0, -1.2, 0, 3.0],
	['LC4', '0.3', 2.2, 0, -1.4, 0, 3.6],
	['LC5', '0.1', 0.4, -0.1, -0.35, 0.1, 0.75],
	['LC6', '0.1', 1.0, -0.3, -0.9, 0.3, 1.9],
	['LC6', '1', 2.0, -0.8, -2.0, 0.8, 4.0],
	['LC7', '0.5', 2.8, -1.2, -2.8, 1.2, 5.6],
	['LC7', '1.5', 4.0, -2.0, -4.5, 2.0, 8.5],
	['LC8', '0.2', 1.8, -1.2, -2.4, 1.2, 4.2],
	['LC8', '1', 3.5, -2.5, -4.5, 2.5, 8.0],
	['LC9', '0.3', 3.5, -3.0, -5.2, 3.0, 8.7],
	['LC9', '0.5', 4.0, -3.5, -6.3, 3.5, 10.3],
	['LC10', '0.2', 5, -4.5, -9.5, 4.5, 14.5],
	['LC10', '1', 8, -7, -15, 7, 23],
	['LC11', '0.3', 9, -7, -16, 7, 25],
	['LC11', '1', 12, -10, -22, 10, 34],
	// Transition fits (MH 31st table 10): fit = interference (−) / clearance (+)
	['LT1', '0.1', 0.4, 0.12, -0.12, -0.12, 0.52],
	['LT1', '2', 1.2, 0.3, -0.3, -0.3, 1.5],
	['LT2', '1', 1.2, 0.4, -0.4, -0.4, 1.6],
	['LT2', '18', 4.0, 1.2, -1.2, -1.2, 5.2],
	['LT4', '0.3', 0.9, 0.7, 0.1, -0.7, 0.8],
	['LT4', '8', 2.8, 2.0, 0.2, -2.0, 2.6],
	['LT5', '0.5', 0.7, 0.9, 0.5, -0.9, 0.2],
	['LT5', '14', 2.2, 3.0, 1.6, -3.0, 0.6],
	// Interference locational fits (MH 31st table 12): fit = interference min / max
	['LN1', '0.1', 0.25, 0.45, 0.25, 0, 0.45],
	['LN1', '5', 1.0, 1.9, 1.2, 0.2, 1.9],
	['LN2', '0.2', 0.5, 0.8, 0.5, 0, 0.8],
	['LN2', '12', 2.0, 3.4, 2.2, 0.2, 3.4],
	['LN3', '0.1', 0.4, 0.75, 0.5, 0.1, 0.75],
	['LN3', '14', 2.2, 5.9, 4.5, 2.3, 5.9],
	// Force and shrink fits (MH 27th table 11): fit = interference min / max
	['FN1', '0.1', 0.25, 0.5, 0.3, 0.05, 0.5],
	['FN1', '1', 0.5, 1.2, 0.8, 0.3, 1.2],
	['FN1', '3.5', 0.9, 2.4, 1.8, 0.9, 2.4],
	['FN2', '0.5', 0.7, 1.6, 1.2, 0.5, 1.6],
	['FN2', '2', 1.2, 2.7, 2.0, 0.8, 2.7],
	['FN3', '1', 0.8, 2.1, 1.6, 0.8, 2.1],
	['FN3', '3', 1.2, 3.7, 3.0, 1.8, 3.7],
	['FN4', '0.1', 0.4, 0.95, 0.7, 0.3, 0.95],
	['FN4', '1.75', 1.0, 3.4, 2.8, 1.8, 3.4],
	['FN5', '0.2', 0.7, 1.7, 1.2, 0.5, 1.7],
	['FN5', '1.5', 1.6, 4.0, 3.0, 1.4, 4.0],
	['FN5', '3.5', 2.2, 8.4, 7.0, 4.8, 8.4]
];

describe('ANSI B4.1 published rows', () => {
	test.each(published)('%s at %s in', (cls, size, holeUpper, shaftUpper, shaftLower, low, high) => {
		const r = ansiFit(cls, inch(size));
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.hole.upperDeviation).toBe(thou(holeUpper));
		expect(r.hole.lowerDeviation).toBe(0);
		expect(r.shaft.upperDeviation).toBe(thou(shaftUpper));
		expect(r.shaft.lowerDeviation).toBe(thou(shaftLower));
		expect([r.published.low, r.published.high].map(Number)).toEqual([low, high]);
		expect(r.hole.upper).toBe(inch(size) + thou(holeUpper));
		expect(r.shaft.lower).toBe(inch(size) + thou(shaftLower));
	});
});

describe('ANSI B4.1 consistency', () => {
	test('every row: the printed fit values equal the differences of its limits', () => {
		let rows = 0;
		for (const cls of ANSI_FIT_CLASSES) {
			const table = ANSI_B4_1[cls];
			for (const [, , low, high, hu, hl, su, sl] of table.rows) {
				const minClearance = thousandths(hl) - thousandths(su);
				const maxClearance = thousandths(hu) - thousandths(sl);
				const [a, b] = [thousandths(low), thousandths(high)];
				// Interference tables print (least, most) interference: −max and −min clearance.
				const expected =
					table.kind === 'interference'
						? [0 - maxClearance + 0, 0 - minClearance + 0]
						: [minClearance, maxClearance];
				expect([a, b], `${cls} ${low} ${high}`).toEqual(expected);
				rows++;
			}
		}
		expect(rows).toBeGreaterThan(400);
	});

	test('ranges run without gaps up to 19.69 in, and every class is present', () => {
		expect(ANSI_FIT_CLASSES).toHaveLength(9 + 11 + 6 + 3 + 5);
		for (const cls of ANSI_FIT_CLASSES) {
			const rows = ANSI_B4_1[cls].rows;
			for (let i = 1; i < rows.length; i++) expect(rows[i][0], cls).toBe(rows[i - 1][1]);
			expect(rows[rows.length - 1][1], cls).toBe('19.69');
			for (const row of rows) expect(thousandths(row[4]), cls).toBeGreaterThan(0);
		}
	});

	test('clearance classes always clear, interference classes always interfere', () => {
		for (const cls of ANSI_FIT_CLASSES) {
			for (const row of ANSI_B4_1[cls].rows) {
				const r = ansiFit(cls, inch(row[1]));
				if (!r.ok) throw new Error(r.reason);
				if (r.kind === 'clearance') expect(r.minClearance, cls).toBeGreaterThanOrEqual(0);
				if (r.kind === 'interference') expect(r.maxClearance, cls).toBeLessThanOrEqual(0);
				if (r.kind === 'transition') {
					expect(r.minClearance, cls).toBeLessThan(0);
					expect(r.maxClearance, cls).toBeGreaterThan(0);
				}
			}
		}
	});
});

describe('ANSI B4.1 lookups', () => {
	test('a size on a boundary belongs to the lower range', () => {
		expect(ansiFit('RC1', inch('0.12'))).toMatchObject({
			hole: { upperDeviation: thou(0.2) },
			shaft: { lowerDeviation: thou(-0.25) }
		});
		expect(ansiFit('RC1', inch('0.1201'))).toMatchObject({ shaft: { lowerDeviation: thou(-0.3) } });
		const r = ansiFit('FN2', inch('0.56'));
		expect(r.ok && r.sizeRange).toEqual({ over: inch('0.40'), upTo: inch('0.56') });
	});

	test('not covered: outside the held ranges, and classes that start higher', () => {
		expect(ansiFit('RC4', inch('19.7')).ok).toBe(false);
		expect(ansiFit('RC4', ZERO).ok).toBe(false);
		const lt3 = ansiFit('LT3', inch('0.2'));
		expect(!lt3.ok && lt3.reason).toContain('over 0.24 in');
		const fn3 = ansiFit('FN3', inch('0.5'));
		expect(!fn3.ok && fn3.reason).toContain('over 0.95 in');
		expect(ansiFit('XX1' as AnsiFitClass, inch('1')).ok).toBe(false);
	});

	test('exact inch arithmetic: limits of RC4 at 0.875 in', () => {
		// 0.875 in RC4: hole +1.2/0, shaft −0.8/−1.6 thousandths (0.71–1.19 row)
		const r = ansiFit('RC4', inch('0.875'));
		if (!r.ok) throw new Error(r.reason);
		expect(r.hole.upper).toBe(inch('0.8762'));
		expect(r.hole.lower).toBe(inch('0.875'));
		expect(r.shaft.upper).toBe(inch('0.8742'));
		expect(r.shaft.lower).toBe(inch('0.8734'));
		expect(r.minClearance).toBe(inch('0.0008'));
		expect(r.maxClearance).toBe(inch('0.0028'));
	});
});
