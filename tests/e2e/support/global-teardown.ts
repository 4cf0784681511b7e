import { rmSync } from 'node:fs';
import { SERVER_PID_VARIABLE, WORK_DIR_VARIABLE } from './server-under-test';

const STOP_LIMIT_MS = 10_000;

/** Stops the server global setup started (by its PID) and removes its data folder. */
export default async function globalTeardown(): Promise<void> {
  const pid = Number(process.env[SERVER_PID_VARIABLE]);
  if (Number.isInteger(pid) && pid > 0) {
    signal(pid, 'SIGTERM');
    const asked = Date.now();
    while (alive(pid) && Date.now() - asked < STOP_LIMIT_MS) await new Promise((wait) => setTimeout(wait, 100));
    if (alive(pid)) signal(pid, 'SIGKILL');
  }
  const workDir = process.env[WORK_DIR_VARIABLE];
  // keep the folder (and its server log) when asked to, for looking into a failure
  if (workDir && !process.env['SEINEWORK_E2E_KEEP']) rmSync(workDir, { recursive: true, force: true });
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function signal(pid: number, name: NodeJS.Signals): void {
  try {
    process.kill(pid, name);
  } catch {
    // already gone
  }
}
