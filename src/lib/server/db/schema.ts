import { integer, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';

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

export type UserRow = typeof users.$inferSelect;
