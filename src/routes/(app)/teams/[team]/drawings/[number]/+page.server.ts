import { fail } from '@sveltejs/kit';
import { can } from '$lib/server/capabilities';
import { config } from '$lib/server/config';
import { db } from '$lib/server/db';
import {
	listRevisions,
	publicDrawing,
	publicRevision,
	StaleEdit,
	updateDrawing
} from '$lib/server/db/queries/drawings';
import { readDrawingForm } from '$lib/server/drawing-forms';
import { requireDrawing } from '$lib/server/drawings';
import { refuseForm } from '$lib/server/forms';
import { nextRevisionLetter } from '$lib/revision-letters';
import { listTransitions } from '$lib/server/db/queries/transitions';
import { transitionJson } from '$lib/server/transitions';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { drawing, releasedOnly, membership } = await requireDrawing(
		params.team,
		params.number,
		'view'
	);
	const revisions = await listRevisions(db, drawing.id, { releasedOnly });
	const moves = await listTransitions(
		db,
		revisions.map((r) => r.revision.id)
	);
	return {
		drawing: publicDrawing(drawing),
		revisions: revisions.map(({ revision, uploadedByName }) => ({
			...publicRevision(revision),
			uploadedByName,
			// The revision's history, newest first: who moved it, when and why.
			history: moves
				.filter((move) => move.revisionId === revision.id)
				.map(transitionJson)
				.reverse()
		})),
		nextLetter: nextRevisionLetter(revisions.map((r) => r.revision.letter)),
		mayAuthor: can(membership.role, 'author'),
		maxUploadMb: config.maxUploadBytes / 1024 / 1024
	};
};

export const actions: Actions = {
	edit: async ({ params, request }) => {
		const { user, drawing } = await requireDrawing(params.team, params.number, 'author');
		const form = await readDrawingForm(request);
		if (!form.ok) return refuseForm(400, form.errors, form.values);
		const { number: _number, ...changes } = form.data;
		try {
			await updateDrawing(db, user, drawing, form.version, changes);
			return { saved: true };
		} catch (err) {
			if (!(err instanceof StaleEdit)) throw err;
			return fail(409, {
				values: form.values,
				message:
					'Someone else saved this drawing while you were editing: your changes were not applied. The page now shows their version.'
			});
		}
	}
};
