import { eq, like } from 'drizzle-orm';
import { ROLES } from '@seinework/contracts';
import { verifyPassword } from '../auth/passwords';
import { openDatabase, type AppDatabase } from '../db/database';
import { auditEvents, users } from '../db/schema';
import { DemoRefusedError, seedDemo } from './seed-demo';
import { DEMO_PASSWORD, demoEmail } from './demo-users';

let database: AppDatabase;
beforeEach(async () => {
  database = await openDatabase();
});
afterEach(() => database.close());

describe('seedDemo', () => {
  it('creates one demo account per role with the demo password, once, each with its audit event', async () => {
    expect(await seedDemo(database, 'development')).toEqual({ seeded: true });
    const stored = await database.db.select().from(users);
    expect(stored.map((u) => u.email).sort()).toEqual(ROLES.map(demoEmail).sort());
    for (const user of stored) {
      expect(user.email).toBe(demoEmail(user.role));
      expect(await verifyPassword(user.passwordHash, DEMO_PASSWORD)).toBe(true);
    }
    expect(await database.db.select().from(auditEvents).where(eq(auditEvents.action, 'user.created'))).toHaveLength(ROLES.length);
    // the demo web: created and published by the demo analyst
    expect((await database.db.select().from(auditEvents).where(like(auditEvents.action, 'web.%'))).map((e) => e.action)).toEqual(['web.created', 'web.published']);
    expect(await seedDemo(database, 'development')).toEqual({ seeded: false });
    expect(await database.db.select().from(users)).toHaveLength(ROLES.length);
  });

  it('refuses in production and creates nothing', async () => {
    await expect(seedDemo(database, 'production')).rejects.toThrow(DemoRefusedError);
    expect(await database.db.select().from(users)).toHaveLength(0);
  });
});
