import { z } from 'zod';

/** A durable sequence number of a revision's change feed (the SSE `id:`). */
const sequence = z.coerce
	.number({ error: 'A sequence number is a whole number' })
	.int({ error: 'A sequence number is a whole number' })
	.min(0, { error: 'A sequence number is 0 or more' })
	.max(Number.MAX_SAFE_INTEGER);

/**
 * `…/revisions/{letter}/events`: start after `after` (what the page was loaded at); a
 * reconnecting client's `Last-Event-ID` header takes precedence.
 */
export const eventsQuery = z.object({ after: sequence.optional() });
export const lastEventId = sequence;
