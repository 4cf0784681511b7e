import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, inArray, isNull, max, sql, type SQL } from 'drizzle-orm';
import {
  can,
  COMMENT_EDIT_MINUTES,
  COMMENTS_PAGE_SIZE,
  SCALAR_INDICATORS,
  type CommentAnchor,
  type CommentBody,
  type CommentItem,
  type CommentPage,
  type CurrentUser,
  type DiscussionState,
  type DiscussionSummary,
  type ShareAudience,
} from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { comments, follows, options, runs, shares, users, webs } from '../db/schema';
import { RequestError } from '../http/errors';
import type { Notifications } from '../notifications/notification-service';
import type { OptionService } from '../options/option-service';
import { formatInstant } from '../mail/messages';
import { AUDIENCE_WORDS } from '../options/audience-words';
import { shareAudiencesOf, visibleShare } from '../options/option-visibility';

/**
 * Comments on shared options (DEVELOPERS.md, "Discussion"). An option shared both for council
 * review and for public comment has two discussions: each comment belongs to the share it was
 * posted under, and is read by those who see shares of that audience (a stakeholder never reads
 * the council's). Posting needs `comments.post`, an option the person may read and an open
 * discussion (an active share they see, before its closing date). Text is stored as typed and
 * answered as the same plain string.
 */

type ShareRow = typeof shares.$inferSelect;
type CommentRow = typeof comments.$inferSelect;

const EDIT_WINDOW_MS = COMMENT_EDIT_MINUTES * 60 * 1000;
const INDICATOR_KEYS = new Set<string>([...SCALAR_INDICATORS, 'fishingInBalance']);

interface ListedComment {
  comment: CommentRow;
  authorName: string;
  authorRole: CurrentUser['role'];
  audience: ShareAudience | null;
}

export class DiscussionService {
  constructor(
    private readonly db: Db,
    private readonly optionService: OptionService,
    private readonly notifications?: Notifications,
    private readonly now: () => Date = () => new Date(),
  ) {}

  async list(user: CurrentUser, optionId: string, page: number): Promise<CommentPage> {
    await this.optionService.visibleRow(user, optionId);
    const active = await this.sharesOf(user, optionId);
    const where = and(eq(comments.optionId, optionId), commentAudience(user));
    const [[total], rows, following] = await Promise.all([
      this.db.select({ n: count() }).from(comments).leftJoin(shares, eq(shares.id, comments.shareId)).where(where),
      this.listed(where)
        .orderBy(asc(comments.createdAt), asc(comments.id))
        .limit(COMMENTS_PAGE_SIZE)
        .offset((page - 1) * COMMENTS_PAGE_SIZE),
      this.isFollowing(user, optionId),
    ]);
    return {
      items: rows.map((row) => this.item(user, row, active)),
      total: total!.n,
      page,
      pageSize: COMMENTS_PAGE_SIZE,
      discussion: this.state(user, active, following),
    };
  }

  async post(user: CurrentUser, optionId: string, body: CommentBody): Promise<CommentItem> {
    const option = await this.optionService.visibleRow(user, optionId);
    const active = await this.sharesOf(user, optionId);
    let audience = body.audience;
    let parentId: string | null = null;
    if (body.parentId !== undefined) {
      const parent = await this.visibleComment(user, body.parentId);
      if (!parent || parent.comment.optionId !== optionId) throw new RequestError(422, 'parentId is not a comment on this option', ['parentId: no such comment on this option']);
      if (parent.comment.parentId !== null) throw new RequestError(422, 'Replies are one level deep: reply to the comment this one answers', ['parentId: is itself a reply']);
      const parentAudience = parent.audience ?? 'council';
      if (audience !== undefined && audience !== parentAudience) throw new RequestError(422, `A reply joins its parent's discussion (${AUDIENCE_WORDS[parentAudience]})`, ['audience: differs from the parent comment']);
      audience = parentAudience;
      parentId = parent.comment.id;
    }
    const share = this.shareFor(user, active, audience);
    this.refuseUnlessOpen(share);
    if (body.anchor) await this.checkAnchor(share.runId, body.anchor);
    const id = randomUUID();
    await this.db.transaction(async (tx) => {
      // the share as it is now, held until the comment is stored: a withdrawal or a closing a moment ago wins
      const [current] = await tx.select().from(shares).where(and(eq(shares.id, share.id), isNull(shares.withdrawnAt))).for('share');
      if (!current) throw new RequestError(403, 'This option is no longer shared: the discussion is closed');
      this.refuseUnlessOpen(current);
      await tx.insert(comments).values({ id, optionId, shareId: share.id, parentId, authorId: user.id, text: body.text, anchor: body.anchor ?? null });
      // posting follows the discussion
      await tx.insert(follows).values({ optionId, userId: user.id }).onConflictDoNothing();
      const what = parentId ? `Reply to comment ${parentId}` : 'Comment';
      await recordAudit(tx, { actorId: user.id, action: 'comment.posted', subject: `comment:${id}`, detail: `${what} on harvest option "${option.name}" (${AUDIENCE_WORDS[share.audience]})` });
    });
    this.notifications?.newComment(id);
    return this.itemById(user, id);
  }

