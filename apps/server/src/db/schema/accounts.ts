import { bigserial, boolean, index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import type { Role } from '@seinework/contracts';

/**
 * Accounts: people, their sessions, invitations, password resets, the audit log and the e-mail outbox.
 * Ids are random text (lucia's user and session ids are strings); times are timestamptz.
 */

const createdAt = () => timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow();

export const users = pgTable('users', {
  id: text('id').primaryKey(),
  /** Stored lower-case (the contracts' emailSchema lower-cases) so the unique index is case-blind. */
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  role: text('role').$type<Role>().notNull(),
  passwordHash: text('password_hash').notNull(),
  active: boolean('active').notNull().default(true),
  createdAt: createdAt(),
  /** Failed sign-ins counted in the current window (per-account rate limit; see auth/sign-in-limits.ts). */
  failedSignIns: integer('failed_sign_ins').notNull().default(0),
  failedSignInsSince: timestamp('failed_sign_ins_since', { withTimezone: true, mode: 'date' }),
});

/** The columns lucia's drizzle adapter reads and writes (id, user_id, expires_at); created_at is ours. */
export const sessions = pgTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    createdAt: createdAt(),
  },
  (table) => [index('sessions_user_id_idx').on(table.userId)],
);

/** An invitation by e-mail; the link carries a token of which only the SHA-256 hash is stored. */
export const invitations = pgTable('invitations', {
  id: text('id').primaryKey(),
  email: text('email').notNull(),
  role: text('role').$type<Role>().notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  invitedBy: text('invited_by')
    .notNull()
    .references(() => users.id),
  createdAt: createdAt(),
  expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
  acceptedAt: timestamp('accepted_at', { withTimezone: true, mode: 'date' }),
  revokedAt: timestamp('revoked_at', { withTimezone: true, mode: 'date' }),
});

/** A one-time password-reset link; only the SHA-256 hash of its token is stored. */
export const passwordResetTokens = pgTable(
  'password_reset_tokens',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true, mode: 'date' }),
  },
  (table) => [index('password_reset_tokens_user_id_idx').on(table.userId)],
);

/** Who did what, when: one row per change, written in the same transaction as the change. */
export const auditEvents = pgTable(
  'audit_events',
  {
    /** A sequence, so that the log reads in the order things happened even within one millisecond. */
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    at: timestamp('at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    /** Null for events without a signed-in person (a failed sign-in, the demo seed). */
    actorId: text('actor_id').references(() => users.id),
    action: text('action').notNull(),
    subject: text('subject').notNull(),
    detail: text('detail').notNull().default(''),
  },
  (table) => [index('audit_events_at_idx').on(table.at)],
);

/** Every message the local fake SMTP server received (demo mode and tests). */
export const emailOutbox = pgTable('email_outbox', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  sentAt: timestamp('sent_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});
