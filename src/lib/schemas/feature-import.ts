import { featureInput } from './features';
import { firstIssue } from './calc';

/** Columns a features CSV must have, and those it may have. */
export const importRequired = ['label', 'kind', 'internal', 'callout', 'quantity'] as const;
export const importOptional = ['notes', 'boughtOut'] as const;
/** Rows in one file at most. */
export const importMaxRows = 5000;

export const importDescription = `Send the file as a \`text/csv\` body, or as \`multipart/form-data\` in a field named \`file\` (UTF-8; a byte order mark is fine).

The first line is the header. Required columns: \`label\`, \`kind\` (hole, bore, pin, shaft, slot, tab, width, thread, other), \`internal\` (true or false; empty: read from an ISO 286 code's letter case, else the kind), \`callout\` (as written on the drawing, e.g. \`Ø12 H7\`), \`quantity\` (empty: the callout's \`4X\`, else 1). Optional: \`notes\`, \`boughtOut\` (true or false). Other columns are ignored.

Each row is checked like a feature sent to \`POST …/features\`, its callout read under the revision's settings. If any row is bad nothing is imported and the answer is 422 \`{error: {code: "invalid_rows", message, rows: [{line, reason}]}}\` with the line in the file (the header is line 1). Imported features take the drawing's next balloon numbers in file order and have \`location: null\` (not yet placed on the sheet). At most ${importMaxRows} rows.`;

const truth: Record<string, boolean> = {
	true: true,
	yes: true,
	y: true,
	'1': true,
	false: false,
	no: false,
	n: false,
	'0': false
};

function flag(text: string | undefined, name: string): boolean | undefined | string {
	const t = (text ?? '').trim().toLowerCase();
	if (t === '') return undefined;
	if (t in truth) return truth[t];
	return `${name} is true or false (or empty), not "${text}"`;
}

/** A CSV row as a feature input, or the reason it is not one. */
export function importRow(cells: Record<string, string>) {
	const internal = flag(cells.internal, 'internal');
	if (typeof internal === 'string') return { ok: false as const, reason: internal };
	const boughtOut = flag(cells.boughtOut, 'boughtOut');
	if (typeof boughtOut === 'string') return { ok: false as const, reason: boughtOut };
	const q = (cells.quantity ?? '').trim();
	if (q !== '' && !/^\d+$/.test(q))
		return { ok: false as const, reason: `quantity is a whole number (or empty), not "${q}"` };
	const parsed = featureInput.safeParse({
		label: cells.label ?? '',
		kind: (cells.kind ?? '').trim().toLowerCase(),
		internal,
		callout: cells.callout ?? '',
		quantity: q === '' ? undefined : Number(q),
		notes: cells.notes ?? '',
		boughtOut: boughtOut ?? false
	});
	if (!parsed.success) return { ok: false as const, reason: firstIssue(parsed.error) };
	if (!parsed.data.callout)
		return { ok: false as const, reason: 'callout: write the callout of the feature' };
	return { ok: true as const, input: parsed.data };
}
