import { sql } from 'drizzle-orm';
import {
	bigint,
	bigserial,
	boolean,
	check,
	jsonb,
	index,
	integer,
	pgTable,
	primaryKey,
	text,
	timestamp,
	uniqueIndex,
	uuid
} from 'drizzle-orm/pg-core';
import { UNITS, type Units } from '../../tolerance/decimal';
import type { MarkerLocation } from '../../schemas/location';
import {
	GOVERNING_STANDARDS,
	type GeneralTolerance,
	type GoverningStandard
} from '../../tolerance/drawing-context';
import type { Characteristic } from '../../tolerance/feature';
import type { RulebookTeam } from '../../tolerance/rulebook/types';
import { featureKinds } from '../../features';
import { FIT_INTENTS, type TemperatureInput } from '../../tolerance/fit';
import { findingKinds, findingStates, severities } from '../../findings';
import { revisionStates } from '../../revisions';

// Auth.js tables (shape expected by @auth/drizzle-adapter); sessions are JWTs, so no sessions table.
export const users = pgTable('users', {
	id: uuid('id').primaryKey().defaultRandom(),
	name: text('name'),
	email: text('email').notNull().unique(),
	emailVerified: timestamp('email_verified', { mode: 'date', withTimezone: true }),
	image: text('image'),
	passwordHash: text('password_hash'),
	// Bumped to revoke every token issued before (sign out everywhere, password reset).
	sessionGeneration: integer('session_generation').notNull().default(0),
	createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
});

