import type { Express } from 'express';
import { adminAuditRoutes } from '../admin/audit-routes';
import { adminUserRoutes } from '../admin/user-routes';
import type { AppDatabase } from '../db/database';
import { authRoutes } from './auth-routes';
import { sessionReader } from './guards';
import { createSessions, needsSecureCookies, type Sessions } from './session';
import { DEFAULT_SIGN_IN_LIMITS, type SignInLimits } from './sign-in-limits';

export interface AccountSettings {
  readonly database: AppDatabase;
  /** Where people reach the app: decides whether cookies are Secure. */
  readonly publicOrigin: string;
  /** False in production: demo accounts cannot sign in. */
  readonly demoMode: boolean;
  readonly signInLimits?: SignInLimits;
  /** Tests move time on (the per-account sign-in window). */
  readonly now?: () => Date;
}

export interface Accounts {
  /** For other routers that start sessions (accepting an invitation signs the person in). */
  readonly sessions: Sessions;
}

/**
 * Mounts the session reader on /api (before every stateful router, so requireSignIn and
 * requireAction see the person) and the sign-in, session and user-admin routes.
 */
export function mountAccounts(app: Express, settings: AccountSettings): Accounts {
  const { db } = settings.database;
  const sessions = createSessions(db, { secureCookies: needsSecureCookies(settings.publicOrigin) });
  app.use('/api', sessionReader(sessions));
  app.use('/api', authRoutes({ db, sessions, limits: settings.signInLimits ?? DEFAULT_SIGN_IN_LIMITS, demoMode: settings.demoMode, now: settings.now ?? (() => new Date()) }));
  app.use('/api/admin', adminUserRoutes({ db, sessions }));
  app.use('/api/admin', adminAuditRoutes({ db }));
  return { sessions };
}
