import { fail } from '@sveltejs/kit';
import { generalToleranceFromForm, revisionSettings } from '$lib/schemas/drawings';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import { publicDrawing, publicRevision, updateRevision } from '$lib/server/db/queries/drawings';
import { getUserById } from '$lib/server/db/queries/users';
import { isFrozen } from '$lib/server/db/schema';
import { listFindings } from '$lib/server/db/queries/findings';
import { countFindings } from '$lib/findings';
import { requireRevision } from '$lib/server/drawings';
import { featuresOf } from '$lib/server/features';
import { fieldErrorsOf, refuseForm } from '$lib/server/forms';
import { movesFor, transitionsOf } from '$lib/server/transitions';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const { drawing, revision, membership } = place;
	const uploader = revision.uploadedBy ? await getUserById(db, revision.uploadedBy) : null;
	const frozen = isFrozen(revision.state);
	const findingCounts = countFindings(await listFindings(db, revision.id));
	return {
		drawing: publicDrawing(drawing),
		revision: {
			...publicRevision(revision),
			uploadedBy: uploader ? (uploader.name ?? uploader.email) : null,
			frozen
		},
		features: await featuresOf(db, place),
		may: {
			// The board is read-only without it, and on a frozen revision for everyone.
			editFeatures: can(membership.role, 'editFeatures') && !frozen,
			editSettings: can(membership.role, 'author') && !frozen
		},
		findingCounts,
		review: {
			moves: movesFor(membership.role, revision.state),
			last: (await transitionsOf(db, revision.id)).at(-1) ?? null
		}
	};
};

export const actions: Actions = {
	/** The revision's own units, standard and general tolerance, while it is not frozen. */
	settings: async ({ params, request }) => {
		const { user, drawing, revision } = await requireRevision(
			params.team,
			params.number,
			params.letter,
			'author'
		);
		const form = Object.fromEntries(await request.formData());
		const candidate = {
			units: form.units,
			standard: form.standard,
			generalTolerance: generalToleranceFromForm(form)
		};
		const parsed = revisionSettings.safeParse(candidate);
		if (!parsed.success) return refuseForm(400, fieldErrorsOf(parsed.error), candidate);
		const updated = await updateRevision(db, user, drawing, revision, Number(form.version) || 0, {
			settings: parsed.data
		});
		if (!updated.ok) {
			return fail(409, {
				values: candidate,
				message:
					updated.code === 'frozen'
						? `Revision ${revision.letter} is ${updated.current.state}: its settings are frozen.`
						: 'Someone changed this revision while you were editing: your settings were not applied. The page now shows theirs.'
			});
		}
		return { saved: true };
	}
};
