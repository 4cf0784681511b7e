import { z } from 'zod';

/**
 * Request and answer shapes of public comment and discussion (comments on shared options,
 * moderation, following, notification preferences) and of briefs. Comment text is plain text:
 * it is stored as typed (after trimming) and every screen and brief shows it as text, never as HTML.
 */

/** Longest comment, in characters (code points). */
export const MAX_COMMENT_LENGTH = 4000;
/** How long after posting the author may still edit a comment. */
export const COMMENT_EDIT_MINUTES = 15;
/** Comments per page of `GET /api/options/:id/comments`. */
export const COMMENTS_PAGE_SIZE = 50;

/** NUL and the C0/C1 controls other than tab and line breaks: refused, as they only confuse readers. */
const COMMENT_CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/u;

function codePoints(text: string): number {
  let count = 0;
  for (const _ of text) count++;
  return count;
}

const commentText = z
  .string({ error: 'text must be a string' })
  .max(MAX_COMMENT_LENGTH * 2, `text must be at most ${MAX_COMMENT_LENGTH} characters`)
  .transform((text) => text.replace(/\r\n?/g, '\n').trim())
  .refine((text) => text.length > 0, 'text must not be empty')
  .refine((text) => codePoints(text) <= MAX_COMMENT_LENGTH, `text must be at most ${MAX_COMMENT_LENGTH} characters`)
  .refine((text) => !COMMENT_CONTROL.test(text), 'text must not contain control characters');

/** What a comment points at in the option's result: an indicator (ScalarIndicators key or `fishingInBalance`) or a compartment (its id). */
export const commentAnchorSchema = z.strictObject({
  kind: z.enum(['indicator', 'compartment'], { error: 'anchor.kind must be "indicator" or "compartment"' }),
  key: z
    .string({ error: 'anchor.key must be a string' })
    .trim()
    .min(1, 'anchor.key must not be empty')
    .max(100, 'anchor.key must be at most 100 characters')
    .refine((key) => !COMMENT_CONTROL.test(key), 'anchor.key must not contain control characters'),
});
export type CommentAnchor = z.infer<typeof commentAnchorSchema>;

/**
 * `POST /api/options/:id/comments`: a comment, a reply (`parentId`, one level deep) and what it
 * points at. `audience` picks the discussion when the option is shared both for council review and
 * for public comment (default: the council's for council members, else the public one); a reply
 * always joins its parent's discussion.
 */
export const commentBodySchema = z.strictObject({
  text: commentText,
  parentId: z.string({ error: 'parentId must be a string' }).max(64, 'parentId must be at most 64 characters').optional(),
  anchor: commentAnchorSchema.optional(),
  audience: z.enum(['council', 'public'], { error: 'audience must be "council" or "public"' }).optional(),
});
export type CommentBody = z.infer<typeof commentBodySchema>;

/** `PATCH /api/comments/:id`: the author's edit, within COMMENT_EDIT_MINUTES of posting. */
export const commentEditSchema = z.strictObject({ text: commentText });

/** `POST /api/comments/:id/hide` (staff): the reason is logged and shown to the author and staff. */
export const hideCommentSchema = z.strictObject({
  reason: z
    .string({ error: 'reason must be a string' })
    .trim()
    .min(1, 'reason must not be empty')
    .max(500, 'reason must be at most 500 characters')
    .refine((reason) => !COMMENT_CONTROL.test(reason), 'reason must not contain control characters'),
});

/** One comment as `GET /api/options/:id/comments` lists it. */
export interface CommentItem {
  id: string;
  optionId: string;
  /** Which discussion it belongs to (council review or public comment). */
  audience: 'council' | 'public';
  parentId: string | null;
  author: { id: string; name: string; role: string };
  /** The text; null for a hidden comment shown to someone other than its author or staff. */
  text: string | null;
  anchor: CommentAnchor | null;
  hidden: boolean;
  /** Shown to the author and staff only. */
  hiddenReason: string | null;
  createdAt: string;
  editedAt: string | null;
  /** Whether the person asking may still edit it (their own, within the edit window, discussion open). */
  editable: boolean;
}

/** `GET /api/options/:id/comments?page=N`: the page's comments oldest first, and the discussion's state for the asker. */
export interface CommentPage {
  items: CommentItem[];
  total: number;
  page: number;
  pageSize: number;
  discussion: DiscussionState;
}

export interface DiscussionState {
  /** The discussion a new comment of the asker's joins by default; null when the option is not shared (with them). */
  audience: 'council' | 'public' | null;
  /** Whether the asker may post now. */
  open: boolean;
  /** Why not, in words for the screen (e.g. "Public comment closed on 3 December 2026."). */
  closedReason: string | null;
  closesAt: string | null;
  /** Whether the asker follows this option's discussion by e-mail. */
  following: boolean;
}

/** `GET/PUT /api/me/notifications`: which e-mails a person wants. */
export const notificationPreferencesSchema = z.strictObject({
  /** "An option was shared with you." */
  optionShared: z.boolean({ error: 'optionShared must be true or false' }),
  /** "A new comment on an option you follow." */
  newComment: z.boolean({ error: 'newComment must be true or false' }),
  /** "Public comment closes tomorrow." */
  closingSoon: z.boolean({ error: 'closingSoon must be true or false' }),
});
export type NotificationPreferences = z.infer<typeof notificationPreferencesSchema>;
export const NOTIFICATION_KINDS = ['optionShared', 'newComment', 'closingSoon'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** `GET /api/discussions`: the shared options the asker may read, with their discussion counts. */
export interface DiscussionSummary {
  optionId: string;
  optionName: string;
  webName: string;
  audience: 'council' | 'public';
  shareId: string;
  sharedAt: string;
  closesAt: string | null;
  open: boolean;
  comments: number;
  lastCommentAt: string | null;
}
