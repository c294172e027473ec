import { json } from '@sveltejs/kit';
import { refuse } from '$lib/server/api';
import { db } from '$lib/server/db';
import { requireRevision } from '$lib/server/drawings';
import { runCheck } from '$lib/server/rulebook';
import type { RequestHandler } from './$types';

/** Runs the rulebook in full on the revision and answers its check summary. */
export const POST: RequestHandler = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'judgeFindings');
	const outcome = await runCheck(db, place.user, place.revision);
	if (!outcome.ok) refuse(outcome);
	return json(outcome.summary);
};
