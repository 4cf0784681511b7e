import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import { seedDemo } from '../seed/seed-demo';
import { demoEmail } from '../seed/demo-users';
import { DataDirInUseError } from './data-dir-lock';
import { openDatabase } from './database';
import { users } from './schema';

// PGlite on disk: these tests use real data folders (the other specs use in-memory copies). Each
// opening of a fresh folder runs initdb (seconds, more on a busy machine): hence the longer limits.
const ON_DISK = 120_000;
let scratch: string;
beforeEach(() => {
  scratch = mkdtempSync(join(tmpdir(), 'seinework-db-'));
});
afterEach(() => rmSync(scratch, { recursive: true, force: true }));

describe('the embedded database on disk', () => {
  it('creates missing parent folders, and keeps its data across a restart', async () => {
    const dataDir = join(scratch, 'not', 'yet', 'there');
    const first = await openDatabase({ dataDir });
    expect(first.kind).toBe('pglite');
    expect(await seedDemo(first, 'development')).toEqual({ seeded: true });
    await first.db.update(users).set({ name: 'Renamed before the restart' }).where(eq(users.email, demoEmail('analyst')));
    await first.close();

    const second = await openDatabase({ dataDir });
    const [analyst] = await second.db.select().from(users).where(eq(users.email, demoEmail('analyst')));
    expect(analyst.name).toBe('Renamed before the restart');
    // the five role accounts and the three invented stakeholders of the demo discussion
    expect(await second.db.select().from(users)).toHaveLength(8);
    // seeded once: a database with users is left alone
    expect(await seedDemo(second, 'development')).toEqual({ seeded: false });
    await second.close();
  }, ON_DISK);

  it('refuses a second opening of a data folder in use, and frees it on close', async () => {
    const dataDir = join(scratch, 'data');
    const first = await openDatabase({ dataDir });
    await expect(openDatabase({ dataDir })).rejects.toThrow(DataDirInUseError);
    await expect(openDatabase({ dataDir })).rejects.toThrow(/already in use by another Seinework server/);
    await first.close();
    const again = await openDatabase({ dataDir });
    await again.close();
  }, ON_DISK);

  it('takes over a lock left by a process that no longer runs', async () => {
    const dataDir = join(scratch, 'data');
    await (await openDatabase({ dataDir })).close();
    // a PID beyond the kernel's pid_max belongs to no process
    writeFileSync(join(dataDir, 'seinework.lock'), '4194305');
    const database = await openDatabase({ dataDir });
    await database.close();
  }, ON_DISK);
});

describe('one server per data folder', () => {
  const root = resolve(import.meta.dirname, '../../../..');
  const started: ChildProcess[] = [];
  afterEach(() => {
    for (const child of started) if (child.exitCode === null) child.kill('SIGKILL');
  });

  function startServer(dataDir: string) {
    // `node --import tsx` runs the server in this one process, so killing it leaves no grandchild behind
    const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'apps/server/src/main.ts')], {
      cwd: root,
      env: { ...process.env, DATA_DIR: dataDir, PORT: '0', NODE_ENV: 'development', DATABASE_URL: '' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    started.push(child);
    let output = '';
    child.stdout!.on('data', (chunk) => (output += chunk));
    child.stderr!.on('data', (chunk) => (output += chunk));
    const exited = new Promise<number | null>((done) => child.once('exit', (code) => done(code)));
    const running = new Promise<void>((ready, fail) => {
      child.stdout!.on('data', () => output.includes('Seinework is running') && ready());
      void exited.then(() => fail(new Error(`the server stopped: ${output}`)));
    });
    running.catch(() => undefined);
    return { child, exited, running, output: () => output };
  }

  it('a second server on the same DATA_DIR stops at once with a clear message; the first one is unharmed', async () => {
    const dataDir = join(scratch, 'data');
    const first = startServer(dataDir);
    await first.running;
    expect(first.output()).toContain('Demo accounts created');
    const second = startServer(dataDir);
    expect(await second.exited).toBe(1);
    expect(second.output()).toMatch(new RegExp(`The data folder ${dataDir} is already in use by another Seinework server \\(process \\d+\\)`));
    expect(first.child.exitCode).toBeNull();
    first.child.kill('SIGTERM');
    await first.exited;
    expect(existsSync(join(dataDir, 'seinework.lock'))).toBe(false);
  }, ON_DISK);
});
