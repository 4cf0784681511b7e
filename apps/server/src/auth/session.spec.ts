import { eq } from 'drizzle-orm';
import request from 'supertest';
import { sessions, users } from '../db/schema';
import { demoEmail, DEMO_PASSWORD } from '../seed/demo-users';
import { createTestApp, type TestApp } from '../testing/test-app';
import { needsSecureCookies, SESSION_COOKIE, SESSION_IDLE_HOURS } from './session';

let t: TestApp;

async function sessionOf(role: 'analyst' | 'council') {
  const [user] = await t.database.db.select().from(users).where(eq(users.email, demoEmail(role)));
  const [session] = await t.database.db.select().from(sessions).where(eq(sessions.userId, user.id));
  return session;
}

const hours = (h: number) => h * 3_600_000;

describe('session expiry', () => {
  beforeEach(async () => {
    t = await createTestApp();
  }, 60_000);
  afterEach(() => t.close());

  it('a new session runs for the idle time', async () => {
    await t.signInAs('analyst');
    const session = await sessionOf('analyst');
    expect(session.expiresAt.getTime() - Date.now()).toBeGreaterThan(hours(SESSION_IDLE_HOURS) - 60_000);
    expect(session.expiresAt.getTime() - Date.now()).toBeLessThanOrEqual(hours(SESSION_IDLE_HOURS));
  });

  it('an expired session is refused (401) and removed', async () => {
    const agent = await t.signInAs('analyst');
    const session = await sessionOf('analyst');
    await t.database.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.id, session.id));
    expect((await agent.get('/api/me')).status).toBe(401);
    expect(await t.database.db.select().from(sessions).where(eq(sessions.id, session.id))).toHaveLength(0);
  });

  it('expired sessions are swept away at the next sign-in, whoever signs in', async () => {
    await t.signInAs('analyst');
    const stale = await sessionOf('analyst');
    await t.database.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.id, stale.id));
    await t.signInAs('council');
    expect(await t.database.db.select().from(sessions).where(eq(sessions.id, stale.id))).toHaveLength(0);
  });

  it('a session in use is extended (sliding) and its cookie sent again', async () => {
    const agent = await t.signInAs('council');
    const session = await sessionOf('council');
    // past half its life: the next request renews it
    const soon = new Date(Date.now() + hours(2));
    await t.database.db.update(sessions).set({ expiresAt: soon }).where(eq(sessions.id, session.id));
    const response = await agent.get('/api/me');
    expect(response.status).toBe(200);
    expect(String(response.headers['set-cookie'])).toContain(`${SESSION_COOKIE}=${session.id}`);
    expect((await sessionOf('council')).expiresAt.getTime()).toBeGreaterThan(Date.now() + hours(SESSION_IDLE_HOURS) - 60_000);
  });

  it('a fresh session is not re-sent on every request', async () => {
    const agent = await t.signInAs('council');
    expect((await agent.get('/api/me')).headers['set-cookie']).toBeUndefined();
  });

  it('a made-up session id is refused', async () => {
    const response = await t.anonymous().get('/api/me').set('Cookie', `${SESSION_COOKIE}=made-up-session-id`);
    expect(response.status).toBe(401);
  });
});

describe('cookie security', () => {
  it('is Secure unless the public origin is plain http on loopback', () => {
    expect(needsSecureCookies('http://127.0.0.1:4300')).toBe(false);
    expect(needsSecureCookies('http://localhost:4300')).toBe(false);
    expect(needsSecureCookies('http://[::1]:4300')).toBe(false);
    expect(needsSecureCookies('https://127.0.0.1:4300')).toBe(true);
    expect(needsSecureCookies('https://seinework.example.org')).toBe(true);
    expect(needsSecureCookies('http://seinework.example.org')).toBe(true);
  });

  it('sets Secure on the cookie behind https', async () => {
    const secure = await createTestApp({ publicOrigin: 'https://seinework.example.org' });
    try {
      const response = await request(secure.app).post('/api/auth/sign-in').set('Origin', 'https://seinework.example.org').send({ email: demoEmail('staff'), password: DEMO_PASSWORD });
      expect(response.status).toBe(200);
      expect(String(response.headers['set-cookie'])).toMatch(/; Secure/i);
    } finally {
      await secure.close();
    }
  });
});
