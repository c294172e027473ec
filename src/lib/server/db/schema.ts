import {
	bigserial,
	index,
	integer,
	pgTable,
	primaryKey,
	text,
	timestamp,
	uuid
} from 'drizzle-orm/pg-core';

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

/** Failed sign-in and reset requests, per account and per address, shared by every instance. */
export const authAttempts = pgTable(
	'auth_attempts',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		scope: text('scope', { enum: ['sign-in', 'reset'] }).notNull(),
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

export type UserRow = typeof users.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;