export const accounts = pgTable(
	'accounts',
	{
		userId: uuid('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		type: text('type').notNull(),
		provider: text('provider').notNull(),
		providerAccountId: text('provider_account_id').notNull(),
		refresh_token: text('refresh_token'),
		access_token: text('access_token'),
		expires_at: integer('expires_at'),
		token_type: text('token_type'),
		scope: text('scope'),
		id_token: text('id_token'),
		session_state: text('session_state')
	},
	(table) => [primaryKey({ columns: [table.provider, table.providerAccountId] })]
);

export const verificationTokens = pgTable(
	'verification_tokens',
	{
		identifier: text('identifier').notNull(),
		token: text('token').notNull(),
		expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull()
	},
	(table) => [primaryKey({ columns: [table.identifier, table.token] })]
);

/** Single-use secrets sent by e-mail (verification, password reset); only a hash is kept. */
export const userTokens = pgTable(
	'user_tokens',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		userId: uuid('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		purpose: text('purpose', { enum: ['verify-email', 'reset-password'] }).notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		usedAt: timestamp('used_at', { withTimezone: true }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('user_tokens_user_idx').on(table.userId)]
);

/**
 * Failed sign-ins and every request that sends mail (sign-up, reset, sign-in link, invitation),
 * per account and per address, shared by every instance (`db/queries/attempts.ts`).
 */
export const authAttempts = pgTable(
	'auth_attempts',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		scope: text('scope', { enum: ['sign-in', 'reset', 'link', 'sign-up', 'invite'] }).notNull(),
		key: text('key').notNull(),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('auth_attempts_key_idx').on(table.scope, table.key, table.at)]
);

/** Queued e-mail: delivered at least once, retried with backoff while the server is down. */
export const outbox = pgTable(
	'outbox',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		recipient: text('recipient').notNull(),
		subject: text('subject').notNull(),
		text: text('text').notNull(),
		html: text('html').notNull(),
		kind: text('kind').notNull(),
		attempts: integer('attempts').notNull().default(0),
		nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
		sentAt: timestamp('sent_at', { withTimezone: true }),
		lastError: text('last_error'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('outbox_due_idx').on(table.sentAt, table.nextAttemptAt)]
);

export const roles = ['admin', 'drafter', 'checker', 'quality'] as const;
export type Role = (typeof roles)[number];

export const teams = pgTable('teams', {
	id: uuid('id').primaryKey().defaultRandom(),
	slug: text('slug').notNull().unique(),
	name: text('name').notNull(),
	// Separation of duties: by default nobody approves a revision they submitted or uploaded.
	allowSelfApproval: boolean('allow_self_approval').notNull().default(false),
	settings: jsonb('settings').$type<TeamSettings>().notNull().default({}),
	version: integer('version').notNull().default(1),
	createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
});

/** The rulebook's team settings (severity overrides, the capability grade of LIM-06), as stored. */
export type TeamSettings = Pick<RulebookTeam, 'severityOverrides' | 'capabilityGrade'>;

export const memberships = pgTable(
	'memberships',
	{
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		userId: uuid('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		role: text('role', { enum: roles }).notNull(),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [
		primaryKey({ columns: [table.teamId, table.userId] }),
		index('memberships_user_idx').on(table.userId)
	]
);

export const invitations = pgTable(
	'invitations',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		email: text('email').notNull(),
		role: text('role', { enum: roles }).notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		acceptedAt: timestamp('accepted_at', { withTimezone: true }),
		acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
		revokedAt: timestamp('revoked_at', { withTimezone: true }),
		// Someone signed in with another address asked to accept: an admin approves or withdraws.
		requestedBy: uuid('requested_by').references(() => users.id, { onDelete: 'set null' }),
		requestedAt: timestamp('requested_at', { withTimezone: true }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('invitations_team_idx').on(table.teamId)]
);

/** Personal API tokens: shown once, kept as a hash. */
export const apiTokens = pgTable(
	'api_tokens',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		userId: uuid('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		name: text('name').notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		hint: text('hint').notNull(),
		expiresAt: timestamp('expires_at', { withTimezone: true }),
		lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
		revokedAt: timestamp('revoked_at', { withTimezone: true }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('api_tokens_user_idx').on(table.userId)]
);

/**
 * The append-only trail. A trigger (hand-written migration) refuses UPDATE and DELETE; no
 * foreign keys, so removing a user or a team never rewrites history.
 */
export const activity = pgTable(
	'activity',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		teamId: uuid('team_id'),
		actorId: uuid('actor_id'),
		actorName: text('actor_name'),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
		entity: text('entity').notNull(),
		entityId: text('entity_id').notNull(),
		action: text('action').notNull(),
		summary: text('summary').notNull(),
		before: jsonb('before'),
		after: jsonb('after'),
		drawingId: uuid('drawing_id')
	},
	(table) => [
		index('activity_team_idx').on(table.teamId, table.id),
		index('activity_drawing_idx').on(table.drawingId, table.id)
	]
);

export { frozenStates, isFrozen, revisionStates, type RevisionState } from '../../revisions';

export type GeneralToleranceSetting = GeneralTolerance | null;

/** What a revision copies from its drawing at upload (PRODUCT.md §3). */
export interface RevisionSettings {
	units: Units;
	standard: GoverningStandard;
	generalTolerance: GeneralToleranceSetting;
}

export const drawings = pgTable(
	'drawings',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		number: text('number').notNull(),
		title: text('title').notNull(),
		partName: text('part_name').notNull().default(''),
		material: text('material').notNull().default(''),
		units: text('units', { enum: UNITS }).notNull(),
		standard: text('standard', { enum: GOVERNING_STANDARDS }).notNull(),
		generalTolerance: jsonb('general_tolerance').$type<GeneralToleranceSetting>(),
		notes: text('notes').notNull().default(''),
		// Balloon numbers are per drawing and never reused: the next one is counted here.
		nextBalloon: integer('next_balloon').notNull().default(1),
		// Finding numbers too (F-1, F-2 …): per drawing, never reused.
		nextFinding: integer('next_finding').notNull().default(1),
		version: integer('version').notNull().default(1),
		createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [uniqueIndex('drawings_team_number_idx').on(table.teamId, table.number)]
);

export const revisions = pgTable(
	'revisions',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		drawingId: uuid('drawing_id')
			.notNull()
			.references(() => drawings.id, { onDelete: 'cascade' }),
		letter: text('letter').notNull(),
		reason: text('reason').notNull().default(''),
		state: text('state', { enum: revisionStates }).notNull().default('draft'),
		pages: integer('pages').notNull(),
		sheets: jsonb('sheets').$type<{ width: number; height: number }[]>().notNull(),
		sha256: text('sha256').notNull(),
		size: bigint('size', { mode: 'number' }).notNull(),
		storageKey: text('storage_key').notNull(),
		uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
		// The revision's own copy of the drawing's settings, taken at upload and frozen with it.
		settings: jsonb('settings').$type<RevisionSettings>().notNull(),
		// Who approved and who released it, and when (cleared when an approval is reopened).
		approvedBy: uuid('approved_by').references(() => users.id, { onDelete: 'set null' }),
		approvedAt: timestamp('approved_at', { withTimezone: true }),
		releasedBy: uuid('released_by').references(() => users.id, { onDelete: 'set null' }),
		releasedAt: timestamp('released_at', { withTimezone: true }),
		version: integer('version').notNull().default(1),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [uniqueIndex('revisions_drawing_letter_idx').on(table.drawingId, table.letter)]
);

/** Each state change of a revision (PRODUCT.md §3): who, when, from what to what, and why. */
export const revisionTransitions = pgTable(
	'revision_transitions',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		revisionId: uuid('revision_id')
			.notNull()
			.references(() => revisions.id, { onDelete: 'cascade' }),
		from: text('from', { enum: revisionStates }).notNull(),
		to: text('to', { enum: revisionStates }).notNull(),
		message: text('message').notNull().default(''),
		byId: uuid('by_id').references(() => users.id, { onDelete: 'set null' }),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('revision_transitions_revision_idx').on(table.revisionId, table.id)]
);

/** A geometric tolerance as stored: the calc API's control shape (PRODUCT.md §6 `controls`). */
export interface StoredControl {
	characteristic: Characteristic;
	value: string;
	diameterZone: boolean;
	appliesTo: 'surface' | 'median';
	modifier: 'mmc' | 'lmc' | 'rfs';
	datums: string[];
}

export interface FeatureOverridesSetting {
	envelope: boolean;
	independency: boolean;
	stock: boolean;
	freeState: boolean;
}

/**
 * Feature-of-size records of one revision. `callout` is kept as written; a plain datum face has
 * an empty callout and no computed values.
 */
export const features = pgTable(
	'features',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		revisionId: uuid('revision_id')
			.notNull()
			.references(() => revisions.id, { onDelete: 'cascade' }),
		drawingId: uuid('drawing_id')
			.notNull()
			.references(() => drawings.id, { onDelete: 'cascade' }),
		balloon: integer('balloon').notNull(),
		label: text('label').notNull().default(''),
		kind: text('kind', { enum: featureKinds }).notNull(),
		internal: boolean('internal').notNull(),
		boughtOut: boolean('bought_out').notNull().default(false),
		datumFeature: text('datum_feature'),
		carried: jsonb('carried').$type<{ from: string; confirmed: boolean } | null>(),
		callout: text('callout').notNull(),
		quantity: integer('quantity').notNull().default(1),
		controls: jsonb('controls').$type<StoredControl[]>().notNull().default([]),
		overrides: jsonb('overrides')
			.$type<FeatureOverridesSetting>()
			.notNull()
			.default({ envelope: false, independency: false, stock: false, freeState: false }),
		location: jsonb('location').$type<MarkerLocation | null>(),
		notes: text('notes').notNull().default(''),
		version: integer('version').notNull().default(1),
		createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [
		uniqueIndex('features_revision_balloon_idx').on(table.revisionId, table.balloon),
		index('features_drawing_idx').on(table.drawingId)
	]
);

/** A bought fastener as a fit's other member (PRODUCT.md §6). */
export interface StoredFastener {
	callout: string;
	label: string;
	fixedPosition?: string;
	projection?: { P: string; D: string };
}

/**
 * A fit between two features (or a feature and a bought fastener). It belongs to the revision
 * of its hole; the shaft may be a feature of any drawing's revision in the same team.
 */
export const fits = pgTable(
	'fits',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		revisionId: uuid('revision_id')
			.notNull()
			.references(() => revisions.id, { onDelete: 'cascade' }),
		holeFeatureId: uuid('hole_feature_id')
			.notNull()
			.references(() => features.id, { onDelete: 'cascade' }),
		shaftFeatureId: uuid('shaft_feature_id').references(() => features.id, {
			onDelete: 'cascade'
		}),
		shaftRevisionId: uuid('shaft_revision_id').references(() => revisions.id, {
			onDelete: 'cascade'
		}),
		fastener: jsonb('fastener').$type<StoredFastener | null>(),
		fixedHoleFeatureId: uuid('fixed_hole_feature_id').references(() => features.id, {
			onDelete: 'cascade'
		}),
		intent: text('intent', { enum: FIT_INTENTS }).notNull(),
		requiredMinClearance: text('required_min_clearance'),
		requiredMaxClearance: text('required_max_clearance'),
		sharedDatumFrame: boolean('shared_datum_frame').notNull().default(false),
		temperature: jsonb('temperature').$type<TemperatureInput | null>(),
		version: integer('version').notNull().default(1),
		createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [
		index('fits_revision_idx').on(table.revisionId),
		index('fits_shaft_revision_idx').on(table.shaftRevisionId),
		// The rulebook re-checks the fits a feature is a member of.
		index('fits_hole_feature_idx').on(table.holeFeatureId),
		index('fits_shaft_feature_idx').on(table.shaftFeatureId),
		index('fits_fixed_hole_feature_idx').on(table.fixedHoleFeatureId)
	]
);

export type FitRow = typeof fits.$inferSelect;

/** A checker's recorded decision on an open rule finding (PRODUCT.md §3): not a state. */
export interface FindingWaiver {
	by: string | null;
	at: string;
	reason: string;
}

/**
 * Findings on a revision, numbered per drawing. A manual finding is raised by a person; a rule
 * finding by the rulebook, keyed by its result (`ruleKey`: rule, subject, cause) so a later run
 * finds it again. The state changes are kept in `finding_moves`.
 */
export const findings = pgTable(
	'findings',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		drawingId: uuid('drawing_id')
			.notNull()
			.references(() => drawings.id, { onDelete: 'cascade' }),
		revisionId: uuid('revision_id')
			.notNull()
			.references(() => revisions.id, { onDelete: 'cascade' }),
		number: integer('number').notNull(),
		kind: text('kind', { enum: findingKinds }).notNull().default('manual'),
		rule: text('rule'),
		ruleKey: text('rule_key'),
		// A rule finding's subject as its key names it (`drawing`, `feature:<id>`, `fit:<id>`), so
		// a re-check finds the findings of what it judged even after the feature or fit is gone.
		ruleSubject: text('rule_subject'),
		// The numbers behind a rule finding as the rulebook last wrote them: a waiver lapses when
		// they change.
		ruleNumbers: text('rule_numbers'),
		severity: text('severity', { enum: severities }).notNull(),
		state: text('state', { enum: findingStates }).notNull().default('raised'),
		text: text('text').notNull(),
		featureId: uuid('feature_id').references(() => features.id, { onDelete: 'set null' }),
		fitId: uuid('fit_id').references(() => fits.id, { onDelete: 'set null' }),
		assigneeId: uuid('assignee_id').references(() => users.id, { onDelete: 'set null' }),
		raisedBy: uuid('raised_by').references(() => users.id, { onDelete: 'set null' }),
		location: jsonb('location').$type<MarkerLocation | null>(),
		waiver: jsonb('waiver').$type<FindingWaiver | null>(),
		carried: jsonb('carried').$type<{ from: string; confirmed: boolean } | null>(),
		version: integer('version').notNull().default(1),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [
		uniqueIndex('findings_revision_number_idx').on(table.revisionId, table.number),
		uniqueIndex('findings_revision_rule_key_idx').on(table.revisionId, table.ruleKey),
		index('findings_revision_rule_subject_idx').on(table.revisionId, table.ruleSubject),
		index('findings_feature_idx').on(table.featureId),
		index('findings_fit_idx').on(table.fitId)
	]
);

/** Each state change of a finding: who, when, from what to what, and why. */
export const findingMoves = pgTable(
	'finding_moves',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		findingId: uuid('finding_id')
			.notNull()
			.references(() => findings.id, { onDelete: 'cascade' }),
		from: text('from', { enum: findingStates }).notNull(),
		to: text('to', { enum: findingStates }).notNull(),
		message: text('message').notNull().default(''),
		byId: uuid('by_id').references(() => users.id, { onDelete: 'set null' }),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('finding_moves_finding_idx').on(table.findingId, table.id)]
);

