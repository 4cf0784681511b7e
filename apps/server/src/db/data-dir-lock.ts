import { closeSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { join } from 'node:path';

/** Data folders this process holds (a second openDatabase on one of them in the same process is refused too). */
const held = new Set<string>();

export class DataDirInUseError extends Error {}

/**
 * One process per data folder: PGlite is a single-user PostgreSQL and two processes writing the
 * same files would corrupt them. A lock file holds the owner's PID; a lock left by a process that
 * no longer runs is taken over. Returns the function that releases the lock.
 */
export function lockDataDir(folder: string): () => void {
  const lockPath = join(folder, 'seinework.lock');
  if (held.has(folder)) throw inUse(folder, process.pid);
  for (;;) {
    try {
      const fd = openSync(lockPath, 'wx');
      writeSync(fd, String(process.pid));
      closeSync(fd);
      break;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const owner = Number(readFileSync(lockPath, 'utf8').trim());
      if (Number.isInteger(owner) && owner > 0 && owner !== process.pid && isRunning(owner)) throw inUse(folder, owner);
      // stale: its process is gone (or it is this process's own leftover)
      rmSync(lockPath, { force: true });
    }
  }
  held.add(folder);
  return () => {
    if (!held.delete(folder)) return;
    rmSync(lockPath, { force: true });
  };
}

function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: it runs under another user
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function inUse(folder: string, pid: number): DataDirInUseError {
  return new DataDirInUseError(`The data folder ${folder} is already in use by another Seinework server (process ${pid}). Stop that server, or start this one with another DATA_DIR.`);
}
