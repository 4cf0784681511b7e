import { eq } from 'drizzle-orm';
import { auditEvents, sessions, users } from '../db/schema';
import { demoEmail, DEMO_PASSWORD } from '../seed/demo-users';
import { createTestApp, type TestApp } from '../testing/test-app';
import { SESSION_COOKIE } from './session';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
});
afterEach(() => t.close());

describe('sign-in', () => {
  it('answers the person and an HTTP-only, SameSite=Lax session cookie (not Secure on loopback http)', async () => {
    const response = await t.anonymous().post('/api/auth/sign-in').send({ email: 'Analyst@Demo.test', password: DEMO_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ id: expect.any(String), email: demoEmail('analyst'), name: expect.any(String), role: 'analyst' });
    const cookie = String(response.headers['set-cookie']);
    expect(cookie).toContain(`${SESSION_COOKIE}=`);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    expect(cookie).toContain(`Max-Age=${12 * 3600}`);
  });

  it('refuses a wrong password and an unknown address with the same 401', async () => {
    const wrong = await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('admin'), password: 'not-the-password' });
    const unknown = await t.anonymous().post('/api/auth/sign-in').send({ email: 'nobody@example.org', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('GET /api/me answers the signed-in person, 401 when signed out', async () => {
    expect((await t.anonymous().get('/api/me')).status).toBe(401);
    const agent = await t.signInAs('council');
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: demoEmail('council'), role: 'council' });
  });

  it('signs out: the session is gone on the server, not only the cookie', async () => {
    const agent = await t.signInAs('staff');
    const [me] = await t.database.db.select().from(users).where(eq(users.email, demoEmail('staff')));
    expect(await t.database.db.select().from(sessions).where(eq(sessions.userId, me.id))).toHaveLength(1);
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect((await agent.get('/api/me')).status).toBe(401);
    expect(await t.database.db.select().from(sessions).where(eq(sessions.userId, me.id))).toHaveLength(0);
    const audit = await t.database.db.select().from(auditEvents).where(eq(auditEvents.actorId, me.id)).orderBy(auditEvents.id);
    expect(audit.map((e) => e.action)).toEqual(['auth.signed-in', 'auth.signed-out']);
  });
});

describe('bad sign-in input', () => {
  it.each([
    ['no body', undefined],
    ['a missing password', { email: demoEmail('admin') }],
    ['an address that is not one', { email: 'admin', password: 'x' }],
    ['a number for the password', { email: demoEmail('admin'), password: 42 }],
    ['an unknown field', { email: demoEmail('admin'), password: DEMO_PASSWORD, remember: true }],
  ])('answers 400 to %s, with what is wrong, and writes nothing', async (_what, body) => {
    const before = await t.database.db.select().from(auditEvents);
    const response = await t.anonymous().post('/api/auth/sign-in').send(body as object);
    expect(response.status).toBe(400);
    expect(response.body.error).toEqual(expect.any(String));
    expect(response.body.details.length).toBeGreaterThan(0);
    expect(await t.database.db.select().from(auditEvents)).toEqual(before);
    expect(await t.database.db.select().from(sessions)).toHaveLength(0);
  });

  it('answers 400 to a body that is not JSON', async () => {
    const response = await t.anonymous().post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(response.status).toBe(400);
  });
});

describe('change password', () => {
  const change = (agent: Awaited<ReturnType<TestApp['signInAs']>>, currentPassword: string, newPassword: string) =>
    agent.post('/api/auth/change-password').send({ currentPassword, newPassword });

  it('changes it, keeps this session and ends the person’s other sessions', async () => {
    const here = await t.signInAs('analyst');
    const elsewhere = await t.signInAs('analyst');
    const response = await change(here, DEMO_PASSWORD, 'a much longer new password');
    expect(response.status).toBe(204);
    expect((await here.get('/api/me')).status).toBe(200);
    expect((await elsewhere.get('/api/me')).status).toBe(401);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('analyst'), password: DEMO_PASSWORD })).status).toBe(401);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('analyst'), password: 'a much longer new password' })).status).toBe(200);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'user.password-changed')).orderBy(auditEvents.id);
    expect(events).toHaveLength(1);
  });

  it('refuses a wrong current password (400, not 401: the person stays signed in) and changes nothing', async () => {
    const agent = await t.signInAs('analyst');
    const [before] = await t.database.db.select().from(users).where(eq(users.email, demoEmail('analyst')));
    const response = await change(agent, 'not the password', 'a much longer new password');
    expect(response.status).toBe(400);
    const [after] = await t.database.db.select().from(users).where(eq(users.email, demoEmail('analyst')));
    expect(after.passwordHash).toBe(before.passwordHash);
    expect((await agent.get('/api/me')).status).toBe(200);
  });

  it('refuses a new password shorter than the minimum', async () => {
    const agent = await t.signInAs('analyst');
    const response = await change(agent, DEMO_PASSWORD, 'short');
    expect(response.status).toBe(400);
    expect(response.body.details.join(' ')).toMatch(/at least 12/);
  });
});

describe('demo accounts in production', () => {
  it('cannot sign in when demo mode is off, with the same answer as a wrong password', async () => {
    const production = await createTestApp({ demoMode: false });
    try {
      const response = await production.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('admin'), password: DEMO_PASSWORD });
      expect(response.status).toBe(401);
      expect(response.body.error).toBe('Wrong e-mail address or password');
    } finally {
      await production.close();
    }
  });
});
