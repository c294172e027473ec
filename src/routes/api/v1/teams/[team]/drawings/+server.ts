import { error, json } from '@sveltejs/kit';
import { drawingInput } from '$lib/schemas/drawings';
import { readJson } from '$lib/server/api-input';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import {
	createDrawing,
	DrawingNumberTaken,
	listDrawings,
	publicDrawing
} from '$lib/server/db/queries/drawings';
import { requireMember } from '$lib/server/guards';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const { team, membership } = await requireMember(params.team, 'view');
	const rows = await listDrawings(db, team.id, {
		releasedOnly: !can(membership.role, 'viewUnreleased')
	});
	return json(rows.map((row) => ({ ...publicDrawing(row), latestRevision: row.latest })));
};

export const POST: RequestHandler = async ({ params, request }) => {
	const { user, team } = await requireMember(params.team, 'author');
	const input = await readJson(request, drawingInput);
	try {
		const drawing = await createDrawing(db, user, team.id, input);
		return json(publicDrawing(drawing), { status: 201 });
	} catch (err) {
		if (err instanceof DrawingNumberTaken) error(409, { message: err.message, code: 'conflict' });
		throw err;
	}
};
