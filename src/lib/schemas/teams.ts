import { z } from 'zod';
import { email } from './auth';

export const role = z.enum(['admin', 'drafter', 'checker', 'quality'], {
	error: 'Choose a role: admin, drafter, checker or quality'
});

export const teamInput = z.object({
	name: z.string().trim().min(2, { error: 'Give the team a name' }).max(80),
	slug: z
		.string()
		.trim()
		.toLowerCase()
		.regex(/^[a-z0-9](?:[a-z0-9-]{0,38}[a-z0-9])?$/, {
			error: 'Use 1–40 lower-case letters, digits and dashes'
		})
});

export const memberInput = z.object({ email, role });

/** An invitation as the API answers it (POST …/members and …/invitations). */
export const invitationResponse = z.object({
	id: z.uuid(),
	email: z.string(),
	role,
	expiresAt: z.iso.datetime()
});
/** An open invitation as listed: `waitingFor` is an account of another address asking to accept it. */
export const openInvitation = invitationResponse.extend({
	createdAt: z.iso.datetime(),
	waitingFor: z.object({ userId: z.uuid(), email: z.string() }).nullable()
});
export const roleInput = z.object({ role });

export const teamSettingsInput = z.object({
	name: z.string().trim().min(2).max(80).optional(),
	allowSelfApproval: z
		.union([z.boolean(), z.enum(['on', 'off', 'true', 'false'])])
		.transform((v) => v === true || v === 'on' || v === 'true')
		.optional()
});

export const apiTokenInput = z.object({
	name: z.string().trim().min(1, { error: 'Name the token after what uses it' }).max(80),
	expiresInDays: z.coerce
		.number()
		.int()
		.refine((d) => [7, 30, 90, 365].includes(d), { error: 'Choose 7, 30, 90 or 365 days' })
		.default(90)
});

/** `?before=` (an activity id) and `?limit=` of the activity trail; both optional. */
export const activityQuery = z.object({
	before: z.coerce
		.number({ error: 'before must be an activity number' })
		.int({ error: 'before must be a whole number' })
		.min(1, { error: 'before must be 1 or more' })
		.max(Number.MAX_SAFE_INTEGER)
		.optional(),
	limit: z.coerce
		.number({ error: 'limit must be a number' })
		.int({ error: 'limit must be a whole number' })
		.min(1, { error: 'limit must be between 1 and 500' })
		.max(500, { error: 'limit must be between 1 and 500' })
		.optional()
});
