import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import pg from 'pg';
import { lockDataDir } from './data-dir-lock';
import * as schema from './schema';

export type Schema = typeof schema;
/** The drizzle database, or a transaction inside it: both drivers share this interface. */
export type Db = PgDatabase<PgQueryResultHKT, Schema>;

export interface AppDatabase {
  readonly db: Db;
  readonly kind: 'pglite' | 'postgres';
  close(): Promise<void>;
}

export interface DatabaseOptions {
  /** PGlite on disk in this folder (created if missing); one process at a time. */
  readonly dataDir?: string;
  /** A PostgreSQL server (`postgres://…`); wins over dataDir. */
  readonly databaseUrl?: string;
  /** Tests: an in-memory PGlite started from this image of an already migrated database. */
  readonly image?: Blob;
}

export const MIGRATIONS_DIR = resolve(import.meta.dirname, '../../../../drizzle');

/**
 * Opens the database and brings it up to date with drizzle/ (migrations are applied at every start;
 * those already applied are skipped). Without dataDir or databaseUrl the database lives in memory.
 */
export async function openDatabase(options: DatabaseOptions = {}): Promise<AppDatabase> {
  if (options.databaseUrl) return openPostgres(options.databaseUrl);
  return openPglite(options);
}

async function openPglite(options: DatabaseOptions): Promise<AppDatabase> {
  let unlock = () => {};
  let dataDir: string | undefined;
  if (options.dataDir) {
    const folder = resolve(options.dataDir);
    // PGlite needs the parent of its folder to exist; recursive covers a missing data/ and its parents
    mkdirSync(folder, { recursive: true });
    unlock = lockDataDir(folder);
    dataDir = join(folder, 'pglite');
  }
  try {
    const client = await PGlite.create({ dataDir, loadDataDir: options.image });
    const db = drizzlePglite({ client, schema });
    await migratePglite(db, { migrationsFolder: MIGRATIONS_DIR });
    return {
      db,
      kind: 'pglite',
      async close() {
        await client.close();
        unlock();
      },
    };
  } catch (error) {
    unlock();
    throw error;
  }
}

async function openPostgres(url: string): Promise<AppDatabase> {
  const pool = new pg.Pool({ connectionString: url, max: 10 });
  try {
    const db = drizzlePg({ client: pool, schema });
    await migratePg(db, { migrationsFolder: MIGRATIONS_DIR });
    return { db, kind: 'postgres', close: () => pool.end() };
  } catch (error) {
    await pool.end();
    throw error;
  }
}
