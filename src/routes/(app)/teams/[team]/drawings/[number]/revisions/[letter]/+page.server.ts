import { fail } from '@sveltejs/kit';
import { generalToleranceFromForm, revisionSettings } from '$lib/schemas/drawings';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import {
	isVisibleToSuppliers,
	publicDrawing,
	publicRevision,
	updateRevision
} from '$lib/server/db/queries/drawings';
import { getUserById } from '$lib/server/db/queries/users';
import { isFrozen } from '$lib/server/db/schema';
import { findingChoices, findingsOf, powersOf } from '$lib/server/findings';
import { fitsOf } from '$lib/server/fits';
import type { FitAnswer } from '$lib/fits';
import { latestEventSeq } from '$lib/server/db/queries/revision-events';
import { requireRevision } from '$lib/server/drawings';
import { featuresOf } from '$lib/server/features';
import { checkSummaryOf } from '$lib/server/rulebook';
import { fieldErrorsOf, refuseForm } from '$lib/server/forms';
import { movesFor, transitionsOf } from '$lib/server/transitions';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const { drawing, revision, membership } = place;
	const frozen = isFrozen(revision.state);
	// Read first: the board's live stream starts here, so nothing written after the rest of
	// this load is missed (an event for a change already loaded is harmless).
	const liveAfter = await latestEventSeq(db, revision.id);
	const asker = { user: place.user, role: membership.role };
	const [uploader, features, findings, [fits, choices], checkSummary] = await Promise.all([
		revision.uploadedBy ? getUserById(db, revision.uploadedBy) : null,
		featuresOf(db, place),
		findingsOf(db, place),
		fitsOf(db, place).then(async (fits) => {
			const answers = fits as FitAnswer[];
			return [answers, await findingChoices(db, place, answers)] as const;
		}),
		checkSummaryOf(db, revision.id)
	]);
	return {
		drawing: publicDrawing(drawing),
		revision: {
			...publicRevision(revision),
			uploadedBy: uploader ? (uploader.name ?? uploader.email) : null,
			frozen
		},
		features,
		may: {
			// The board is read-only without it, and on a frozen revision for everyone.
			editFeatures: can(membership.role, 'editFeatures') && !frozen,
			editSettings: can(membership.role, 'author') && !frozen,
			comment: can(membership.role, 'raiseFindings') || isVisibleToSuppliers(revision.state)
		},
		findings,
		// What this person may do to findings; the API decides again on every write.
		findingPowers: powersOf(asker),
		// The service's answer, which the integration tests check against the fitResponse schema.
		fits,
		/** What a new finding's fields offer. */
		choices,
		checkSummary,
		mayCheck: can(membership.role, 'judgeFindings') && !frozen,
		liveAfter,
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
