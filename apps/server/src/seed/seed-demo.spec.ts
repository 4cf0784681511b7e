import { eq, like } from 'drizzle-orm';
import { ROLES } from '@seinework/contracts';
import { verifyPassword } from '../auth/passwords';
import { openDatabase, type AppDatabase } from '../db/database';
import { auditEvents, users } from '../db/schema';
import { DemoRefusedError, seedDemo } from './seed-demo';
import { DEMO_PASSWORD, demoEmail } from './demo-users';
import { DEMO_DISCUSSION_USERS } from './demo-discussion';

let database: AppDatabase;
beforeEach(async () => {
  database = await openDatabase();
});
afterEach(() => database.close());

describe('seedDemo', () => {
  it('creates one demo account per role and the three invented stakeholders of the demo discussion, with the demo password, once, each with its audit event', async () => {
    expect(await seedDemo(database, 'development')).toEqual({ seeded: true });
    const stored = await database.db.select().from(users);
    const everyone = [...ROLES.map(demoEmail), ...DEMO_DISCUSSION_USERS.map((u) => u.email)];
    expect(stored.map((u) => u.email).sort()).toEqual(everyone.sort());
    for (const user of stored) {
      expect(user.email.endsWith('@demo.test')).toBe(true);
      expect(await verifyPassword(user.passwordHash, DEMO_PASSWORD)).toBe(true);
    }
    for (const role of ROLES) expect(stored.find((u) => u.email === demoEmail(role))!.role).toBe(role);
    expect(stored.filter((u) => u.name.endsWith('(demo)')).map((u) => u.role)).toEqual(['stakeholder', 'stakeholder', 'stakeholder']);
    expect(await database.db.select().from(auditEvents).where(eq(auditEvents.action, 'user.created')).orderBy(auditEvents.id)).toHaveLength(everyone.length);
    // the demo web: created and published by the demo analyst
    expect((await database.db.select().from(auditEvents).where(like(auditEvents.action, 'web.%')).orderBy(auditEvents.id)).map((e) => e.action)).toEqual(['web.created', 'web.published']);
    expect(await seedDemo(database, 'development')).toEqual({ seeded: false });
    expect(await database.db.select().from(users)).toHaveLength(everyone.length);
  });

  it('refuses in production and creates nothing', async () => {
    await expect(seedDemo(database, 'production')).rejects.toThrow(DemoRefusedError);
    expect(await database.db.select().from(users)).toHaveLength(0);
  });
});
