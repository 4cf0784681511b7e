import { eq } from 'drizzle-orm';
import { users } from '../db/schema';
import { demoEmail } from '../seed/demo-users';
import { createTestApp, type TestApp } from '../testing/test-app';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
});
afterEach(() => t.close());

describe('GET /api/admin/audit', () => {
  it('lists what was done, by whom and when, newest first', async () => {
    const admin = await t.signInAs('admin');
    const [staff] = await t.database.db.select().from(users).where(eq(users.email, demoEmail('staff')));
    await admin.patch(`/api/admin/users/${staff.id}`).send({ role: 'council' });
    await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('analyst'), password: 'wrong password' });
    const response = await admin.get('/api/admin/audit?pageSize=3');
    expect(response.status).toBe(200);
    const [failed, changed, signedIn] = response.body.items;
    expect(failed).toMatchObject({ actor: null, action: 'auth.sign-in-failed', detail: 'Wrong password' });
    expect(changed).toMatchObject({ actor: demoEmail('admin'), action: 'user.updated', subject: `user:${staff.id}` });
    expect(signedIn).toMatchObject({ actor: demoEmail('admin'), action: 'auth.signed-in' });
    for (const event of response.body.items) expect(new Date(event.at).getTime()).toBeGreaterThan(Date.now() - 60_000);
    // the demo seed (5 accounts) and the three above
    expect(response.body.total).toBe(8);
  });

  it('pages through the whole log', async () => {
    const admin = await t.signInAs('admin');
    const all = (await admin.get('/api/admin/audit?pageSize=200')).body;
    const pages = [];
    for (let page = 1; page <= Math.ceil(all.total / 2); page++) pages.push(...(await admin.get(`/api/admin/audit?page=${page}&pageSize=2`)).body.items);
    expect(pages).toEqual(all.items);
  });
});
