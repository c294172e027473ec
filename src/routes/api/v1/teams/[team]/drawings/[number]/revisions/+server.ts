import { error, json } from '@sveltejs/kit';
import { config } from '$lib/server/config';
import { db } from '$lib/server/db';
import { listRevisions, publicRevision } from '$lib/server/db/queries/drawings';
import { requireDrawing } from '$lib/server/drawings';
import { getStorage } from '$lib/server/services';
import { receiveUpload, revisionStorageKey, storeRevision } from '$lib/server/uploads';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { drawing, releasedOnly } = await requireDrawing(params.team, params.number, 'view');
	const rows = await listRevisions(db, drawing.id, { releasedOnly });
	return json(rows.map((r) => publicRevision(r.revision)));
};

/** Multipart: `file` (the PDF), optional `reason` and `letter`. */
export const POST: RequestHandler = async ({ params, request }) => {
	const { user, drawing } = await requireDrawing(params.team, params.number, 'author');
	const storage = getStorage();
	const received = await receiveUpload(request, {
		maxBytes: config.maxUploadBytes,
		tempDir: config.uploadTempDir,
		store: { storage, key: revisionStorageKey(drawing) }
	});
	if (!received.ok) error(received.status, { message: received.message, code: received.code });
	const stored = await storeRevision(db, storage, user, drawing, received);
	if (!stored.ok) error(stored.status, { message: stored.message, code: stored.code });
	return json(publicRevision(stored.revision), { status: 201 });
};
