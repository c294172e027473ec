import { z } from 'zod';
import { findingKinds, findingStates, severities } from '$lib/findings';
import { markerLocation } from './location';

const findingText = z
	.string({ error: 'Say what is wrong' })
	.trim()
	.min(1, { error: 'Say what is wrong' })
	.max(10_000, { error: 'A finding is at most 10,000 characters' });
const severity = z.enum(severities, { error: `severity is one of ${severities.join(', ')}` });
const id = (what: string) => z.uuid({ error: `Give the ${what}'s id` });

const findingFields = {
	text: findingText,
	severity,
	/** The feature or fit of this revision the finding is about. */
	featureId: id('feature').nullable().default(null),
	fitId: id('fit').nullable().default(null),
	/** A member who may answer findings. */
	assigneeId: id('assignee').nullable().default(null),
	/** A point, or an area with `w` and `h`; `null`: not yet placed. */
	location: markerLocation.nullable().default(null)
};

/** POST …/revisions/{letter}/findings */
export const findingInput = z.object(findingFields).strict();

const message = z.string().trim().max(10_000, { error: 'A message is at most 10,000 characters' });

/**
 * PATCH …/findings/{id}: a state change `{state, message, version}`, a waiver
 * `{waiver: {reason} | null, version}`, or an edit of the finding's fields with `version`.
 */
export const findingPatch = z
	.object({
		version: z.number().int().positive({ error: 'Send the version you changed' }),
		state: z
			.enum(findingStates, { error: `state is one of ${findingStates.join(', ')}` })
			.optional(),
		message: message.optional(),
		waiver: z
			.object({
				reason: z.string().trim().min(1, { error: 'Say why the finding is waived' }).max(10_000)
			})
			.strict()
			.nullable()
			.optional(),
		text: findingText.optional(),
		severity: severity.optional(),
		featureId: id('feature').nullable().optional(),
		fitId: id('fit').nullable().optional(),
		assigneeId: id('assignee').nullable().optional(),
		location: markerLocation.nullable().optional()
	})
	.strict()
	.refine(
		(p) => {
			const kinds = [
				p.state !== undefined,
				p.waiver !== undefined,
				Object.keys(findingFields).some((k) => k in p)
			];
			return kinds.filter(Boolean).length <= 1;
		},
		{ error: 'Change the state, the waiver or the fields, one at a time', path: ['state'] }
	)
	.refine((p) => p.message === undefined || p.state !== undefined, {
		error: 'A message goes with a state change',
		path: ['message']
	});

const list = <T extends string>(values: readonly T[], extra: readonly string[] = []) =>
	z
		.string()
		.transform((s) => s.split(',').map((v) => v.trim()))
		.pipe(
			z.array(
				z.enum([...values, ...extra] as [string, ...string[]], {
					error: `one or more of ${[...values, ...extra].join(', ')}, separated by commas`
				})
			)
		);

/** GET …/findings: every filter optional; `state=open` means raised or answered. */
export const findingQuery = z.object({
	kind: z.enum(findingKinds, { error: `kind is one of ${findingKinds.join(', ')}` }).optional(),
	state: list(findingStates, ['open']).optional(),
	severity: list(severities).optional(),
	/** A member's id, or `none` for findings nobody is assigned. */
	assigneeId: z
		.union([z.uuid(), z.literal('none')], { error: "A member's id, or none" })
		.optional(),
	rule: z
		.string()
		.trim()
		.toUpperCase()
		.regex(/^[A-Z]{3}-\d{2}$/, { error: 'A rule code such as LIM-01' })
		.optional(),
	featureId: z.uuid({ error: "A feature's id" }).optional(),
	fitId: z.uuid({ error: "A fit's id" }).optional()
});

/** POST …/comments and PATCH …/comments/{id}. */
export const commentInput = z
	.object({
		body: z
			.string({ error: 'Write the comment' })
			.trim()
			.min(1, { error: 'Write the comment' })
			.max(10_000, { error: 'A comment is at most 10,000 characters' })
	})
	.strict();

export type FindingInput = z.output<typeof findingInput>;
export type FindingPatch = z.output<typeof findingPatch>;
export type FindingQuery = z.output<typeof findingQuery>;

const who = z.uuid().nullable().describe('A user id; null when the account was removed');

/** A state change as the finding's history keeps it. */
export const findingMove = z.object({
	from: z.enum(findingStates),
	to: z.enum(findingStates),
	message: z.string(),
	by: who,
	byName: z.string().nullable(),
	at: z.string()
});

/** What every finding answer holds (the OpenAPI document's response schema). */
export const findingResponse = z.object({
	id: z.uuid(),
	number: z.number().int().describe('Per drawing, never reused: shown as F-12'),
	kind: z.enum(findingKinds),
	rule: z.string().nullable().describe('The rule code of a rule finding (LIM-01 …)'),
	severity,
	state: z.enum(findingStates),
	text: z.string(),
	featureId: z.uuid().nullable(),
	fitId: z.uuid().nullable(),
	assigneeId: z.uuid().nullable(),
	raisedBy: who,
	createdAt: z.string(),
	updatedAt: z.string(),
	location: markerLocation.nullable(),
	waiver: z.object({ by: who, at: z.string(), reason: z.string() }).nullable(),
	carried: z.object({ from: z.string(), confirmed: z.boolean() }).nullable(),
	version: z.number().int(),
	history: z
		.array(findingMove)
		.optional()
		.describe('State changes, oldest first (in the answers about one finding)')
});

/** A comment: `body` as typed, `html` rendered and sanitized on the server. */
export const commentResponse = z.object({
	id: z.uuid(),
	body: z.string(),
	html: z.string(),
	authorId: who,
	createdAt: z.string(),
	editedAt: z.string().nullable()
});
