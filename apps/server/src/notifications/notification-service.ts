import { and, eq, gt, inArray, isNull, lte, ne, notExists, sql } from 'drizzle-orm';
import type { CurrentUser, NotificationKind, NotificationPreferences, ShareAudience } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import { hashOneTimeToken, looksLikeOneTimeToken, newOneTimeToken } from '../auth/one-time-token';
import type { Db } from '../db/database';
import { comments, follows, notificationPreferences, options, shareNotices, shares, unsubscribeTokens, users } from '../db/schema';
import type { Mailer, OutgoingMessage } from '../mail/mailer';
import { closingSoonMessage, newCommentMessage, optionSharedMessage } from '../mail/messages';
import { seesAudience, visibleOption } from '../options/option-visibility';
import { NoticeQueue } from './mail-queue';

/**
 * The three notices of the discussion (DEVELOPERS.md, "Discussion"): an option shared with you
 * (optionShared), a new comment on an option you follow (newComment), public comment closing within
 * a day (closingSoon). Each e-mail carries its own unsubscribe link, whose token's SHA-256 is kept
 * in unsubscribe_tokens. Notices are queued after the change that caused them is committed and sent
 * off the request (mail-queue.ts).
 */

export interface NotificationSettings {
  readonly db: Db;
  readonly mailer?: Mailer;
  /** The start of every link in e-mail. */
  readonly publicOrigin: string;
  readonly log?: (message: string) => void;
}

/** How long before a public comment period closes its followers and commenters are reminded. */
export const CLOSING_SOON_MS = 24 * 60 * 60 * 1000;
/** How much of a new comment its notice quotes. */
const EXCERPT_CHARS = 600;

const DEFAULTS: NotificationPreferences = { optionShared: true, newComment: true, closingSoon: true };

const PREFERENCE_COLUMN = {
  optionShared: notificationPreferences.optionShared,
  newComment: notificationPreferences.newComment,
  closingSoon: notificationPreferences.closingSoon,
} as const;

interface Recipient {
  id: string;
  email: string;
  name: string;
  role: CurrentUser['role'];
}

/** What an unsubscribe link turned off, for its page. */
export interface Unsubscribed {
  kind: NotificationKind;
  optionName: string | null;
}

export class Notifications {
  readonly queue: NoticeQueue;
  private readonly db: Db;
  private readonly log: (message: string) => void;

  constructor(private readonly settings: NotificationSettings) {
    this.db = settings.db;
    this.log = settings.log ?? ((message) => console.error(message));
    this.queue = new NoticeQueue(this.log);
  }

  async preferences(userId: string): Promise<NotificationPreferences> {
    const [row] = await this.db.select().from(notificationPreferences).where(eq(notificationPreferences.userId, userId));
    return row ? { optionShared: row.optionShared, newComment: row.newComment, closingSoon: row.closingSoon } : { ...DEFAULTS };
  }

  async setPreferences(userId: string, preferences: NotificationPreferences): Promise<NotificationPreferences> {
    await this.db
      .insert(notificationPreferences)
      .values({ userId, ...preferences })
      .onConflictDoUpdate({ target: notificationPreferences.userId, set: { ...preferences, updatedAt: new Date() } });
    return this.preferences(userId);
  }

  /** Queues "shared with you" to the share's audience (council members, or stakeholders for public comment); once per share. */
  optionShared(shareId: string): void {
    this.queue.add(`option shared, share ${shareId}`, async () => {
      const [found] = await this.db
        .select({ share: shares, optionName: options.name, sharedBy: users.name })
        .from(shares)
        .innerJoin(options, eq(options.id, shares.optionId))
        .innerJoin(users, eq(users.id, shares.sharedBy))
        .where(and(eq(shares.id, shareId), isNull(shares.withdrawnAt)));
      if (!found || !(await this.claim(shareId, 'optionShared'))) return;
      const role = found.share.audience === 'public' ? 'stakeholder' : 'council';
      const recipients = await this.wanting('optionShared', eq(users.role, role));
      for (const recipient of recipients) {
        await this.send(recipient, 'optionShared', found.share.optionId, (unsubscribeToken) =>
          optionSharedMessage({ ...this.common(recipient, found.share.optionId, found.optionName, unsubscribeToken), audience: found.share.audience, sharedBy: found.sharedBy, closesAt: found.share.closesAt }),
        );
      }
    });
  }

