import { resolve } from 'node:path';
import { createDrawPool } from '@seinework/draw-pool';
import { createApp } from './app';

const port = Number(process.env['PORT'] ?? 4300);
const host = process.env['HOST'] ?? '127.0.0.1';
const root = resolve(import.meta.dirname, '../../..');

const drawPool = createDrawPool();
const app = await createApp({
  demoWebPath: resolve(root, 'seeds/brannock-bay.json'),
  staticDir: resolve(root, 'dist/web/browser'),
  drawPool,
});
const server = app.listen(port, host, () => {
  console.log(`Seinework is running at http://${host}:${port}/`);
});

// Stop cleanly: close the connections, then the draw workers.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    server.close(() => void drawPool.destroy());
    server.closeAllConnections();
  });
}
