import { redirect } from '@sveltejs/kit';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import {
	createDrawing,
	DrawingNumberTaken,
	listDrawings,
	publicDrawing
} from '$lib/server/db/queries/drawings';
import { readDrawingForm } from '$lib/server/drawing-forms';
import { refuseForm } from '$lib/server/forms';
import { requireMember } from '$lib/server/guards';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { team, membership } = await requireMember(params.team, 'view');
	const drawings = await listDrawings(db, team.id, {
		releasedOnly: !can(membership.role, 'viewUnreleased')
	});
	return {
		drawings: drawings.map((d) => ({
			...publicDrawing(d),
			latest: d.latest,
			updatedAt: d.updatedAt
		}))
	};
};

export const actions: Actions = {
	create: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'author');
		const form = await readDrawingForm(request);
		if (!form.ok) return refuseForm(400, form.errors, form.values);
		try {
			const drawing = await createDrawing(db, user, team.id, form.data);
			redirect(303, `/teams/${params.team}/drawings/${encodeURIComponent(drawing.number)}`);
		} catch (err) {
			if (!(err instanceof DrawingNumberTaken)) throw err;
			return refuseForm(409, { number: [err.message] }, form.values);
		}
	}
};
