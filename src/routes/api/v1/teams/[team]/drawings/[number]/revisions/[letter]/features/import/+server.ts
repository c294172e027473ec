import { error, json } from '@sveltejs/kit';
import { importMaxRows, importRequired, importRow } from '$lib/schemas/feature-import';
import { refuse } from '$lib/server/api';
import { readCsv } from '$lib/server/csv';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { importFeatures, type RowProblem } from '$lib/server/features';
import type { FeatureInput } from '$lib/schemas/features';
import type { RequestHandler } from './$types';

/** A features file is small: 2 MB holds far more than the row limit. */
const maxBytes = 2 * 1024 * 1024;

async function csvText(request: Request): Promise<string> {
	const type = request.headers.get('content-type') ?? '';
	const length = Number(request.headers.get('content-length') ?? 0);
	if (length > maxBytes) error(413, { message: 'The file is larger than 2 MB', code: 'too_large' });
	if (type.startsWith('text/csv') || type.startsWith('text/plain')) return request.text();
	if (type.startsWith('multipart/form-data')) {
		const file = (await request.formData()).get('file');
		if (file instanceof File) {
			if (file.size > maxBytes)
				error(413, { message: 'The file is larger than 2 MB', code: 'too_large' });
			return file.text();
		}
		error(400, { message: 'Send the CSV in a field named file', code: 'invalid' });
	}
	error(415, {
		message: 'Send the CSV as a text/csv body or as multipart/form-data in a field named file',
		code: 'unsupported_media_type'
	});
}

function invalidRows(rows: RowProblem[], message: string): never {
	error(422, { code: 'invalid_rows', message, rows } as App.Error);
}

export const POST: RequestHandler = async ({ params, request }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'editFeatures');
	const { header, rows } = readCsv(await csvText(request));
	const missing = importRequired.filter((c) => !header.includes(c));
	if (missing.length > 0)
		invalidRows(
			[{ line: 1, reason: `the header lacks ${missing.join(', ')}` }],
			`Nothing was imported: the header row needs the columns ${importRequired.join(', ')}`
		);
	if (rows.length === 0)
		invalidRows(
			[{ line: 1, reason: 'no rows below the header' }],
			'Nothing was imported: the file has no rows'
		);
	if (rows.length > importMaxRows)
		invalidRows(
			[{ line: rows[importMaxRows].line, reason: `more than ${importMaxRows} rows` }],
			`Nothing was imported: at most ${importMaxRows} rows per file`
		);
	const good: { line: number; input: FeatureInput }[] = [];
	const problems: RowProblem[] = [];
	for (const row of rows) {
		const read = importRow(row.cells);
		if (read.ok) good.push({ line: row.line, input: read.input });
		else problems.push({ line: row.line, reason: read.reason });
	}
	const outcome = await importFeatures(db, place.user, place, good, problems);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.features, { status: 201 });
};
