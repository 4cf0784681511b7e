import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { changePasswordBodySchema, signInBodySchema, type CurrentUser } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { users } from '../db/schema';
import { RequestError } from '../http/errors';
import { isDemoEmail } from '../seed/demo-users';
import { parseInput } from '../validate';
import { currentSessionId, currentUser, requireSignIn } from './guards';
import { hashPassword, verifyPassword } from './passwords';
import type { Sessions } from './session';
import { addressLimiter, clearFailures, countAttempt, tooMany, unknownAccountAttempts, type SignInLimits } from './sign-in-limits';

export interface AuthRouteOptions {
  readonly db: Db;
  readonly sessions: Sessions;
  readonly limits: SignInLimits;
  /** Demo accounts (`@demo.test`) cannot sign in when false (production). */
  readonly demoMode: boolean;
  readonly now: () => Date;
}

/** One answer for every refused sign-in, so that it does not tell which addresses have accounts. */
const WRONG = 'Wrong e-mail address or password';

/** `/api/auth/sign-in`, `/api/auth/sign-out`, `/api/auth/change-password` and `/api/me`. */
export function authRoutes(options: AuthRouteOptions): Router {
  const { db, sessions, limits } = options;
  const router = Router();
  // a hash to verify against when the address is unknown, so both cases take as long
  const dummyHash = hashPassword('not a password anyone has');
  const unknownAttempts = unknownAccountAttempts(limits);

  router.post('/auth/sign-in', addressLimiter(limits), async (request, response) => {
    const body = parseInput(signInBodySchema, request.body);
    const [user] = await db.select().from(users).where(eq(users.email, body.email));
    const now = options.now();
    const subject = user ? `user:${user.id}` : `email:${body.email}`;
    const { attempts, windowEndsAt } = user ? await countAttempt(db, user.id, limits, now) : unknownAttempts.count(body.email, now);
    if (attempts > limits.perAccount) {
      await recordAudit(db, { actorId: null, action: 'auth.sign-in-refused', subject, detail: 'Too many failed sign-ins for this account' });
      throw tooMany(limits, (windowEndsAt.getTime() - now.getTime()) / 1000);
    }
    if (!user) {
      await verifyPassword(await dummyHash, body.password);
      await recordAudit(db, { actorId: null, action: 'auth.sign-in-failed', subject, detail: 'No account with this address' });
      throw new RequestError(401, WRONG);
    }
    const refusal = !(await verifyPassword(user.passwordHash, body.password))
      ? 'Wrong password'
      : !user.active
        ? 'Account deactivated'
        : !options.demoMode && isDemoEmail(user.email)
          ? 'Demo accounts are refused in production'
          : undefined;
    if (refusal) {
      await recordAudit(db, { actorId: null, action: 'auth.sign-in-failed', subject, detail: refusal });
      throw new RequestError(401, WRONG);
    }
    // sign-ins are when sessions are made, so also when the expired ones are swept away
    await sessions.deleteExpired();
    const { cookie } = await sessions.create(user.id);
    await db.transaction(async (tx) => {
      await clearFailures(tx, user.id);
      await recordAudit(tx, { actorId: user.id, action: 'auth.signed-in', subject: `user:${user.id}`, detail: `${user.email} signed in` });
    });
    response.append('Set-Cookie', cookie);
    response.json({ id: user.id, email: user.email, name: user.name, role: user.role } satisfies CurrentUser);
  });

  router.post('/auth/sign-out', async (_request, response) => {
    const user = response.locals['user'] as CurrentUser | undefined;
    if (user) {
      await sessions.invalidate(currentSessionId(response));
      await recordAudit(db, { actorId: user.id, action: 'auth.signed-out', subject: `user:${user.id}`, detail: `${user.email} signed out` });
    }
    response.append('Set-Cookie', sessions.blankCookie());
    response.status(204).end();
  });

  router.get('/me', requireSignIn, (_request, response) => {
    response.json(currentUser(response));
  });

  router.post('/auth/change-password', requireSignIn, async (request, response) => {
    const body = parseInput(changePasswordBodySchema, request.body);
    const me = currentUser(response);
    const [user] = await db.select().from(users).where(eq(users.id, me.id));
    if (!user || !(await verifyPassword(user.passwordHash, body.currentPassword))) {
      // not 401: the person is signed in, the form's field is wrong
      throw new RequestError(400, 'The current password is not right', ['currentPassword: not right']);
    }
    const passwordHash = await hashPassword(body.newPassword);
    await db.transaction(async (tx) => {
      await tx.update(users).set({ passwordHash }).where(eq(users.id, me.id));
      await recordAudit(tx, { actorId: me.id, action: 'user.password-changed', subject: `user:${me.id}`, detail: 'Changed their password; their other sessions were ended' });
    });
    await sessions.invalidateUserSessions(me.id, currentSessionId(response));
    response.status(204).end();
  });

  return router;
}
