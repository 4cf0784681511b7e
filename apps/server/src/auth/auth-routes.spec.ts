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
    const audit = await t.database.db.select().from(auditEvents).where(eq(auditEvents.actorId, me.id));
    expect(audit.map((e) => e.action)).toEqual(['auth.signed-in', 'auth.signed-out']);
  });
});