  async edit(user: CurrentUser, commentId: string, text: string): Promise<CommentItem> {
    const found = await this.visibleComment(user, commentId);
    if (!found) throw new RequestError(404, 'No such comment');
    const { comment } = found;
    if (comment.authorId !== user.id) throw new RequestError(403, 'Only its author may edit a comment');
    if (comment.hiddenAt) throw new RequestError(409, 'This comment was hidden by staff: it can no longer be edited');
    if (this.now().getTime() - comment.createdAt.getTime() > EDIT_WINDOW_MS) {
      throw new RequestError(403, `A comment may be edited for ${COMMENT_EDIT_MINUTES} minutes after it is posted; this one was posted at ${formatInstant(comment.createdAt)}`);
    }
    const audience = found.audience ?? 'council';
    const active = await this.sharesOf(user, comment.optionId);
    this.refuseUnlessOpen(this.shareFor(user, active, audience));
    await this.db.transaction(async (tx) => {
      const edited = await tx
        .update(comments)
        .set({ text, editedAt: this.now() })
        .where(and(eq(comments.id, commentId), isNull(comments.hiddenAt)))
        .returning({ id: comments.id });
      if (edited.length === 0) throw new RequestError(409, 'This comment was hidden by staff: it can no longer be edited');
      await recordAudit(tx, { actorId: user.id, action: 'comment.edited', subject: `comment:${commentId}`, detail: `Comment on option ${comment.optionId} edited by its author` });
    });
    return this.itemById(user, commentId);
  }

  async hide(user: CurrentUser, commentId: string, reason: string): Promise<CommentItem> {
    const found = await this.visibleComment(user, commentId);
    if (!found) throw new RequestError(404, 'No such comment');
    await this.db.transaction(async (tx) => {
      const hidden = await tx
        .update(comments)
        .set({ hiddenAt: this.now(), hiddenBy: user.id, hiddenReason: reason })
        .where(and(eq(comments.id, commentId), isNull(comments.hiddenAt)))
        .returning({ id: comments.id });
      if (hidden.length === 0) throw new RequestError(409, 'This comment is hidden already');
      await recordAudit(tx, { actorId: user.id, action: 'comment.hidden', subject: `comment:${commentId}`, detail: `Comment by ${found.authorName} on option ${found.comment.optionId} hidden. Reason: ${reason}` });
    });
    return this.itemById(user, commentId);
  }

  async follow(user: CurrentUser, optionId: string, on: boolean): Promise<{ following: boolean }> {
    await this.optionService.visibleRow(user, optionId);
    if (on) await this.db.insert(follows).values({ optionId, userId: user.id }).onConflictDoNothing();
    else await this.db.delete(follows).where(and(eq(follows.optionId, optionId), eq(follows.userId, user.id)));
    return { following: on };
  }

