import { eq, sql } from 'drizzle-orm';
import { rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { Db } from '../db/database';
import { users } from '../db/schema';
import { RequestError } from '../http/errors';

/**
 * Two limits on guessing passwords. Per address (express-rate-limit, in memory: one server per
 * data folder): failed sign-ins from one client address in a window. Per account (in the users
 * table, so it holds across restarts and across servers sharing one PostgreSQL): failed sign-ins
 * of one account in a window, whatever address they come from. A successful sign-in counts in neither.
 */
export interface SignInLimits {
  readonly windowMinutes: number;
  readonly perAddress: number;
  readonly perAccount: number;
}

export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = { windowMinutes: 15, perAddress: 30, perAccount: 5 };

export function addressLimiter(limits: SignInLimits): RateLimitRequestHandler {
  return rateLimit({
    windowMs: limits.windowMinutes * 60_000,
    limit: limits.perAddress,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_request, _response, next) => next(tooMany(limits)),
  });
}

export function tooMany(limits: SignInLimits, retryAfterSeconds?: number): RequestError {
  const headers: Record<string, string> = retryAfterSeconds === undefined ? {} : { 'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))) };
  return new RequestError(429, `Too many failed sign-in attempts: wait ${limits.windowMinutes} minutes and try again, or reset your password`, [], headers);
}

/**
 * Counts one attempt on an account before its password is checked, in one statement, and answers
 * how many attempts the window now holds: concurrent guesses cannot all slip in under the limit.
 * A window that ended starts again at 1; a successful sign-in clears the count.
 */
export async function countAttempt(db: Db, userId: string, limits: SignInLimits, now: Date): Promise<{ attempts: number; windowEndsAt: Date }> {
  const windowStart = new Date(now.getTime() - limits.windowMinutes * 60_000);
  const expired = sql`(${users.failedSignInsSince} is null or ${users.failedSignInsSince} <= ${windowStart.toISOString()}::timestamptz)`;
  const [row] = await db
    .update(users)
    .set({
      failedSignIns: sql`case when ${expired} then 1 else ${users.failedSignIns} + 1 end`,
      failedSignInsSince: sql`case when ${expired} then ${now.toISOString()}::timestamptz else ${users.failedSignInsSince} end`,
    })
    .where(eq(users.id, userId))
    .returning({ attempts: users.failedSignIns, since: users.failedSignInsSince });
  return { attempts: row?.attempts ?? 0, windowEndsAt: new Date((row?.since ?? now).getTime() + limits.windowMinutes * 60_000) };
}

/**
 * The same count for addresses that have no account, kept in memory: otherwise a 429 after a few
 * tries would tell that an address has an account and a 401 that it has none. Bounded: past
 * `capacity` addresses the oldest window is forgotten.
 */
export function unknownAccountAttempts(limits: SignInLimits, capacity = 10_000) {
  const windows = new Map<string, { attempts: number; since: Date }>();
  return {
    count(email: string, now: Date): { attempts: number; windowEndsAt: Date } {
      const windowMs = limits.windowMinutes * 60_000;
      const current = windows.get(email);
      const next = current && now.getTime() - current.since.getTime() < windowMs ? { attempts: current.attempts + 1, since: current.since } : { attempts: 1, since: now };
      windows.delete(email);
      windows.set(email, next);
      if (windows.size > capacity) windows.delete(windows.keys().next().value!);
      return { attempts: next.attempts, windowEndsAt: new Date(next.since.getTime() + windowMs) };
    },
  };
}

export async function clearFailures(db: Db, userId: string): Promise<void> {
  await db.update(users).set({ failedSignIns: 0, failedSignInsSince: null }).where(eq(users.id, userId));
}
