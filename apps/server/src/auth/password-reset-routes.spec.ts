import { eq } from 'drizzle-orm';
import { auditEvents, passwordResetTokens, users } from '../db/schema';
import { DEMO_PASSWORD, demoEmail } from '../seed/demo-users';
import { linkToken, waitForOutbox } from '../testing/mail-links';
import { createTestApp, TEST_ORIGIN, type TestAgent, type TestApp } from '../testing/test-app';

/** Password resets end to end: the link sent over SMTP to the fake, read back from the outbox, used once. */

let t: TestApp;
let admin: TestAgent;
beforeEach(async () => {
  t = await createTestApp();
  admin = await t.signInAs('admin');
});
afterEach(() => t.close());

const NEW_PASSWORD = 'a brand new passphrase';

async function requestReset(email: string): Promise<void> {
  const response = await t.anonymous().post('/api/auth/password-reset').send({ email });
  expect(response.status).toBe(202);
}

/** Asks for a reset of the address and answers the token of the link it received. */
async function resetToken(email: string): Promise<string> {
  const before = (await waitForOutbox(admin, 0)).total;
  await requestReset(email);
  const [message] = (await waitForOutbox(admin, before + 1)).items;
  expect(message.to).toBe(email);
  expect(message.subject).toBe('Choose a new Seinework password');
  return linkToken(message, TEST_ORIGIN, 'reset-password');
}

describe('password reset', () => {
  it('sends a link that sets the new password and signs the account out everywhere', async () => {
    const analystSession = await t.signInAs('analyst');
    const token = await resetToken(demoEmail('analyst'));

    const reset = await t.anonymous().post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });
    expect(reset.status).toBe(200);
    expect(reset.body).toEqual({ email: demoEmail('analyst') });

    expect((await analystSession.get('/api/me')).status).toBe(401);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('analyst'), password: DEMO_PASSWORD })).status).toBe(401);
    const signIn = await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('analyst'), password: NEW_PASSWORD });
    expect(signIn.status).toBe(200);
    expect(signIn.body.role).toBe('analyst');
    // other people stay signed in
    expect((await admin.get('/api/me')).status).toBe(200);
    const audit = await t.database.db.select().from(auditEvents);
    expect(audit.map((event) => event.action)).toEqual(expect.arrayContaining(['auth.password-reset-requested', 'user.password-reset']));
  });

  it('works once, and using one link kills the other links of the account', async () => {
    const first = await resetToken(demoEmail('staff'));
    const second = await resetToken(demoEmail('staff'));
    expect((await t.anonymous().post(`/api/auth/password-reset/${second}`).send({ password: NEW_PASSWORD })).status).toBe(200);
    const again = await t.anonymous().post(`/api/auth/password-reset/${second}`).send({ password: 'yet another passphrase' });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatch(/already been used/);
    expect((await t.anonymous().post(`/api/auth/password-reset/${first}`).send({ password: 'yet another passphrase' })).status).toBe(410);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('staff'), password: NEW_PASSWORD })).status).toBe(200);
  });

  it('refuses an expired link and leaves the password as it was', async () => {
    const token = await resetToken(demoEmail('council'));
    await t.database.db.update(passwordResetTokens).set({ expiresAt: new Date(Date.now() - 1000) });
    const response = await t.anonymous().post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });
    expect(response.status).toBe(410);
    expect(response.body.error).toMatch(/expired/);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('gives links that last an hour, stored only as a hash', async () => {
    const token = await resetToken(demoEmail('council'));
    const [row] = await t.database.db.select().from(passwordResetTokens);
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBe(3_600_000);
    expect(JSON.stringify(row)).not.toContain(token);
  });

  it('answers an unknown or deactivated address exactly as a known one, and sends nothing', async () => {
    const [staff] = await t.database.db.select().from(users).where(eq(users.email, demoEmail('staff')));
    await t.database.db.update(users).set({ active: false }).where(eq(users.id, staff.id));
    const unknown = await t.anonymous().post('/api/auth/password-reset').send({ email: 'nobody@example.org' });
    const deactivated = await t.anonymous().post('/api/auth/password-reset').send({ email: demoEmail('staff') });
    const known = await t.anonymous().post('/api/auth/password-reset').send({ email: demoEmail('analyst') });
    for (const response of [unknown, deactivated, known]) expect(response.status).toBe(202);
    expect(unknown.body.message.replace('nobody@example.org', '…')).toBe(known.body.message.replace(demoEmail('analyst'), '…'));
    // Requests are handled in order: once the known address's message is in, the others are settled.
    const outbox = await waitForOutbox(admin, 1);
    expect(outbox.items.map((message) => message.to)).toEqual([demoEmail('analyst')]);
    expect(await t.database.db.select().from(passwordResetTokens)).toHaveLength(1);
  });

  it('sends at most three links an hour to one account', async () => {
    for (let n = 0; n < 5; n++) await requestReset(demoEmail('council'));
    await waitForOutbox(admin, 3);
    // a further request to another account shows the queue is drained
    await resetToken(demoEmail('analyst'));
    const outbox = await waitForOutbox(admin, 4);
    expect(outbox.items.filter((message) => message.to === demoEmail('council'))).toHaveLength(3);
    const throttled = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'auth.password-reset-throttled')).orderBy(auditEvents.id);
    expect(throttled).toHaveLength(2);
  });

  it('limits reset requests from one client address', async () => {
    const answers: number[] = [];
    for (let n = 0; n < 11; n++) answers.push((await t.anonymous().post('/api/auth/password-reset').send({ email: `someone-${n}@example.org` })).status);
    expect(answers.slice(0, 10)).toEqual(Array(10).fill(202));
    const refused = await t.anonymous().post('/api/auth/password-reset').send({ email: 'one-more@example.org' });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toMatch(/Too many password-reset requests/);
  });

  it('answers bad input with 400 and unknown links with 404', async () => {
    for (const body of [{}, { email: 'not an address' }, { email: demoEmail('admin'), extra: true }, { email: ['a@example.org'] }]) {
      expect((await t.anonymous().post('/api/auth/password-reset').send(body)).status).toBe(400);
    }
    const token = await resetToken(demoEmail('analyst'));
    for (const body of [{}, { password: 'short' }, { password: 12345678901234 }, { password: NEW_PASSWORD, email: 'x@example.org' }]) {
      expect((await t.anonymous().post(`/api/auth/password-reset/${token}`).send(body)).status).toBe(400);
    }
    // refused attempts do not use the link up
    expect((await t.anonymous().post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD })).status).toBe(200);
    for (const unknown of ['B'.repeat(43), 'nope']) {
      const response = await t.anonymous().post(`/api/auth/password-reset/${unknown}`).send({ password: NEW_PASSWORD });
      expect(response.status).toBe(404);
      expect(response.body.error).toMatch(/not known/);
    }
  });

  it('unlocks an account that too many failed sign-ins had locked', async () => {
    for (let n = 0; n < 5; n++) await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: 'wrong password guess' });
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: DEMO_PASSWORD })).status).toBe(429);
    const token = await resetToken(demoEmail('council'));
    expect((await t.anonymous().post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD })).status).toBe(200);
    expect((await t.anonymous().post('/api/auth/sign-in').send({ email: demoEmail('council'), password: NEW_PASSWORD })).status).toBe(200);
  });
});