  /** The active shares this person sees, newest first, each with the count of the comments of its discussion. */
  async discussions(user: CurrentUser): Promise<{ items: DiscussionSummary[] }> {
    const rows = await this.db
      .select({ share: shares, optionName: options.name, webName: webs.name })
      .from(shares)
      .innerJoin(options, eq(options.id, shares.optionId))
      .innerJoin(webs, eq(webs.id, options.webId))
      .where(visibleShare(user))
      .orderBy(desc(shares.sharedAt), asc(shares.id));
    if (rows.length === 0) return { items: [] };
    const counts = await this.db
      .select({ optionId: comments.optionId, audience: shares.audience, n: count(), last: max(comments.createdAt) })
      .from(comments)
      .innerJoin(shares, eq(shares.id, comments.shareId))
      .where(inArray(comments.optionId, [...new Set(rows.map((r) => r.share.optionId))]))
      .groupBy(comments.optionId, shares.audience);
    return {
      items: rows.map(({ share, optionName, webName }) => {
        const tally = counts.find((c) => c.optionId === share.optionId && c.audience === share.audience);
        return {
          optionId: share.optionId,
          optionName,
          webName,
          audience: share.audience,
          shareId: share.id,
          sharedAt: share.sharedAt.toISOString(),
          closesAt: share.closesAt?.toISOString() ?? null,
          open: this.isOpen(share),
          comments: tally?.n ?? 0,
          lastCommentAt: tally?.last ? new Date(tally.last).toISOString() : null,
        };
      }),
    };
  }

  /** The active shares of the option this person sees. */
  private async sharesOf(user: CurrentUser, optionId: string): Promise<ShareRow[]> {
    return this.db
      .select()
      .from(shares)
      .where(and(eq(shares.optionId, optionId), visibleShare(user)))
      .orderBy(asc(shares.sharedAt));
  }

  /** The share a new comment goes under: the one of that audience, or the asker's default (council members: the council's; others: the public one). */
  private defaultShare(user: CurrentUser, active: ShareRow[], audience?: ShareAudience): ShareRow | undefined {
    if (audience) return active.find((s) => s.audience === audience);
    const order: ShareAudience[] = user.role === 'council' ? ['council', 'public'] : ['public', 'council'];
    for (const candidate of order) {
      const share = active.find((s) => s.audience === candidate);
      if (share) return share;
    }
    return undefined;
  }

  private shareFor(user: CurrentUser, active: ShareRow[], audience?: ShareAudience): ShareRow {
    const share = this.defaultShare(user, active, audience);
    if (!share) {
      throw new RequestError(403, audience ? `This option is not shared ${AUDIENCE_WORDS[audience]} (any more): that discussion is closed` : 'This option is not shared, so there is no discussion to post in');
    }
    return share;
  }

  private refuseUnlessOpen(share: ShareRow): void {
    if (!this.isOpen(share)) throw new RequestError(403, closedReason(share));
  }

  private isOpen(share: ShareRow): boolean {
    return share.closesAt === null || share.closesAt.getTime() > this.now().getTime();
  }

  private state(user: CurrentUser, active: ShareRow[], following: boolean): DiscussionState {
    const share = this.defaultShare(user, active);
    if (!share) return { audience: null, open: false, closedReason: 'This option is not shared, so there is no discussion to take part in.', closesAt: null, following };
    const closesAt = share.closesAt?.toISOString() ?? null;
    if (!can(user.role, 'comments.post')) return { audience: share.audience, open: false, closedReason: `Your role (${user.role}) may not comment.`, closesAt, following };
    const open = this.isOpen(share);
    return { audience: share.audience, open, closedReason: open ? null : closedReason(share), closesAt, following };
  }

  /** An indicator of the shared run's result (a scalar indicator or fishingInBalance) or one of its compartments; 422 otherwise. */
  private async checkAnchor(runId: string | null, anchor: CommentAnchor): Promise<void> {
    if (anchor.kind === 'indicator' && !INDICATOR_KEYS.has(anchor.key)) throw unknownAnchor(anchor);
    if (!runId) throw new RequestError(422, 'The run this discussion shows is gone: post without an anchor', ['anchor: no result to point at']);
    const compartments = sql`case when jsonb_typeof(${runs.result}->'web'->'compartments') = 'array' then ${runs.result}->'web'->'compartments' else '[]'::jsonb end`;
    const [row] = await this.db
      .select({
        indicator: sql<boolean>`coalesce(jsonb_typeof(${runs.result}->'difference') = 'object' and jsonb_exists(${runs.result}->'difference', ${anchor.key}), false)`,
        compartment: sql<boolean>`exists (select 1 from jsonb_array_elements(${compartments}) as c(value) where c.value->>'id' = ${anchor.key})`,
      })
      .from(runs)
      .where(eq(runs.id, runId));
    if (!row || !(anchor.kind === 'indicator' ? row.indicator : row.compartment)) throw unknownAnchor(anchor);
  }

