import { resolve } from 'node:path';
import { createDrawPool } from '@seinework/draw-pool';
import { createApp } from '../apps/server/src/app';
import { createEngineJobs } from '../apps/server/src/engine/engine-jobs';

/**
 * The stateless API as the server runs it (warm engine and draw pools, no database), for the
 * server benchmark in bench-server.ts, which runs this in a process of its own so that its own
 * work as a client never delays the answers it times. Prints the port, then serves until stdin closes.
 */
const drawPool = createDrawPool();
const engine = createEngineJobs({ drawPool, keepAlive: true });
const app = await createApp({ demoWebPath: resolve(import.meta.dirname, '../seeds/brannock-bay.json'), drawPool, engine });
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.stdout.write(`${typeof address === 'object' && address ? address.port : 0}\n`);
});
process.stdin.resume();
process.stdin.on('end', () => {
  server.closeAllConnections();
  server.close(() => void Promise.all([engine.destroy(), drawPool.destroy()]).then(() => process.exit(0)));
});
