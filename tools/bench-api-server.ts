import { createServer } from 'node:http';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import { createDrawPool } from '@seinework/draw-pool';
import { createApp } from '../apps/server/src/app';
import { openDatabase } from '../apps/server/src/db/database';
import { options } from '../apps/server/src/db/schema';
import { createEngineJobs } from '../apps/server/src/engine/engine-jobs';
import { runQueueOf } from '../apps/server/src/runs/run-queue';
import { seedDemo } from '../apps/server/src/seed/seed-demo';
import { storedRunPath } from './bench-runs';

/**
 * The server under test of the API benchmark (bench-api.ts), in a process of its own so that the
 * load generator never competes with it for its event loop: the app as main.ts runs it (warm engine
 * and draw pools, the run queue's worker loop started) on a fresh, seeded PGlite data folder in a
 * temporary directory, with the sign-in rate limits lifted (see bench-api.ts). The demo runs are
 * computed before it says it is ready.
 *
 * Prints one line of JSON, `{origin, storedRunPath, optionId}`; answers the IPC message `cpu` with
 * its process.cpuUsage() (every thread of the process, microseconds); stops, removing its data
 * folder, when its stdin closes.
 */

export interface BenchServerReady {
  readonly origin: string;
  /** `GET /api/runs/:id` of a finished demo run shared for council review. */
  readonly storedRunPath: string;
  /** The demo forage-fish option, whose runs the run benchmark times. */
  readonly optionId: string;
}

const root = resolve(import.meta.dirname, '..');
const dataDir = mkdtempSync(join(tmpdir(), 'seinework-bench-'));
const database = await openDatabase({ dataDir });
const drawPool = createDrawPool();
const engine = createEngineJobs({ drawPool, keepAlive: true });
const server = createServer();
await seedDemo(database, 'development');
await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
const origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
const app = await createApp({
  demoWebPath: resolve(root, 'seeds/brannock-bay.json'),
  database,
  engine,
  drawPool,
  publicOrigin: origin,
  signInLimits: { windowMinutes: 15, perAddress: Number.MAX_SAFE_INTEGER, perAccount: Number.MAX_SAFE_INTEGER },
});
server.on('request', app);
const queue = runQueueOf(app);
await queue.drain();
queue.start();

const [option] = await database.db.select({ id: options.id }).from(options).where(eq(options.name, 'Cut the forage-fish quota by 40 %'));
if (!option) throw new Error('bench: the demo forage-fish option is missing');
process.stdout.write(`${JSON.stringify({ origin, storedRunPath: await storedRunPath(database.db), optionId: option.id } satisfies BenchServerReady)}\n`);

process.on('message', (message) => {
  if (message === 'cpu') process.send?.(process.cpuUsage());
});
process.stdin.resume();
process.stdin.on('end', () => {
  server.closeAllConnections();
  server.close(
    () =>
      void queue
        .stop()
        .then(() => Promise.all([engine.destroy(), drawPool.destroy()]))
        .then(() => database.close())
        .finally(() => {
          rmSync(dataDir, { recursive: true, force: true });
          process.exit(0);
        }),
  );
});
