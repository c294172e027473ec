/*
 * CSV out and in (PRODUCT.md §5 tables): papaparse writes and reads; this module adds what
 * spreadsheet programs need — a UTF-8 byte order mark, and cells that cannot run as formulas.
 */
import Papa from 'papaparse';

const formulaStart = /^[=+\-@\t\r]/;
const plainNumber = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/**
 * A cell as text that a spreadsheet reads as text: one starting with `=`, `+`, `-`, `@`, a tab or
 * a carriage return gets a leading apostrophe (OWASP's advice on CSV injection), except a plain
 * number such as `-0.017`, which stays a number.
 */
export function neutralise(value: unknown): string {
	if (value === null || value === undefined) return '';
	const text = String(value);
	if (!formulaStart.test(text) || plainNumber.test(text)) return text;
	return `'${text}`;
}

/** The CSV text with a byte order mark, CRLF line ends and every cell neutralised. */
export function toCsv(fields: string[], rows: unknown[][]): string {
	const data = rows.map((row) => row.map(neutralise));
	return '\uFEFF' + Papa.unparse({ fields, data }, { newline: '\r\n', quotes: false });
}

export function csvResponse(name: string, body: string) {
	return new Response(body, {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${name.replace(/[^\w.-]/g, '_')}"`,
			'cache-control': 'no-store'
		}
	});
}

/** One data row of an uploaded CSV, with its line in the file (the header is line 1). */
export interface CsvRow {
	line: number;
	cells: Record<string, string>;
}

/**
 * Reads a CSV with a header row. Lines count as the file shows them: a quoted cell that spans
 * lines moves the next row's number on; blank lines are skipped but counted.
 */
export function readCsv(text: string): { header: string[]; rows: CsvRow[] } {
	const body = text.replace(/^\uFEFF/, '');
	const parsed = Papa.parse<string[]>(body, { skipEmptyLines: false });
	const rows: CsvRow[] = [];
	let header: string[] = [];
	let line = 1;
	parsed.data.forEach((cells, index) => {
		const start = line;
		// The row's own line breaks (inside quoted cells) and the one that ends it.
		line += 1 + cells.reduce((n, c) => n + (c.match(/\r\n|\r|\n/g)?.length ?? 0), 0);
		if (index === 0) {
			header = cells.map((c) => c.trim());
			return;
		}
		if (cells.every((c) => c.trim() === '')) return;
		rows.push({
			line: start,
			cells: Object.fromEntries(header.map((h, i) => [h, (cells[i] ?? '').trim()]))
		});
	});
	return { header, rows };
}
