import { resolve } from 'node:path';
import { createApp } from './app';

const port = Number(process.env['PORT'] ?? 4300);
const host = process.env['HOST'] ?? '127.0.0.1';
const root = resolve(import.meta.dirname, '../../..');

const app = await createApp({
  demoWebPath: resolve(root, 'seeds/brannock-bay.json'),
  staticDir: resolve(root, 'dist/web/browser'),
});
app.listen(port, host, () => {
  console.log(`Seinework is running at http://${host}:${port}/`);
});
