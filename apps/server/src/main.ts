import { resolve } from 'node:path';
import { createDrawPool } from '@seinework/draw-pool';
import { closingSoonOf, createApp, notificationsOf } from './app';
import { createEngineJobs } from './engine/engine-jobs';
import { readConfig } from './config';
import { openDatabase } from './db/database';
import { DataDirInUseError } from './db/data-dir-lock';
import { seedDemo } from './seed/seed-demo';
import { startMail } from './mail/start-mail';
import { DEMO_PASSWORD, DEMO_USERS } from './seed/demo-users';
import { DEMO_DISCUSSION_USERS } from './seed/demo-discussion';
import { runQueueOf } from './runs/run-queue';

const config = readConfig();
const { port, host } = config;
const root = resolve(import.meta.dirname, '../../..');

const database = await openDatabase(config.databaseUrl ? { databaseUrl: config.databaseUrl } : { dataDir: resolve(config.dataDir) }).catch((error: unknown) => {
  // a second server on the same data folder: say so plainly instead of a stack trace
  if (error instanceof DataDirInUseError) {
    console.error(error.message);
    process.exit(1);
  }
  throw error;
});
if (config.demoMode && (await seedDemo(database, config.nodeEnv)).seeded) {
  console.log(`Demo accounts created (password ${DEMO_PASSWORD}): ${[...DEMO_USERS, ...DEMO_DISCUSSION_USERS].map((u) => u.email).join(', ')}`);
}

const mail = await startMail({ smtpUrl: config.smtpUrl, demoMode: config.demoMode, db: database.db, from: process.env['MAIL_FROM'] });
console.log(mail.where);

const drawPool = createDrawPool();
const engine = createEngineJobs({ drawPool, keepAlive: true });
const app = await createApp({
  demoWebPath: resolve(root, 'seeds/brannock-bay.json'),
  staticDir: resolve(root, 'dist/web/browser'),
  drawPool,
  engine,
  database,
  publicOrigin: config.publicOrigin,
  demoMode: config.demoMode,
  mailer: mail.mailer,
});
// runs queued by anyone (this process or another on the same PostgreSQL) are computed here
const runQueue = runQueueOf(app);
runQueue.start();
// public comment closing within a day: reminders once at start, then hourly
const closingSoon = closingSoonOf(app);
closingSoon.start();
const server = app.listen(port, host, () => {
  console.log(`Seinework is running at http://${host}:${port}/`);
});

// Stop cleanly: close the connections, then the draw workers and the database (which frees the data folder).
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    // a run being computed goes back to the queue before the workers and the database stop
    closingSoon.stop();
    server.close(() => void Promise.all([runQueue.stop(), notificationsOf(app).queue.idle()]).then(() => Promise.all([engine.destroy(), drawPool.destroy(), mail.close().then(() => database.close())])));
    server.closeAllConnections();
  });
}
