import { eventsQuery, lastEventId } from '$lib/schemas/events';
import { parseOrRefuse, readQuery } from '$lib/server/api-input';
import { db } from '$lib/server/db';
import { latestEventSeq } from '$lib/server/db/queries/revision-events';
import { requireRevision } from '$lib/server/drawings';
import { liveHub } from '$lib/server/live-events';
import type { RequestHandler } from './$types';

/** The revision's changes as server-sent events (PRODUCT.md §6), for anyone who may see it. */
export const GET: RequestHandler = async ({ params, request, url }) => {
	const { user, team, revision } = await requireRevision(
		params.team,
		params.number,
		params.letter,
		'view'
	);
	const { after } = readQuery(url, eventsQuery);
	const header = request.headers.get('last-event-id')?.trim();
	const from = header
		? parseOrRefuse(lastEventId, header)
		: (after ?? (await latestEventSeq(db, revision.id)));
	return liveHub().open({ userId: user.id, teamId: team.id, revisionId: revision.id }, from);
};