  /** Queues "a new comment" to the option's followers who may read the comment, but not to its author. */
  newComment(commentId: string): void {
    this.queue.add(`new comment ${commentId}`, async () => {
      const [found] = await this.db
        .select({ comment: comments, optionName: options.name, author: users.name, audience: shares.audience })
        .from(comments)
        .innerJoin(options, eq(options.id, comments.optionId))
        .innerJoin(users, eq(users.id, comments.authorId))
        .leftJoin(shares, eq(shares.id, comments.shareId))
        .where(eq(comments.id, commentId));
      if (!found) return;
      const { comment } = found;
      const followers = await this.wanting(
        'newComment',
        and(ne(users.id, comment.authorId), inArray(users.id, this.db.select({ id: follows.userId }).from(follows).where(eq(follows.optionId, comment.optionId)))),
      );
      const excerpt = [...comment.text].length > EXCERPT_CHARS ? `${[...comment.text].slice(0, EXCERPT_CHARS).join('')} …` : comment.text;
      for (const follower of followers) {
        if (!(await this.mayRead(follower, comment.optionId, found.audience))) continue;
        await this.send(follower, 'newComment', comment.optionId, (unsubscribeToken) =>
          newCommentMessage({ ...this.common(follower, comment.optionId, found.optionName, unsubscribeToken), author: found.author, excerpt }),
        );
      }
    });
  }

  /**
   * Finds the active public shares closing within CLOSING_SOON_MS of `now` that have not reminded
   * anyone yet, claims each (share_notices, so no share reminds twice, whatever restarts or other
   * server processes do) and queues the reminders to its followers and commenters. Returns how
   * many shares it claimed.
   */
  async closingSoon(now: Date = new Date()): Promise<number> {
    const due = await this.db
      .select({ share: shares, optionName: options.name })
      .from(shares)
      .innerJoin(options, eq(options.id, shares.optionId))
      .where(
        and(
          eq(shares.audience, 'public'),
          isNull(shares.withdrawnAt),
          gt(shares.closesAt, now),
          lte(shares.closesAt, new Date(now.getTime() + CLOSING_SOON_MS)),
          notExists(this.db.select({ one: sql`1` }).from(shareNotices).where(and(eq(shareNotices.shareId, shares.id), eq(shareNotices.kind, 'closingSoon')))),
        ),
      );
    let claimed = 0;
    for (const { share, optionName } of due) {
      if (!(await this.claim(share.id, 'closingSoon'))) continue;
      claimed++;
      const closesAt = share.closesAt!;
      this.queue.add(`closing soon, share ${share.id}`, async () => {
        const involved = sql`(${inArray(users.id, this.db.select({ id: follows.userId }).from(follows).where(eq(follows.optionId, share.optionId)))} or ${inArray(
          users.id,
          this.db.select({ id: comments.authorId }).from(comments).where(eq(comments.shareId, share.id)),
        )})`;
        for (const recipient of await this.wanting('closingSoon', involved)) {
          if (!(await this.mayRead(recipient, share.optionId, 'public'))) continue;
          await this.send(recipient, 'closingSoon', share.optionId, (unsubscribeToken) => closingSoonMessage({ ...this.common(recipient, share.optionId, optionName, unsubscribeToken), closesAt }));
        }
      });
    }
    return claimed;
  }

  /**
   * Uses an unsubscribe link: turns its kind of notice off (a newComment link unfollows its option).
   * A used link answers the same again without doing anything more; null for a token we never sent.
   */
  /** What a link would stop, and whether it was used already, without using it (the confirming page a GET answers). */
  async unsubscribeLink(token: string): Promise<(Unsubscribed & { used: boolean }) | null> {
    if (!looksLikeOneTimeToken(token)) return null;
    const [row] = await this.db
      .select({ token: unsubscribeTokens, optionName: options.name })
      .from(unsubscribeTokens)
      .leftJoin(options, eq(options.id, unsubscribeTokens.optionId))
      .where(eq(unsubscribeTokens.tokenHash, hashOneTimeToken(token)));
    if (!row) return null;
    return { kind: row.token.kind, optionName: row.token.kind === 'newComment' ? row.optionName : null, used: row.token.usedAt !== null };
  }

