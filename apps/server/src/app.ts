import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { demoRoutes } from './demo/demo-routes';
import { analysisRoutes } from './http/analysis-routes';
import { balancingRoutes } from './http/balancing-routes';
import { errorHandler, RequestError } from './http/errors';
import { optionRoutes } from './http/option-routes';
import { originCheck } from './http/origin-check';
import { mountAccounts } from './auth/accounts';
import { securityHeaders } from './security/security-headers';
import type { SignInLimits } from './auth/sign-in-limits';
import type { AppDatabase } from './db/database';
import { mountMailRoutes } from './mail/mail-routes';
import type { Mailer } from './mail/mailer';
import type { DrawRunner } from '@seinework/harvest-options';

export interface AppSettings {
  /** WEB.json of the demo baseline. */
  readonly demoWebPath: string;
  /** Built browser app (dist/web/browser); omitted in API-only tests. */
  readonly staticDir?: string;
  /** Worker threads for uncertainty draws (the server's, started once); draws run in process without it. */
  readonly drawPool?: DrawRunner;
  /** The database: the stateful routes (accounts, webs, …) are mounted only when it is given. */
  readonly database?: AppDatabase;
  /** Where people reach the app (Origin check, Secure cookies, links in e-mail); default http://127.0.0.1:4300. */
  readonly publicOrigin?: string;
  /** Demo accounts may sign in (NODE_ENV !== 'production'); default true. */
  readonly demoMode?: boolean;
  /** Sign-in rate limits (tests lower them); defaults in auth/sign-in-limits.ts. */
  readonly signInLimits?: SignInLimits;
  /** The clock of the sign-in limits (tests move it on). */
  readonly now?: () => Date;
  /** Sends invitations and password resets; without it they are kept but not sent (and the admin is told). */
  readonly mailer?: Mailer;
}

export async function createApp(settings: AppSettings): Promise<Express> {
  const app = express();
  app.disable('x-powered-by');
  app.use(securityHeaders(settings.publicOrigin ?? 'http://127.0.0.1:4300'));
  app.use(express.json({ limit: '5mb' }));
  app.use('/api', originCheck(settings.publicOrigin ? [settings.publicOrigin] : []));
  app.get('/api/health', (_request, response) => {
    response.json({ status: 'ok' });
  });
  app.use('/api/demo', await demoRoutes(settings.demoWebPath));
  app.use('/api/analyses', analysisRoutes());
  app.use('/api/balancing', balancingRoutes());
  app.use('/api/options', optionRoutes({ drawPool: settings.drawPool }));
  if (settings.database) {
    const publicOrigin = settings.publicOrigin ?? 'http://127.0.0.1:4300';
    // the session reader comes first: every stateful router below sees the signed-in person
    const { sessions } = mountAccounts(app, { database: settings.database, publicOrigin, demoMode: settings.demoMode ?? true, signInLimits: settings.signInLimits, now: settings.now });
    mountMailRoutes(app, { db: settings.database.db, sessions, mailer: settings.mailer, publicOrigin });
  }
  app.use('/api/{*rest}', (request, _response, next) => next(new RequestError(404, `No such API route: ${request.method} ${request.path}`)));
  if (settings.staticDir && existsSync(settings.staticDir)) {
    const staticDir = settings.staticDir;
    app.use(express.static(staticDir));
    app.get('/{*splat}', (_request, response) => response.sendFile(join(staticDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
