import { z } from 'zod';
import { revisionStates } from '$lib/revisions';

/** `POST …/revisions/{letter}/transitions`: the state to move to, and why. */
export const transitionInput = z
	.object({
		to: z.enum(revisionStates, {
			error: `Name the state to move to: ${revisionStates.join(', ')}`
		}),
		message: z
			.string()
			.trim()
			.max(2000, { error: 'Keep the message under 2000 characters' })
			.default('')
			.describe('Why: required to return a revision and to reopen an approved one')
	})
	.strict();
export type TransitionInput = z.output<typeof transitionInput>;

const who = z.uuid().nullable().describe('A user id; null when the account was removed');

/** One state change as the revision's history keeps it. */
export const transitionResponse = z.object({
	from: z.enum(revisionStates),
	to: z.enum(revisionStates),
	name: z.string().describe('submit, return, approve, resubmit, release, reopen, supersede'),
	message: z.string(),
	by: who,
	byName: z.string().nullable(),
	at: z.string()
});