  async unsubscribe(token: string): Promise<Unsubscribed | null> {
    if (!looksLikeOneTimeToken(token)) return null;
    const tokenHash = hashOneTimeToken(token);
    return this.db.transaction(async (tx) => {
      const [row] = await tx
        .select({ token: unsubscribeTokens, optionName: options.name })
        .from(unsubscribeTokens)
        .leftJoin(options, eq(options.id, unsubscribeTokens.optionId))
        .where(eq(unsubscribeTokens.tokenHash, tokenHash));
      if (!row) return null;
      const { kind, userId, optionId } = row.token;
      const outcome: Unsubscribed = { kind, optionName: kind === 'newComment' ? row.optionName : null };
      const used = await tx
        .update(unsubscribeTokens)
        .set({ usedAt: new Date() })
        .where(and(eq(unsubscribeTokens.tokenHash, tokenHash), isNull(unsubscribeTokens.usedAt)))
        .returning({ hash: unsubscribeTokens.tokenHash });
      if (used.length === 0) return outcome;
      if (kind === 'newComment') {
        if (optionId) await tx.delete(follows).where(and(eq(follows.optionId, optionId), eq(follows.userId, userId)));
      } else {
        await tx
          .insert(notificationPreferences)
          .values({ userId, [kind]: false })
          .onConflictDoUpdate({ target: notificationPreferences.userId, set: { [kind]: false, updatedAt: new Date() } });
      }
      const what = kind === 'newComment' ? `stopped following option ${optionId}` : `turned off ${kind} notices`;
      await recordAudit(tx, { actorId: userId, action: 'notifications.unsubscribed', subject: `user:${userId}`, detail: `Unsubscribe link used: ${what}` });
      return outcome;
    });
  }

  /** Whether this notice for this share was not sent yet, marking it sent (one winner among concurrent callers). */
  private async claim(shareId: string, kind: NotificationKind): Promise<boolean> {
    const inserted = await this.db.insert(shareNotices).values({ shareId, kind }).onConflictDoNothing().returning({ shareId: shareNotices.shareId });
    return inserted.length > 0;
  }

  /** Active people matching a condition who have this kind of notice on (no preferences row: every kind on). */
  private async wanting(kind: NotificationKind, where: ReturnType<typeof and>): Promise<Recipient[]> {
    return this.db
      .select({ id: users.id, email: users.email, name: users.name, role: users.role })
      .from(users)
      .leftJoin(notificationPreferences, eq(notificationPreferences.userId, users.id))
      .where(and(eq(users.active, true), sql`coalesce(${PREFERENCE_COLUMN[kind]}, true)`, where))
      .orderBy(users.email);
  }

  /**
   * Whether this person may still read the option, and comments under a share of that audience. A
   * comment whose share is gone reads as the council's, as the discussion service shows it.
   */
  private async mayRead(recipient: Recipient, optionId: string, audience: ShareAudience | null): Promise<boolean> {
    const user: CurrentUser = { id: recipient.id, email: recipient.email, name: recipient.name, role: recipient.role };
    if (!seesAudience(user, audience ?? 'council')) return false;
    const [visible] = await this.db
      .select({ id: options.id })
      .from(options)
      .where(and(eq(options.id, optionId), visibleOption(user)));
    return visible !== undefined;
  }

  private common(recipient: Recipient, optionId: string, optionName: string, unsubscribeToken: string) {
    return { to: recipient.email, name: recipient.name, publicOrigin: this.settings.publicOrigin, optionId, optionName, unsubscribeToken };
  }

  /** Stores the message's unsubscribe token, then sends it; a failure is logged and the next recipient still gets theirs. */
  private async send(recipient: Recipient, kind: NotificationKind, optionId: string, build: (unsubscribeToken: string) => OutgoingMessage): Promise<void> {
    const mailer = this.settings.mailer;
    if (!mailer) {
      this.log(`No mail server configured: ${kind} notice to ${recipient.email} not sent`);
      return;
    }
    const { token, tokenHash } = newOneTimeToken();
    try {
      // only a new-comment link names its option (it unfollows that one); the others turn a kind off
      await this.db.insert(unsubscribeTokens).values({ tokenHash, userId: recipient.id, kind, optionId: kind === 'newComment' ? optionId : null });
      await mailer.send(build(token));
    } catch (error) {
      this.log(`${kind} notice to ${recipient.email} not sent: ${error instanceof Error ? error.message : String(error)}`);
    }
  }
}
