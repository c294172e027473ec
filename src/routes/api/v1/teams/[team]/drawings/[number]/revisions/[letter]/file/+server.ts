import { error } from '@sveltejs/kit';
import { Readable } from 'node:stream';
import { requireRevision } from '$lib/server/drawings';
import { getStorage } from '$lib/server/services';
import { parseRange } from '$lib/server/storage';
import type { RequestHandler } from './$types';

/** The PDF, streamed through the app (the bucket is never exposed), with Range support. */
export const GET: RequestHandler = async ({ params, request }) => {
	const { drawing, revision } = await requireRevision(
		params.team,
		params.number,
		params.letter,
		'view'
	);
	const size = revision.size;
	const range = parseRange(request.headers.get('range'), size);
	const headers = new Headers({
		'content-type': 'application/pdf',
		'accept-ranges': 'bytes',
		// A revision's bytes never change (the hash names them), but access can: the browser
		// asks again on each use and gets a 304 while it may still see the file.
		etag: `"${revision.sha256}"`,
		'cache-control': 'private, no-cache',
		// Opened on its own, the PDF runs no script and reaches nothing of the app's origin.
		'content-security-policy': 'sandbox',
		'content-disposition': `inline; filename="${drawing.number}-${revision.letter}.pdf"`
	});
	if (range === 'unsatisfiable') {
		headers.set('content-range', `bytes */${size}`);
		return new Response(null, { status: 416, headers });
	}
	if (request.headers.get('if-none-match') === `"${revision.sha256}"` && !range) {
		return new Response(null, { status: 304, headers });
	}
	const object = await getStorage()
		.get(revision.storageKey, range ?? undefined)
		.catch(() => error(404, { message: 'The file is missing from storage', code: 'not_found' }));
	const body = Readable.toWeb(object.body) as ReadableStream;
	if (range) {
		headers.set('content-range', `bytes ${range.start}-${range.end}/${size}`);
		headers.set('content-length', String(range.end - range.start + 1));
		return new Response(body, { status: 206, headers });
	}
	headers.set('content-length', String(size));
	return new Response(body, { status: 200, headers });
};
