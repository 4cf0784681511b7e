import { resolve } from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { Role } from '@seinework/contracts';
import { createApp, notificationsOf, type AppSettings } from '../app';
import type { AppDatabase } from '../db/database';
import { startFakeSmtp, type FakeSmtp } from '../mail/fake-smtp';
import { createMailer } from '../mail/mailer';
import { outboxStore } from '../mail/outbox';
import { DEMO_PASSWORD, demoEmail } from '../seed/demo-users';
import { runQueueOf, type RunQueue } from '../runs/run-queue';
import { createTestDatabase } from './test-database';

export const TEST_ORIGIN = 'http://127.0.0.1:4300';

export type TestAgent = ReturnType<typeof request.agent>;

export interface TestApp {
  readonly app: Express;
  readonly database: AppDatabase;
  /** The fake SMTP server the app's mailer sends to; what it receives is in the outbox (`GET /api/admin/outbox`). */
  readonly smtp: FakeSmtp;
  /** An agent signed in as that role's demo user: it carries the session cookie and this site's Origin. */
  signInAs(role: Role): Promise<TestAgent>;
  /** An agent that is not signed in (it carries the Origin header too). */
  anonymous(): TestAgent;
  /** The app's run queue, its worker loop not started: `runQueue.drain()` computes the waiting runs. */
  readonly runQueue: RunQueue;
  close(): Promise<void>;
}

/**
 * The whole app on a fresh test database (see test-database.ts), for supertest. Settings override
 * the defaults (e.g. lower sign-in limits, a clock).
 */
export async function createTestApp(overrides: Partial<AppSettings> = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const smtp = await startFakeSmtp({ store: outboxStore(database.db) });
  const mailer = createMailer(smtp.url);
  const app = await createApp({
    demoWebPath: resolve(import.meta.dirname, '../../../../seeds/brannock-bay.json'),
    database,
    publicOrigin: TEST_ORIGIN,
    mailer,
    ...overrides,
  });
  const anonymous = () => request.agent(app).set('Origin', TEST_ORIGIN);
  return {
    app,
    database,
    smtp,
    anonymous,
    runQueue: runQueueOf(app),
    async signInAs(role) {
      const agent = anonymous();
      const response = await agent.post('/api/auth/sign-in').send({ email: demoEmail(role), password: DEMO_PASSWORD });
      if (response.status !== 200) throw new Error(`Signing in as ${role} failed: ${response.status} ${JSON.stringify(response.body)}`);
      return agent;
    },
    async close() {
      // notices still queued go out before the mail server and the database stop
      await notificationsOf(app).queue.idle();
      mailer.close();
      await smtp.close();
      await database.close();
    },
  };
}
