import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, openSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { BASE_URL_VARIABLE, SERVER_PID_VARIABLE, WORK_DIR_VARIABLE } from './server-under-test';

const root = resolve(import.meta.dirname, '../../..');
const STARTUP_LIMIT_MS = 90_000;

/**
 * Starts `tsx apps/server/src/main.ts` as `npm start` would, on a fresh data folder and a free port,
 * in demo mode (demo accounts, the local mail catcher), and waits until it answers /api/health.
 */
export default async function globalSetup(): Promise<void> {
  const builtApp = join(root, 'dist/web/browser/index.html');
  if (!existsSync(builtApp)) throw new Error(`no built app at ${builtApp}: run "node_modules/.bin/ng build web" first`);
  const chromium = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';
  if (!existsSync(chromium)) throw new Error(`no Chromium at ${chromium}: apt-get install -y chromium, or set CHROMIUM_PATH`);

  const workDir = mkdtempSync(join(tmpdir(), 'seinework-e2e-'));
  const port = await freePort();
  const log = join(workDir, 'server.log');
  const output = openSync(log, 'a');
  const { SMTP_URL: _realMail, DATABASE_URL: _realDatabase, PUBLIC_ORIGIN: _origin, ...inherited } = process.env;
  const server = spawn(process.execPath, [join(root, 'node_modules/.bin/tsx'), 'apps/server/src/main.ts'], {
    cwd: root,
    env: { ...inherited, PORT: String(port), HOST: '127.0.0.1', DATA_DIR: join(workDir, 'data'), NODE_ENV: 'development' },
    stdio: ['ignore', output, output],
  });
  const base = `http://127.0.0.1:${port}`;
  process.env[BASE_URL_VARIABLE] = base;
  process.env[SERVER_PID_VARIABLE] = String(server.pid);
  process.env[WORK_DIR_VARIABLE] = workDir;

  let exited: number | null = null;
  server.once('exit', (code) => (exited = code ?? -1));
  const started = Date.now();
  while (Date.now() - started < STARTUP_LIMIT_MS) {
    if (exited !== null) throw new Error(`the server stopped (exit ${exited}) before answering /api/health:\n${readFileSync(log, 'utf8').slice(-4000)}`);
    if (await healthy(base)) {
      console.log(`e2e: server ${server.pid} at ${base}, data and log in ${workDir}`);
      return;
    }
    await new Promise((wait) => setTimeout(wait, 250));
  }
  server.kill('SIGKILL');
  throw new Error(`the server did not answer /api/health within ${STARTUP_LIMIT_MS / 1000} s:\n${readFileSync(log, 'utf8').slice(-4000)}`);
}

async function healthy(base: string): Promise<boolean> {
  try {
    const response = await fetch(`${base}/api/health`);
    return response.ok && ((await response.json()) as { status?: string }).status === 'ok';
  } catch {
    return false;
  }
}

function freePort(): Promise<number> {
  return new Promise((found, failed) => {
    const probe = createServer();
    probe.once('error', failed);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => found(port));
    });
  });
}