/**
 * A thread's comments: on a finding or on a feature (exactly one of the two). `body` is kept as
 * typed; the HTML is rendered and sanitized when it is read.
 */
export const comments = pgTable(
	'comments',
	{
		id: uuid('id').primaryKey().defaultRandom(),
		teamId: uuid('team_id')
			.notNull()
			.references(() => teams.id, { onDelete: 'cascade' }),
		findingId: uuid('finding_id').references(() => findings.id, { onDelete: 'cascade' }),
		featureId: uuid('feature_id').references(() => features.id, { onDelete: 'cascade' }),
		authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
		body: text('body').notNull(),
		/** The members the body mentions, resolved when it was written (for notifications). */
		mentions: jsonb('mentions').$type<string[]>().notNull().default([]),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
		editedAt: timestamp('edited_at', { withTimezone: true })
	},
	(table) => [
		index('comments_finding_idx').on(table.findingId, table.createdAt),
		index('comments_feature_idx').on(table.featureId, table.createdAt),
		check('comments_one_subject', sql`(${table.findingId} is null) <> (${table.featureId} is null)`)
	]
);

export type FindingRow = typeof findings.$inferSelect;
export type FindingMoveRow = typeof findingMoves.$inferSelect;
export type CommentRow = typeof comments.$inferSelect;

