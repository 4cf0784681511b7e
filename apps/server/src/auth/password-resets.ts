import { randomUUID } from 'node:crypto';
import { and, count, eq, gt, isNull } from 'drizzle-orm';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { passwordResetTokens, users } from '../db/schema';
import { RequestError } from '../http/errors';
import { hashOneTimeToken, looksLikeOneTimeToken, newOneTimeToken } from './one-time-token';
import { hashPassword } from './passwords';

/**
 * Password resets: a one-time link by e-mail, valid for RESET_HOURS, that sets a new password and
 * ends every session of the account (whoever knew the old password is signed out).
 */

export const RESET_HOURS = 1;
/** Links sent to one account per hour: enough for a lost message, too few to flood an inbox. */
export const RESETS_PER_ACCOUNT_PER_HOUR = 3;

export interface NewPasswordReset {
  readonly to: string;
  readonly name: string;
  readonly token: string;
  readonly expiresAt: Date;
}

/**
 * A reset link for an active account with this address, or null (no such account, deactivated,
 * or already sent RESETS_PER_ACCOUNT_PER_HOUR links in the last hour). The caller answers the same
 * in every case, so the answer does not tell who has an account.
 */
export async function createPasswordReset(db: Db, input: { email: string; now: Date }): Promise<NewPasswordReset | null> {
  const [user] = await db.select().from(users).where(eq(users.email, input.email));
  if (!user || !user.active) return null;
  const hourAgo = new Date(input.now.getTime() - 3_600_000);
  const { token, tokenHash } = newOneTimeToken();
  const expiresAt = new Date(input.now.getTime() + RESET_HOURS * 3_600_000);
  const created = await db.transaction(async (tx) => {
    // Lock the account's row so that concurrent requests count each other's links.
    await tx.select({ id: users.id }).from(users).where(eq(users.id, user.id)).for('update');
    const [{ recent }] = await tx
      .select({ recent: count() })
      .from(passwordResetTokens)
      .where(and(eq(passwordResetTokens.userId, user.id), gt(passwordResetTokens.createdAt, hourAgo)));
    if (recent >= RESETS_PER_ACCOUNT_PER_HOUR) {
      await recordAudit(tx, { actorId: null, action: 'auth.password-reset-throttled', subject: `user:${user.id}`, detail: `No link sent: ${recent} already sent in the last hour` });
      return false;
    }
    await tx.insert(passwordResetTokens).values({ id: randomUUID(), userId: user.id, tokenHash, createdAt: input.now, expiresAt });
    await recordAudit(tx, { actorId: null, action: 'auth.password-reset-requested', subject: `user:${user.id}`, detail: `Reset link issued for ${user.email}` });
    return true;
  });
  return created ? { to: user.email, name: user.name, token, expiresAt } : null;
}

/**
 * Sets the new password and uses up the link (and any other unused link of the account) in one
 * transaction; answers the account's id so the caller can end its sessions. Clears the failed
 * sign-in count: a reset is the way out of a locked account.
 */
export async function resetPassword(db: Db, input: { token: string; password: string; now: Date }): Promise<{ userId: string; email: string }> {
  // Fail fast on a dead link before paying for the password hash.
  await openReset(db, input.token, input.now);
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [locked] = await tx.select().from(passwordResetTokens).where(eq(passwordResetTokens.tokenHash, hashOneTimeToken(input.token))).for('update');
    const reset = usable(locked, input.now);
    const [user] = await tx.select().from(users).where(eq(users.id, reset.userId));
    if (!user || !user.active) throw new RequestError(410, 'This account is deactivated: ask an administrator');
    await tx.update(users).set({ passwordHash, failedSignIns: 0, failedSignInsSince: null }).where(eq(users.id, user.id));
    await tx
      .update(passwordResetTokens)
      .set({ usedAt: input.now })
      .where(and(eq(passwordResetTokens.userId, user.id), isNull(passwordResetTokens.usedAt)));
    await recordAudit(tx, { actorId: user.id, action: 'user.password-reset', subject: `user:${user.id}`, detail: `${user.email} set a new password with a reset link; all their sessions were ended` });
    return { userId: user.id, email: user.email };
  });
}

async function openReset(db: Db, token: string, now: Date): Promise<typeof passwordResetTokens.$inferSelect> {
  const [reset] = looksLikeOneTimeToken(token) ? await db.select().from(passwordResetTokens).where(eq(passwordResetTokens.tokenHash, hashOneTimeToken(token))) : [];
  return usable(reset, now);
}

function usable(reset: typeof passwordResetTokens.$inferSelect | undefined, now: Date): typeof passwordResetTokens.$inferSelect {
  if (!reset) throw new RequestError(404, 'This password-reset link is not known: check that the whole link was copied, or ask for a new one');
  if (reset.usedAt) throw new RequestError(410, 'This password-reset link has already been used: ask for a new one if you need to');
  if (reset.expiresAt.getTime() <= now.getTime()) throw new RequestError(410, `This password-reset link has expired (links last ${RESET_HOURS} hour): ask for a new one`);
  return reset;
}
