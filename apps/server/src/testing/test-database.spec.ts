import { users } from '../db/schema';
import { createTestDatabase } from './test-database';

describe('test databases', () => {
  it('run on PostgreSQL when TEST_DATABASE_URL is set, on PGlite otherwise', async () => {
    const database = await createTestDatabase();
    try {
      expect(database.kind).toBe(process.env['TEST_DATABASE_URL'] ? 'postgres' : 'pglite');
    } finally {
      await database.close();
    }
  });

  it('are each a fresh copy with the demo users: one test’s changes are not seen by the next', async () => {
    const first = await createTestDatabase();
    const second = await createTestDatabase();
    try {
      await first.db.delete(users);
      expect(await first.db.select().from(users)).toHaveLength(0);
      expect(await second.db.select().from(users)).toHaveLength(5);
      const third = await createTestDatabase();
      expect(await third.db.select().from(users)).toHaveLength(5);
      await third.close();
    } finally {
      await Promise.all([first.close(), second.close()]);
    }
  });
});
