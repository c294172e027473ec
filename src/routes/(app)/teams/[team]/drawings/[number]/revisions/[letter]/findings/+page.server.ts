import { redirect } from '@sveltejs/kit';
import { countFindings } from '$lib/findings';
import { findingQuery } from '$lib/schemas/findings';
import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import { latestEventSeq } from '$lib/server/db/queries/revision-events';
import { isFrozen } from '$lib/server/db/schema';
import { requireRevision } from '$lib/server/drawings';
import { readRaiseForm, refusedForm } from '$lib/server/finding-forms';
import { findingChoices, findingsOf, raiseFinding } from '$lib/server/findings';
import { fitsOf } from '$lib/server/fits';
import type { FitAnswer } from '$lib/fits';
import type { Actions, PageServerLoad } from './$types';

/** The filters as the API takes them; ones that do not read are named and left out. */
function filtersOf(url: URL) {
	const raw: Record<string, string> = {};
	for (const key of Object.keys(findingQuery.shape)) {
		const value = url.searchParams.get(key);
		if (value) raw[key] = value;
	}
	const parsed = findingQuery.safeParse(raw);
	if (parsed.success) return { raw, query: parsed.data, problem: null };
	const bad = parsed.error.issues.map((i) => String(i.path[0]));
	const kept = Object.fromEntries(Object.entries(raw).filter(([k]) => !bad.includes(k)));
	return {
		raw: kept,
		query: findingQuery.parse(kept),
		problem: `Filter left out: ${bad.join(', ')} (${parsed.error.issues[0].message})`
	};
}

export const load: PageServerLoad = async ({ params, url }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const filters = filtersOf(url);
	// Read first: the live stream starts here and misses nothing written after this load.
	const liveAfter = await latestEventSeq(db, place.revision.id);
	const [shown, all, fits] = await Promise.all([
		findingsOf(db, place, filters.query),
		findingsOf(db, place),
		fitsOf(db, place)
	]);
	const choices = await findingChoices(db, place, fits as FitAnswer[]);
	return {
		drawing: { number: place.drawing.number, title: place.drawing.title },
		revision: { letter: place.revision.letter, state: place.revision.state },
		findings: shown,
		counts: countFindings(all),
		rules: [...new Set(all.map((f) => f.rule).filter((r): r is string => !!r))].sort(),
		filters: filters.raw,
		filterProblem: filters.problem,
		...choices,
		mayRaise: can(place.membership.role, 'raiseFindings') && !isFrozen(place.revision.state),
		liveAfter
	};
};

export const actions: Actions = {
	raise: async ({ params, request, url }) => {
		const place = await requireRevision(params.team, params.number, params.letter, 'raiseFindings');
		const form = await readRaiseForm(request);
		if (!form.ok) return form.failure;
		const outcome = await raiseFinding(db, place.user, place, form.data);
		if (!outcome.ok) return refusedForm(outcome);
		redirect(303, `${url.pathname}/${outcome.finding.number}`);
	}
};