  private listed(where: SQL | undefined) {
    return this.db
      .select({ comment: comments, authorName: users.name, authorRole: users.role, audience: shares.audience })
      .from(comments)
      .innerJoin(users, eq(users.id, comments.authorId))
      .leftJoin(shares, eq(shares.id, comments.shareId))
      .where(where)
      .$dynamic();
  }

  /** A comment this person may read (its option visible to them, its discussion one they see), or undefined. */
  private async visibleComment(user: CurrentUser, id: string): Promise<ListedComment | undefined> {
    const [found] = await this.listed(and(eq(comments.id, id), commentAudience(user)));
    if (!found) return undefined;
    try {
      await this.optionService.visibleRow(user, found.comment.optionId);
    } catch {
      return undefined;
    }
    return found;
  }

  private async itemById(user: CurrentUser, id: string): Promise<CommentItem> {
    const [found] = await this.listed(eq(comments.id, id));
    // gone between storing and reading back (its option deleted in between)
    if (!found) throw new RequestError(404, 'No such comment');
    const active = await this.sharesOf(user, found.comment.optionId);
    return this.item(user, found, active);
  }

  private async isFollowing(user: CurrentUser, optionId: string): Promise<boolean> {
    const [row] = await this.db
      .select({ userId: follows.userId })
      .from(follows)
      .where(and(eq(follows.optionId, optionId), eq(follows.userId, user.id)));
    return row !== undefined;
  }

  /** The comment as this person reads it: a hidden one is a placeholder, except to its author and to moderators. */
  private item(user: CurrentUser, { comment, authorName, authorRole, audience }: ListedComment, active: ShareRow[]): CommentItem {
    const own = comment.authorId === user.id;
    const moderator = can(user.role, 'comments.moderate');
    const hidden = comment.hiddenAt !== null;
    const shown = !hidden || own || moderator;
    const share = active.find((s) => s.audience === (audience ?? 'council'));
    const editable = own && !hidden && can(user.role, 'comments.post') && this.now().getTime() - comment.createdAt.getTime() <= EDIT_WINDOW_MS && share !== undefined && this.isOpen(share);
    return {
      id: comment.id,
      optionId: comment.optionId,
      audience: audience ?? 'council',
      parentId: comment.parentId,
      author: { id: comment.authorId, name: authorName, role: authorRole },
      text: shown ? comment.text : null,
      // a placeholder says nothing of what the comment was about
      anchor: shown ? (comment.anchor ?? null) : null,
      hidden,
      hiddenReason: hidden && (own || moderator) ? comment.hiddenReason : null,
      createdAt: comment.createdAt.toISOString(),
      editedAt: comment.editedAt?.toISOString() ?? null,
      editable,
    };
  }
}

/** Condition on comments left-joined with their share: the discussions this person reads. */
function commentAudience(user: CurrentUser): SQL | undefined {
  const audiences = shareAudiencesOf(user);
  if (audiences === null) return undefined;
  if (audiences.length === 0) return sql`false`;
  return inArray(shares.audience, [...audiences]);
}

function closedReason(share: ShareRow): string {
  const what = share.audience === 'public' ? 'Public comment on this option' : 'The council review discussion of this option';
  return `${what} closed on ${longDate(share.closesAt!)}; the discussion can still be read.`;
}

function unknownAnchor(anchor: CommentAnchor): RequestError {
  const what = anchor.kind === 'indicator' ? 'indicator' : 'compartment';
  return new RequestError(422, `anchor.key names no ${what} of this option's result: "${anchor.key}"`, [`anchor.key: unknown ${what}`]);
}

/** "3 December 2026 at 17:00 UTC". */
export function longDate(at: Date): string {
  const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(at);
  return `${day} at ${at.toISOString().slice(11, 16)} UTC`;
}

