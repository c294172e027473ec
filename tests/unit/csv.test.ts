import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { neutralise, readCsv, toCsv } from '../../src/lib/server/csv';

describe('CSV cells', () => {
	it('neutralise what a spreadsheet would run as a formula', () => {
		expect(neutralise('=HYPERLINK("http://example.test","x")')).toBe(
			`'=HYPERLINK("http://example.test","x")`
		);
		expect(neutralise('+1+2')).toBe("'+1+2");
		expect(neutralise('@SUM(A1)')).toBe("'@SUM(A1)");
		expect(neutralise('\tx')).toBe("'\tx");
		expect(neutralise('\rx')).toBe("'\rx");
		expect(neutralise('-A1')).toBe("'-A1");
	});

	it('keep numbers numbers, negative ones too', () => {
		expect(neutralise('-0.017')).toBe('-0.017');
		expect(neutralise('+0.018')).toBe('+0.018');
		expect(neutralise(12)).toBe('12');
		expect(neutralise(null)).toBe('');
		expect(neutralise(true)).toBe('true');
	});

	it('never leave a cell starting with a formula character unless it is a number', () => {
		fc.assert(
			fc.property(fc.string(), (s) => {
				const out = neutralise(s);
				if (/^[=+\-@\t\r]/.test(out)) expect(Number.isFinite(Number(out))).toBe(true);
				expect(out.endsWith(s)).toBe(true);
			})
		);
	});

	it('write a byte order mark and read back what was written', () => {
		fc.assert(
			fc.property(
				fc.array(fc.array(fc.string({ maxLength: 12 }), { minLength: 2, maxLength: 2 }), {
					maxLength: 8
				}),
				(rows) => {
					const text = toCsv(['a', 'b'], rows);
					expect(text.startsWith('\uFEFFa,b')).toBe(true);
					const back = Papa.parse<string[]>(text.slice(1), { skipEmptyLines: false }).data;
					expect(back.slice(1, rows.length + 1)).toEqual(rows.map((r) => r.map(neutralise)));
				}
			)
		);
	});
});

describe('reading a CSV', () => {
	it('numbers rows by their line in the file, header line 1, quoted line breaks counted', () => {
		const { header, rows } = readCsv(
			'\uFEFFlabel,kind\r\nBore,bore\r\n\r\n"two\r\nlines",pin\r\nLast,shaft\r\n'
		);
		expect(header).toEqual(['label', 'kind']);
		expect(rows).toEqual([
			{ line: 2, cells: { label: 'Bore', kind: 'bore' } },
			{ line: 4, cells: { label: 'two\r\nlines', kind: 'pin' } },
			{ line: 6, cells: { label: 'Last', kind: 'shaft' } }
		]);
	});
});
