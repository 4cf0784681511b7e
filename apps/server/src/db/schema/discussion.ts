import { index, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, boolean } from 'drizzle-orm/pg-core';
import type { CommentAnchor, NotificationKind } from '@seinework/contracts';
import { users } from './accounts';
import { options, shares } from './options';

/**
 * Discussion of shared options: comments (one level of replies), who follows an option's
 * discussion by e-mail, each person's notification preferences, the one-time unsubscribe tokens
 * sent in e-mail, and which notices a share has already sent (so a restart sends none twice).
 * Comment text is stored as typed: it is plain text everywhere it is shown.
 */

const at = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });
const userRef = (name: string) => text(name).references(() => users.id);

export const comments = pgTable(
  'comments',
  {
    id: text('id').primaryKey(),
    optionId: text('option_id')
      .notNull()
      .references(() => options.id, { onDelete: 'cascade' }),
    /** The share the comment was posted under (council review or public comment). */
    shareId: text('share_id').references(() => shares.id, { onDelete: 'set null' }),
    /** A reply's parent; replies are one level deep (the service refuses a reply to a reply). */
    parentId: text('parent_id'),
    authorId: userRef('author_id').notNull(),
    text: text('text').notNull(),
    anchor: jsonb('anchor').$type<CommentAnchor | null>(),
    createdAt: at('created_at').notNull().defaultNow(),
    editedAt: at('edited_at'),
    hiddenAt: at('hidden_at'),
    hiddenBy: userRef('hidden_by'),
    hiddenReason: text('hidden_reason'),
  },
  (table) => [index('comments_option_idx').on(table.optionId, table.createdAt), index('comments_parent_idx').on(table.parentId)],
);

/** Who follows an option's discussion by e-mail. */
export const follows = pgTable(
  'follows',
  {
    optionId: text('option_id')
      .notNull()
      .references(() => options.id, { onDelete: 'cascade' }),
    userId: userRef('user_id').notNull(),
    createdAt: at('created_at').notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.optionId, table.userId] })],
);

/** Notification preferences; a person without a row gets every kind (the defaults). */
export const notificationPreferences = pgTable('notification_preferences', {
  userId: userRef('user_id').primaryKey(),
  optionShared: boolean('option_shared').notNull().default(true),
  newComment: boolean('new_comment').notNull().default(true),
  closingSoon: boolean('closing_soon').notNull().default(true),
  updatedAt: at('updated_at').notNull().defaultNow(),
});

/**
 * The unsubscribe link of one e-mail: the token's SHA-256 is stored, never the token; using it
 * turns off that kind of notice (or, for a follow notice, the follow) without signing in.
 */
export const unsubscribeTokens = pgTable(
  'unsubscribe_tokens',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: userRef('user_id').notNull(),
    kind: text('kind').$type<NotificationKind>().notNull(),
    /** For newComment: the option whose discussion the e-mail was about. */
    optionId: text('option_id').references(() => options.id, { onDelete: 'cascade' }),
    createdAt: at('created_at').notNull().defaultNow(),
    usedAt: at('used_at'),
  },
  (table) => [index('unsubscribe_tokens_user_idx').on(table.userId)],
);

/** Notices a share has sent ("shared with you", "closes tomorrow"): at most one of each kind per share. */
export const shareNotices = pgTable(
  'share_notices',
  {
    shareId: text('share_id')
      .notNull()
      .references(() => shares.id, { onDelete: 'cascade' }),
    kind: text('kind').$type<NotificationKind>().notNull(),
    sentAt: at('sent_at').notNull().defaultNow(),
  },
  (table) => [uniqueIndex('share_notices_unique').on(table.shareId, table.kind)],
);
