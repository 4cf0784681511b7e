import { createHash, randomBytes } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import pg from 'pg';
import { MIGRATIONS_DIR, openDatabase, type AppDatabase } from '../db/database';
import { seedDemoUsers } from '../seed/seed-demo';

/**
 * A fresh database for each test, already migrated and holding the demo users (one per role,
 * password `seinework-demo`), without paying for migrations and password hashing every time.
 *
 * PGlite (default): migrate and seed once per test process, dump the data folder, and start each
 * test's in-memory database from that image. With TEST_DATABASE_URL (a PostgreSQL server the tests
 * may create databases on): a template database is migrated and seeded once, and each test gets
 * its own `CREATE DATABASE … TEMPLATE` copy, dropped again on close.
 */
export async function createTestDatabase(): Promise<AppDatabase> {
  const url = process.env['TEST_DATABASE_URL'];
  return url ? postgresCopy(url) : pgliteCopy();
}

let pgliteImage: Promise<Blob> | undefined;

async function pgliteCopy(): Promise<AppDatabase> {
  pgliteImage ??= (async () => {
    const database = await openDatabase();
    await seedDemoUsers(database.db);
    const client = (database.db as unknown as { $client: PGlite }).$client;
    const image = await client.dumpDataDir('none');
    await database.close();
    return image;
  })();
  return openDatabase({ image: await pgliteImage });
}

async function postgresCopy(serverUrl: string): Promise<AppDatabase> {
  const template = `seinework_test_template_${schemaFingerprint()}`;
  const name = `seinework_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = new pg.Client({ connectionString: serverUrl });
  await admin.connect();
  try {
    // one creator at a time across test processes: a template must be complete, and idle, to be copied
    await admin.query('select pg_advisory_lock(7007)');
    const { rowCount } = await admin.query('select 1 from pg_database where datname = $1', [template]);
    if (rowCount === 0) {
      await admin.query(`create database "${template}"`);
      const database = await openDatabase({ databaseUrl: withDatabase(serverUrl, template) });
      await seedDemoUsers(database.db);
      await database.close();
    }
    await admin.query(`create database "${name}" template "${template}"`);
  } finally {
    await admin.query('select pg_advisory_unlock(7007)').catch(() => undefined);
    await admin.end();
  }
  const database = await openDatabase({ databaseUrl: withDatabase(serverUrl, name) });
  return {
    ...database,
    async close() {
      await database.close();
      const cleaner = new pg.Client({ connectionString: serverUrl });
      await cleaner.connect();
      await cleaner.query(`drop database if exists "${name}"`);
      await cleaner.end();
    },
  };
}

function withDatabase(serverUrl: string, database: string): string {
  const url = new URL(serverUrl);
  url.pathname = `/${database}`;
  return url.toString();
}

/** Changes with the migrations (and the demo users' seed), so a stale template is never reused. */
function schemaFingerprint(): string {
  const hash = createHash('sha256');
  for (const file of readdirSync(MIGRATIONS_DIR).filter((f) => f.endsWith('.sql')).sort()) hash.update(file).update(readFileSync(join(MIGRATIONS_DIR, file)));
  hash.update(readFileSync(join(import.meta.dirname, '../seed/demo-users.ts')));
  return hash.digest('hex').slice(0, 12);
}
