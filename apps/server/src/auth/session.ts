import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { eq, sql } from 'drizzle-orm';
import { Lucia, TimeSpan } from 'lucia';
import type { CurrentUser } from '@seinework/contracts';
import type { Db } from '../db/database';
import { sessions as sessionTable, users } from '../db/schema';

/**
 * Sessions: the only module that knows lucia (its upstream maintenance ended; see STACK.md), so that
 * it can be swapped for @oslojs sessions behind the same interface.
 *
 * A session lasts SESSION_IDLE_HOURS after its last use: lucia extends it (and the cookie is
 * re-sent) once it is past half its life, so an idle session ends between 6 and 12 hours after
 * the last request and an active one keeps going.
 *
 * Every API request validates its session, so that one query is prepared once (built by drizzle
 * once, not per request) and reads only the columns the session and the person need; the rules
 * are lucia's own (expired: removed and refused; past half its life: extended, cookie re-sent).
 */

export const SESSION_COOKIE = 'seinework_session';
export const SESSION_IDLE_HOURS = 12;

export interface ValidSession {
  readonly sessionId: string;
  readonly user: CurrentUser;
  /** Set when the session was extended: send it back so the browser's cookie follows. */
  readonly refreshedCookie?: string;
}

export interface Sessions {
  /** Starts a session; answers the Set-Cookie value. */
  create(userId: string): Promise<{ sessionId: string; cookie: string }>;
  /** The session a Cookie header carries, or null (none, unknown, expired, or its user deactivated). */
  validate(cookieHeader: string | undefined): Promise<ValidSession | null>;
  invalidate(sessionId: string): Promise<void>;
  /** Ends every session of a person, except keepSessionId (the one that changed the password). */
  invalidateUserSessions(userId: string, keepSessionId?: string): Promise<void>;
  /** The Set-Cookie value that removes the session cookie. */
  blankCookie(): string;
  /** Removes sessions past their expiry (validation refuses them anyway; this keeps the table small). */
  deleteExpired(): Promise<void>;
}

export function createSessions(db: Db, options: { secureCookies: boolean }): Sessions {
  const lucia = new Lucia(new DrizzlePostgreSQLAdapter(db, sessionTable, users), {
    sessionExpiresIn: new TimeSpan(SESSION_IDLE_HOURS, 'h'),
    sessionCookie: {
      name: SESSION_COOKIE,
      // the cookie's Max-Age follows the session's idle expiry and is renewed with it
      expires: true,
      attributes: { sameSite: 'lax', secure: options.secureCookies, path: '/' },
    },
  });
  const sessionAndUser = db
    .select({ expiresAt: sessionTable.expiresAt, userId: users.id, email: users.email, name: users.name, role: users.role, active: users.active })
    .from(sessionTable)
    .innerJoin(users, eq(users.id, sessionTable.userId))
    .where(eq(sessionTable.id, sql.placeholder('sessionId')))
    .prepare('session_and_user');
  const idleMs = SESSION_IDLE_HOURS * 3_600_000;
  return {
    async create(userId) {
      const session = await lucia.createSession(userId, {});
      return { sessionId: session.id, cookie: lucia.createSessionCookie(session.id).serialize() };
    },
    async validate(cookieHeader) {
      const sessionId = lucia.readSessionCookie(cookieHeader ?? '');
      if (!sessionId) return null;
      const [found] = await sessionAndUser.execute({ sessionId });
      if (!found) return null;
      const now = Date.now();
      if (found.expiresAt.getTime() <= now) {
        await lucia.invalidateSession(sessionId);
        return null;
      }
      if (!found.active) {
        await lucia.invalidateUserSessions(found.userId);
        return null;
      }
      // past half its life: extended by the idle time from now, and the cookie sent again
      const fresh = found.expiresAt.getTime() - idleMs / 2 <= now;
      if (fresh) await db.update(sessionTable).set({ expiresAt: new Date(now + idleMs) }).where(eq(sessionTable.id, sessionId));
      return {
        sessionId,
        user: { id: found.userId, email: found.email, name: found.name, role: found.role },
        refreshedCookie: fresh ? lucia.createSessionCookie(sessionId).serialize() : undefined,
      };
    },
    invalidate: (sessionId) => lucia.invalidateSession(sessionId),
    async invalidateUserSessions(userId, keepSessionId) {
      if (!keepSessionId) return lucia.invalidateUserSessions(userId);
      const all = await lucia.getUserSessions(userId);
      await Promise.all(all.filter((s) => s.id !== keepSessionId).map((s) => lucia.invalidateSession(s.id)));
    },
    blankCookie: () => lucia.createBlankSessionCookie().serialize(),
    deleteExpired: () => lucia.deleteExpiredSessions(),
  };
}

/** Secure cookies everywhere except plain http on the loopback interface (development, tests). */
export function needsSecureCookies(publicOrigin: string): boolean {
  const url = new URL(publicOrigin);
  const loopback = ['localhost', '127.0.0.1', '[::1]'].includes(url.hostname) || url.hostname.startsWith('127.');
  return !(url.protocol === 'http:' && loopback);
}
