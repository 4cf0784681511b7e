import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { demoRoutes } from './demo/demo-routes';
import { analysisRoutes } from './http/analysis-routes';
import { balancingRoutes } from './http/balancing-routes';
import { errorHandler, RequestError } from './http/errors';
import { optionRoutes } from './http/option-routes';
import { jsonBody } from './http/json-body';
import { refuseNul } from './http/refuse-nul';
import { originCheck } from './http/origin-check';
import { createEngineJobs, type EngineJobs } from './engine/engine-jobs';
import { mountAccounts } from './auth/accounts';
import { securityHeaders } from './security/security-headers';
import type { SignInLimits } from './auth/sign-in-limits';
import type { AppDatabase } from './db/database';
import { mountMailRoutes } from './mail/mail-routes';
import { webRoutes } from './webs/web-routes';
import { optionStoreRoutes } from './options/option-routes';
import type { Mailer } from './mail/mailer';
import { createDrawPool, type DrawPool } from '@seinework/draw-pool';
import { createRunQueue } from './runs/run-queue';
import { runRoutes } from './runs/run-routes';
import { discussionRoutes } from './discussion/discussion-routes';
import { closingSoonScheduler, type ClosingSoonScheduler } from './notifications/closing-soon-scheduler';
import { Notifications } from './notifications/notification-service';
import { notificationRoutes, UNSUBSCRIBE_FORM_PATH } from './notifications/notification-routes';
import { briefRoutes } from './briefs/brief-routes';

export interface AppSettings {
  /** WEB.json of the demo baseline. */
  readonly demoWebPath: string;
  /** Built browser app (dist/web/browser); omitted in API-only tests. */
  readonly staticDir?: string;
  /** Worker threads for uncertainty draws (the server's, started once); the engine starts its own without it. */
  readonly drawPool?: DrawPool;
  /**
   * The engine off the main thread (analyses, option runs, sensitivity, balancing; the server's,
   * started once). Without it the app starts one whose workers stop when idle.
   */
  readonly engine?: EngineJobs;
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

/** The app's notices (their queue: `await notificationsOf(app).queue.idle()` in tests). */
export function notificationsOf(app: Express): Notifications {
  return app.locals['notifications'] as Notifications;
}

/** The hourly check for public comment closing within a day. */
export function closingSoonOf(app: Express): ClosingSoonScheduler {
  return app.locals['closingSoon'] as ClosingSoonScheduler;
}

export async function createApp(settings: AppSettings): Promise<Express> {
  const app = express();
  app.disable('x-powered-by');
  app.use(securityHeaders(settings.publicOrigin ?? 'http://127.0.0.1:4300'));
  // the origin check comes before the body is read: a foreign origin is refused whatever it sends
  app.use('/api', originCheck(settings.publicOrigin ? [settings.publicOrigin] : undefined));
  // the engine's routes hand their bodies, unparsed, to engine workers; every other route reads JSON here
  const engine = settings.engine ?? createEngineJobs({ drawPool: settings.drawPool });
  app.use('/api/analyses', analysisRoutes(engine));
  app.use('/api/balancing', balancingRoutes(engine));
  app.use('/api/options', optionRoutes(engine));
  app.use(jsonBody(undefined, [UNSUBSCRIBE_FORM_PATH]));
  // below here every route may reach the database, which refuses U+0000 in text: refused in the address and query at once
  app.use(refuseNul());
  app.get('/api/health', (_request, response) => {
    response.json({ status: 'ok' });
  });
  app.use('/api/demo', await demoRoutes(settings.demoWebPath));
  if (settings.database) {
    const publicOrigin = settings.publicOrigin ?? 'http://127.0.0.1:4300';
    // the session reader comes first: every stateful router below sees the signed-in person
    const { sessions } = mountAccounts(app, { database: settings.database, publicOrigin, demoMode: settings.demoMode ?? true, signInLimits: settings.signInLimits, now: settings.now });
    mountMailRoutes(app, { db: settings.database.db, sessions, mailer: settings.mailer, publicOrigin });
    // notices of the discussion (shared with you, new comment, closing soon), sent after the change is committed
    const notifications = new Notifications({ db: settings.database.db, mailer: settings.mailer, publicOrigin });
    app.locals['notifications'] = notifications;
    // main.ts starts the hourly closing-soon check and stops it on close; tests call runOnce
    app.locals['closingSoon'] = closingSoonScheduler(notifications);
    app.use('/api/webs', webRoutes({ db: settings.database.db, engine }));
    app.use('/api', optionStoreRoutes({ db: settings.database.db, engine, notifications }));
    app.use('/api', discussionRoutes({ db: settings.database.db, engine, notifications }));
    app.use('/api', notificationRoutes(notifications));
    // the queue of option runs; main.ts starts its worker loop, tests drain it (runs/run-queue.ts, runQueueOf)
    const runQueue = createRunQueue({ db: settings.database.db, engine, drawPool: settings.drawPool ?? createDrawPool(undefined, { keepAlive: false }) });
    app.locals['runQueue'] = runQueue;
    app.use('/api', runRoutes({ db: settings.database.db, queue: runQueue }));
    app.use('/api', briefRoutes({ db: settings.database.db, engine }));
  }
  app.use('/api/{*rest}', (request, _response, next) => next(new RequestError(404, `No such API route: ${request.method} ${request.originalUrl.split('?')[0]}`)));
  if (settings.staticDir && existsSync(settings.staticDir)) {
    const staticDir = settings.staticDir;
    app.use(express.static(staticDir));
    app.get('/{*splat}', (_request, response) => response.sendFile(join(staticDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
