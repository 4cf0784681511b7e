import { eq } from 'drizzle-orm';
import { auditEvents } from '../db/schema';
import { demoEmail, DEMO_PASSWORD } from '../seed/demo-users';
import { createTestApp, type TestApp } from '../testing/test-app';
import { createTestDatabase } from '../testing/test-database';
import { unknownAccountAttempts } from './sign-in-limits';

let t: TestApp;
// the first test database of a process is built here, not inside the first test's time limit
beforeAll(async () => (await createTestDatabase()).close());

const signIn = (email: string, password: string) => t.anonymous().post('/api/auth/sign-in').send({ email, password });

describe('sign-in rate limits', () => {
  afterEach(() => t.close());

  it('per address: 429 once too many sign-ins failed from one address, whatever the accounts', async () => {
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 3, perAccount: 100 } });
    for (const n of [1, 2, 3]) expect((await signIn(`nobody${n}@example.org`, 'wrong password')).status).toBe(401);
    const limited = await signIn(demoEmail('admin'), DEMO_PASSWORD);
    expect(limited.status).toBe(429);
    expect(limited.body.error).toMatch(/too many/i);
    expect(limited.headers['retry-after']).toBeDefined();
  });

  it('per address: successful sign-ins do not count', async () => {
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 2, perAccount: 100 } });
    for (let n = 0; n < 4; n++) expect((await signIn(demoEmail('staff'), DEMO_PASSWORD)).status).toBe(200);
  });

  it('per account: 429 once an account had too many failures, even with the right password, until the window ends', async () => {
    let now = new Date('2026-03-01T09:00:00Z');
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 100, perAccount: 3 }, now: () => now });
    for (let n = 0; n < 3; n++) expect((await signIn(demoEmail('analyst'), 'wrong password')).status).toBe(401);
    now = new Date('2026-03-01T09:05:00Z');
    const limited = await signIn(demoEmail('analyst'), DEMO_PASSWORD);
    expect(limited.status).toBe(429);
    expect(limited.headers['retry-after']).toBe(String(10 * 60));
    // another account from the same address is not held back
    expect((await signIn(demoEmail('council'), DEMO_PASSWORD)).status).toBe(200);
    now = new Date('2026-03-01T09:16:00Z');
    expect((await signIn(demoEmail('analyst'), DEMO_PASSWORD)).status).toBe(200);
    const refused = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'auth.sign-in-refused')).orderBy(auditEvents.id);
    expect(refused).toHaveLength(1);
  });

  it('per account: an address without an account is limited alike (a 429 does not tell that an account exists)', async () => {
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 100, perAccount: 3 } });
    const statuses = async (email: string) => {
      const answers = [];
      for (let n = 0; n < 5; n++) answers.push((await signIn(email, 'wrong password')).status);
      return answers;
    };
    const known = await statuses(demoEmail('analyst'));
    expect(known).toEqual([401, 401, 401, 429, 429]);
    expect(await statuses('nobody@example.org')).toEqual(known);
  });

  it('per account: a success clears the count', async () => {
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 100, perAccount: 3 } });
    for (let round = 0; round < 3; round++) {
      for (let n = 0; n < 2; n++) expect((await signIn(demoEmail('analyst'), 'wrong password')).status).toBe(401);
      expect((await signIn(demoEmail('analyst'), DEMO_PASSWORD)).status).toBe(200);
    }
  });

  it('per account: concurrent guesses cannot slip in under the limit together', async () => {
    t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 100, perAccount: 5 } });
    const answers = await Promise.all(Array.from({ length: 8 }, () => signIn(demoEmail('analyst'), 'wrong password')));
    expect(answers.filter((a) => a.status === 401)).toHaveLength(5);
    expect(answers.filter((a) => a.status === 429)).toHaveLength(3);
  });
});

describe('unknown-address attempts', () => {
  it('forgets the oldest unknown address past its capacity', () => {
    const limits = { windowMinutes: 15, perAddress: 100, perAccount: 3 };
    const attempts = unknownAccountAttempts(limits, 2);
    const now = new Date('2026-03-01T09:00:00Z');
    expect(attempts.count('a@example.org', now).attempts).toBe(1);
    expect(attempts.count('a@example.org', now).attempts).toBe(2);
    attempts.count('b@example.org', now);
    attempts.count('c@example.org', now);
    expect(attempts.count('a@example.org', now).attempts).toBe(1);
    expect(attempts.count('c@example.org', new Date('2026-03-01T09:14:00Z')).attempts).toBe(2);
    expect(attempts.count('c@example.org', new Date('2026-03-01T09:15:00Z')).attempts).toBe(1);
  });
});
