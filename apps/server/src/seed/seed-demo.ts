import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit-log';
import { hashPassword } from '../auth/passwords';
import type { AppDatabase, Db } from '../db/database';
import { users } from '../db/schema';
import { DEMO_PASSWORD, DEMO_USERS } from './demo-users';
import { seedDemoDiscussion } from './demo-discussion';
import { seedDemoOptions } from './demo-options';
import { seedDemoWebs } from './demo-webs';

export class DemoRefusedError extends Error {}

/**
 * Demo data for a fresh database: one user per role, the demo web and its harvest options (whose
 * runs wait in the run queue for the server to compute them), and the discussion of the option open
 * for public comment with its three invented stakeholders.
 * Runs once: a database that already has users is left alone. Refused in production, where
 * demo accounts with a published password must never exist.
 */
export async function seedDemo(database: AppDatabase, nodeEnv: string | undefined = process.env['NODE_ENV']): Promise<{ seeded: boolean }> {
  if (nodeEnv === 'production') throw new DemoRefusedError('Demo data is never seeded when NODE_ENV=production');
  const existing = await database.db.select({ id: users.id }).from(users).limit(1);
  if (existing.length > 0) return { seeded: false };
  // all or nothing: a seed that failed half-way would otherwise be skipped at every later start
  await database.db.transaction(async (tx) => {
    await seedDemoUsers(tx);
    await seedDemoWebs(tx);
    await seedDemoOptions(tx);
    await seedDemoDiscussion(tx);
  });
  return { seeded: true };
}

/** The demo users alone (tests build their database image from this). */
export async function seedDemoUsers(db: Db): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (tx) => {
    for (const user of DEMO_USERS) {
      const id = randomUUID();
      await tx.insert(users).values({ id, email: user.email, name: user.name, role: user.role, passwordHash });
      await recordAudit(tx, { actorId: null, action: 'user.created', subject: `user:${id}`, detail: `Demo account ${user.email} (${user.role})` });
    }
  });
}
