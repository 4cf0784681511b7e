import { randomUUID } from 'node:crypto';
import { count, eq, like } from 'drizzle-orm';
import { ROLES, type Role } from '@seinework/contracts';
import { hashPassword } from '../auth/passwords';
import { auditEvents, sessions, users } from '../db/schema';
import { demoEmail, DEMO_PASSWORD } from '../seed/demo-users';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';

let t: TestApp;
let admin: TestAgent;
beforeEach(async () => {
  t = await createTestApp({ signInLimits: { windowMinutes: 15, perAddress: 1000, perAccount: 1000 } });
  admin = await t.signInAs('admin');
});
afterEach(() => t.close());

const idOf = async (email: string) => (await t.database.db.select().from(users).where(eq(users.email, email)))[0].id;
const auditCount = async () => (await t.database.db.select({ n: count() }).from(auditEvents))[0].n;

describe('GET /api/admin/users', () => {
  it('lists every user with role and state, paginated', async () => {
    const all = await admin.get('/api/admin/users');
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(ROLES.length);
    expect(all.body.items.map((u: { role: Role }) => u.role).sort()).toEqual([...ROLES].sort());
    expect(all.body.items[0]).toEqual({ id: expect.any(String), email: expect.any(String), name: expect.any(String), role: expect.any(String), active: true, createdAt: expect.any(String) });
    const second = await admin.get('/api/admin/users?page=2&pageSize=2');
    expect(second.body.items).toEqual(all.body.items.slice(2, 4));
    expect(second.body.total).toBe(ROLES.length);
  });

  it.each(['page=0', 'pageSize=1000', 'page=two', 'sort=email'])('answers 400 to ?%s', async (query) => {
    expect((await admin.get(`/api/admin/users?${query}`)).status).toBe(400);
  });
});

describe('PATCH /api/admin/users/:id', () => {
  it('changes a role, answers the user and writes an audit event naming the change', async () => {
    const id = await idOf(demoEmail('staff'));
    const response = await admin.patch(`/api/admin/users/${id}`).send({ role: 'analyst' });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ id, role: 'analyst', active: true });
    const staff = await t.signInAs('staff');
    expect((await staff.get('/api/me')).body.role).toBe('analyst');
    const [event] = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'user.updated')).orderBy(auditEvents.id);
    expect(event).toMatchObject({ actorId: await idOf(demoEmail('admin')), subject: `user:${id}` });
    expect(event.detail).toContain('staff → analyst');
  });

  it('deactivating signs the person out everywhere and refuses their sign-in', async () => {
    const council = await t.signInAs('council');
    const id = await idOf(demoEmail('council'));
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: false })).status).toBe(200);
    expect((await council.get('/api/me')).status).toBe(401);
    expect(await t.database.db.select().from(sessions).where(eq(sessions.userId, id))).toHaveLength(0);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: DEMO_PASSWORD })).status).toBe(401);
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: true })).status).toBe(200);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: DEMO_PASSWORD })).status).toBe(200);
  });

  it.each([{ role: 'analyst' }, { active: false }])('an admin cannot demote or deactivate themselves (409): %o', async (body) => {
    const id = await idOf(demoEmail('admin'));
    const before = await auditCount();
    const response = await admin.patch(`/api/admin/users/${id}`).send(body);
    expect(response.status).toBe(409);
    expect((await t.database.db.select().from(users).where(eq(users.id, id)))[0]).toMatchObject({ role: 'admin', active: true });
    expect(await auditCount()).toBe(before);
  });

  it.each([
    ['an unknown role', { role: 'king' }],
    ['a text for active', { active: 'no' }],
    ['an unknown field', { role: 'staff', email: 'x@example.org' }],
    ['nothing to change', {}],
  ])('answers 400 to %s and changes nothing', async (_what, body) => {
    const id = await idOf(demoEmail('staff'));
    const before = await auditCount();
    const response = await admin.patch(`/api/admin/users/${id}`).send(body);
    expect(response.status).toBe(400);
    expect(response.body.details.length).toBeGreaterThan(0);
    expect((await t.database.db.select().from(users).where(eq(users.id, id)))[0].role).toBe('staff');
    expect(await auditCount()).toBe(before);
  });

  it('answers 404 to an unknown user and writes nothing', async () => {
    const before = await auditCount();
    expect((await admin.patch(`/api/admin/users/${randomUUID()}`).send({ role: 'staff' })).status).toBe(404);
    expect(await auditCount()).toBe(before);
  });
});

describe('50 concurrent writes', () => {
  async function addUsers(n: number): Promise<string[]> {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const rows = Array.from({ length: n }, (_, i) => ({ id: randomUUID(), email: `person${i}@example.org`, name: `Person ${i}`, role: 'staff' as const, passwordHash }));
    await t.database.db.insert(users).values(rows);
    return rows.map((r) => r.id);
  }

  it('50 role changes at once: every one stored, each with its audit event', async () => {
    const ids = await addUsers(50);
    const before = await auditCount();
    const roles: Role[] = ids.map((_, i) => ROLES[i % ROLES.length]);
    const answers = await Promise.all(ids.map((id, i) => admin.patch(`/api/admin/users/${id}`).send({ role: roles[i] })));
    expect(answers.map((a) => a.status)).toEqual(ids.map(() => 200));
    const stored = await t.database.db.select().from(users).where(like(users.email, 'person%@example.org'));
    expect(new Map(stored.map((u) => [u.id, u.role]))).toEqual(new Map(ids.map((id, i) => [id, roles[i]])));
    expect(await auditCount()).toBe(before + 50);
  });

  it('50 sign-ins at once: 50 sessions, 50 audit events', async () => {
    const ids = await addUsers(50);
    const answers = await Promise.all(ids.map((_, i) => t.anonymous().post('/api/auth/sign-in').send({ email: `person${i}@example.org`, password: DEMO_PASSWORD })));
    expect(answers.map((a) => a.status)).toEqual(ids.map(() => 200));
    const stored = await t.database.db.select().from(sessions);
    expect(new Set(stored.map((s) => s.userId))).toEqual(new Set([...ids, await idOf(demoEmail('admin'))]));
    const signedIn = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'auth.signed-in')).orderBy(auditEvents.id);
    expect(signedIn).toHaveLength(51);
  });
});
