import { can } from '$lib/server/capabilities';
import { addComment, commentsOf, editComment, findingThread } from '$lib/server/comments';
import { db } from '$lib/server/db';
import { getComment } from '$lib/server/db/queries/comments';
import { getFeature } from '$lib/server/db/queries/features';
import { getFinding } from '$lib/server/db/queries/findings';
import { isVisibleToSuppliers } from '$lib/server/db/queries/drawings';
import { listMembers } from '$lib/server/db/queries/teams';
import { isFrozen } from '$lib/server/db/schema';
import { notFound, requireRevision } from '$lib/server/drawings';
import {
	readCommentForm,
	readMoveForm,
	readWaiverForm,
	refusedForm
} from '$lib/server/finding-forms';
import { changeFinding, findingOf, movesFor } from '$lib/server/findings';
import type { Capability } from '$lib/server/capabilities';
import { isUuid } from '$lib/server/api-input';
import type { Actions, PageServerLoad } from './$types';

/** The finding named in the path by its number (`12` or `F-12`) on a revision the asker sees. */
async function requireFindingPage(
	params: { team: string; number: string; letter: string; finding: string },
	capability: Capability
) {
	const place = await requireRevision(params.team, params.number, params.letter, capability);
	const number = /^(?:F-)?(\d{1,9})$/i.exec(params.finding)?.[1];
	const finding = number
		? await getFinding(db, place.revision.id, { number: Number(number) })
		: null;
	if (!finding) notFound();
	return { place, finding, asker: { user: place.user, role: place.membership.role } };
}

export const load: PageServerLoad = async ({ params }) => {
	const { place, finding, asker } = await requireFindingPage(params, 'view');
	const [json, comments, members, feature] = await Promise.all([
		findingOf(db, finding),
		commentsOf(db, findingThread(place, finding)),
		listMembers(db, place.team.id),
		finding.featureId ? getFeature(db, place.revision.id, finding.featureId) : null
	]);
	const { role } = place.membership;
	const frozen = isFrozen(place.revision.state);
	return {
		drawing: { number: place.drawing.number, title: place.drawing.title },
		revision: { letter: place.revision.letter, state: place.revision.state },
		finding: json,
		feature: feature && {
			balloon: feature.balloon,
			label: feature.label,
			callout: feature.callout
		},
		comments,
		members: members.map((m) => ({ userId: m.userId, name: m.name ?? m.email })),
		userId: place.user.id,
		moves: frozen ? [] : movesFor(asker, finding),
		mayWaive:
			!frozen &&
			can(role, 'judgeFindings') &&
			finding.kind === 'rule' &&
			['raised', 'answered'].includes(finding.state),
		mayComment: can(role, 'raiseFindings') || isVisibleToSuppliers(place.revision.state)
	};
};

export const actions: Actions = {
	move: async ({ params, request }) => {
		const { place, finding, asker } = await requireFindingPage(params, 'view');
		const form = await readMoveForm(request);
		if (!form.ok) return form.failure;
		const outcome = await changeFinding(db, asker, place, finding, form.data);
		if (!outcome.ok) return refusedForm(outcome);
		return { moved: outcome.finding.state };
	},
	waive: async ({ params, request }) => {
		const { place, finding, asker } = await requireFindingPage(params, 'view');
		const form = await readWaiverForm(request);
		if (!form.ok) return form.failure;
		const outcome = await changeFinding(db, asker, place, finding, form.data);
		if (!outcome.ok) return refusedForm(outcome);
		return { waived: outcome.finding.waiver !== null };
	},
	comment: async ({ params, request }) => {
		const { place, finding, asker } = await requireFindingPage(params, 'commentReleased');
		const form = await readCommentForm(request);
		if (!form.ok) return form.failure;
		const outcome = await addComment(db, asker, findingThread(place, finding), form.data.body);
		if (!outcome.ok) return refusedForm(outcome);
		return { commented: outcome.comment.id };
	},
	edit: async ({ params, request }) => {
		const { place, finding } = await requireFindingPage(params, 'commentReleased');
		const form = await readCommentForm(request);
		if (!form.ok) return form.failure;
		const thread = findingThread(place, finding);
		const comment =
			form.id && isUuid(form.id) ? await getComment(db, thread.subject, form.id) : null;
		if (!comment) notFound();
		const outcome = await editComment(db, place.user, thread, comment, form.data.body);
		if (!outcome.ok) return refusedForm(outcome);
		return { edited: outcome.comment.id };
	}
};
