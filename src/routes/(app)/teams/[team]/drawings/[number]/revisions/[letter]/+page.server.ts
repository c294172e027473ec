import { db } from '$lib/server/db';
import { publicDrawing, publicRevision } from '$lib/server/db/queries/drawings';
import { getUserById } from '$lib/server/db/queries/users';
import { requireRevision } from '$lib/server/drawings';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { drawing, revision } = await requireRevision(
		params.team,
		params.number,
		params.letter,
		'view'
	);
	const uploader = revision.uploadedBy ? await getUserById(db, revision.uploadedBy) : null;
	return {
		drawing: publicDrawing(drawing),
		revision: {
			...publicRevision(revision),
			uploadedBy: uploader ? (uploader.name ?? uploader.email) : null
		}
	};
};
