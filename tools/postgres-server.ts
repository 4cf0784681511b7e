import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * A throw-away PostgreSQL 15 server (Debian's `postgresql` package) for the API tests' DATABASE_URL
 * path: initdb in a temporary folder, started on 127.0.0.1 only, stopped and deleted afterwards.
 * PostgreSQL refuses to run as root, so under root it runs as the package's `postgres` user.
 */
export const POSTGRES_BIN = '/usr/lib/postgresql/15/bin';

export function withPostgresServer<T>(port: number, body: (url: string) => T): T {
  if (!existsSync(join(POSTGRES_BIN, 'initdb'))) throw new Error(`PostgreSQL 15 is not installed (no ${POSTGRES_BIN}/initdb): apt-get install -y postgresql`);
  const dir = mkdtempSync(join(tmpdir(), 'seinework-pg-'));
  const asRoot = process.getuid?.() === 0;
  const shell = (command: string) => {
    const result = asRoot ? spawnSync('su', ['postgres', '-c', command], { encoding: 'utf8' }) : spawnSync('sh', ['-c', command], { encoding: 'utf8' });
    if (result.status !== 0) throw new Error(`${command} failed: ${result.stdout}${result.stderr}`);
  };
  const pgData = join(dir, 'pg');
  try {
    if (asRoot) spawnSync('chown', ['postgres', dir]);
    shell(`${POSTGRES_BIN}/initdb -D ${pgData} -A trust -U postgres >/dev/null`);
    // fsync off: a test server's data need not survive a power cut
    shell(`${POSTGRES_BIN}/pg_ctl -D ${pgData} -o '-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off' -l ${join(dir, 'log')} -w start >/dev/null`);
    try {
      return body(`postgres://postgres@127.0.0.1:${port}/postgres`);
    } finally {
      shell(`${POSTGRES_BIN}/pg_ctl -D ${pgData} -m fast -w stop >/dev/null`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
