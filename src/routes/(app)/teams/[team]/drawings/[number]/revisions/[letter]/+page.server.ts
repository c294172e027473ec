import { db } from '$lib/server/db';
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
		drawing: { number: drawing.number, title: drawing.title, units: drawing.units },
		revision: {
			letter: revision.letter,
			reason: revision.reason,
			state: revision.state,
			pages: revision.pages,
			sheets: revision.sheets,
			size: revision.size,
			sha256: revision.sha256,
			createdAt: revision.createdAt,
			uploadedBy: uploader ? (uploader.name ?? uploader.email) : null
		}
	};
};