export type FeatureRow = typeof features.$inferSelect;
export type UserRow = typeof users.$inferSelect;
export type DrawingRow = typeof drawings.$inferSelect;
export type RevisionRow = typeof revisions.$inferSelect;
export type RevisionTransitionRow = typeof revisionTransitions.$inferSelect;
export type TeamRow = typeof teams.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;

/** What a revision event is about (PRODUCT.md §6, SSE `type`). */
export const revisionEventTypes = ['feature', 'fit', 'finding', 'comment', 'revision'] as const;
export type RevisionEventType = (typeof revisionEventTypes)[number];

/**
 * Every change to what a revision holds, in commit order per revision: `id` is the durable
 * sequence number a board's stream sends as the SSE `id:` and catches up from (`Last-Event-ID`).
 * Written in the same transaction as the change, under the revision's row lock.
 */
export const revisionEvents = pgTable(
	'revision_events',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		revisionId: uuid('revision_id')
			.notNull()
			.references(() => revisions.id, { onDelete: 'cascade' }),
		type: text('type', { enum: revisionEventTypes }).notNull(),
		action: text('action').notNull(),
		entityId: uuid('entity_id').notNull(),
		version: integer('version'),
		/** A comment's thread: `{type: 'finding' | 'feature', id}`. */
		subject: jsonb('subject').$type<{ type: 'finding' | 'feature'; id: string } | null>(),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow()
	},
	(table) => [index('revision_events_revision_idx').on(table.revisionId, table.id)]
);

export type RevisionEventRow = typeof revisionEvents.$inferSelect;
