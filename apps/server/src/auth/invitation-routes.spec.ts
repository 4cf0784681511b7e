import { eq } from 'drizzle-orm';
import type { Role } from '@seinework/contracts';
import { auditEvents, invitations, users } from '../db/schema';
import { startFakeSmtp } from '../mail/fake-smtp';
import { createMailer } from '../mail/mailer';
import { linkToken, waitForOutbox } from '../testing/mail-links';
import { createTestApp, TEST_ORIGIN, type TestAgent, type TestApp } from '../testing/test-app';
import { SESSION_COOKIE } from './session';

/** Invitations end to end: sent over SMTP to the fake, read back from the outbox, the link used once. */

let t: TestApp;
let admin: TestAgent;
beforeEach(async () => {
  t = await createTestApp();
  admin = await t.signInAs('admin');
});
afterEach(() => t.close());

const PASSWORD = 'a long enough passphrase';

/** Invites the address and answers the token of the link in the e-mail it received. */
async function invite(email: string, role: Role): Promise<{ id: string; token: string }> {
  const before = (await waitForOutbox(admin, 0)).total;
  const response = await admin.post('/api/admin/invitations').send({ email, role });
  expect(response.status).toBe(201);
  const outbox = await waitForOutbox(admin, before + 1);
  const [message] = outbox.items;
  expect(message.to).toBe(email.toLowerCase());
  return { id: response.body.id, token: linkToken(message, TEST_ORIGIN, 'invitation') };
}

describe('invitations', () => {
  it('sends a link by e-mail; the link shows the invitation, sets name and password, and signs the new person in with the role', async () => {
    const response = await admin.post('/api/admin/invitations').send({ email: 'Mara.Lind@Example.org', role: 'analyst' });
    expect(response.status).toBe(201);
    expect(response.body).toEqual({ id: expect.any(String) });

    const outbox = await waitForOutbox(admin, 1);
    expect(outbox.total).toBe(1);
    const [message] = outbox.items;
    expect(message).toEqual({ to: 'mara.lind@example.org', subject: 'You are invited to Seinework', text: expect.stringContaining('Ada Demo'), sentAt: expect.any(String) });
    expect(Date.parse(message.sentAt)).not.toBeNaN();
    const token = linkToken(message, TEST_ORIGIN, 'invitation');
    expect(token).toHaveLength(43);

    const preview = await t.anonymous().get(`/api/auth/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({ email: 'mara.lind@example.org', role: 'analyst' });

    const newcomer = t.anonymous();
    const accepted = await newcomer.post(`/api/auth/invitations/${token}/accept`).send({ name: 'Mara Lind', password: PASSWORD });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ id: expect.any(String), email: 'mara.lind@example.org', name: 'Mara Lind', role: 'analyst' });
    expect(String(accepted.headers['set-cookie'])).toContain(`${SESSION_COOKIE}=`);
    expect((await newcomer.get('/api/me')).body).toEqual(accepted.body);

    const signIn = await t.anonymous().post('/api/auth/sign-in').send({ email: 'mara.lind@example.org', password: PASSWORD });
    expect(signIn.status).toBe(200);
    expect(signIn.body.role).toBe('analyst');

    const list = await admin.get('/api/admin/invitations');
    expect(list.body.items).toEqual([expect.objectContaining({ id: response.body.id, email: 'mara.lind@example.org', role: 'analyst', invitedBy: 'Ada Demo (data manager)', acceptedAt: expect.any(String) })]);
    const audit = await t.database.db.select().from(auditEvents);
    expect(audit.map((event) => event.action)).toEqual(expect.arrayContaining(['invitation.sent', 'invitation.accepted', 'user.created']));
  });

  it('stores only a hash of the token', async () => {
    const { id, token } = await invite('hash@example.org', 'staff');
    const [row] = await t.database.db.select().from(invitations).where(eq(invitations.id, id));
    expect(row.tokenHash).not.toContain(token);
    expect(JSON.stringify(row)).not.toContain(token);
  });

  it('works once: a second use of the link is refused and makes no second account', async () => {
    const { token } = await invite('once@example.org', 'council');
    expect((await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: 'First', password: PASSWORD })).status).toBe(200);
    const again = await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: 'Second', password: PASSWORD });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatch(/already been used/);
    expect((await t.anonymous().get(`/api/auth/invitations/${token}`)).status).toBe(410);
    expect(await t.database.db.select().from(users).where(eq(users.email, 'once@example.org'))).toHaveLength(1);
  });

  it('lets only one of two simultaneous uses of a link through', async () => {
    const { token } = await invite('race@example.org', 'staff');
    const answers = await Promise.all([1, 2].map((n) => t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: `Racer ${n}`, password: PASSWORD })));
    expect(answers.map((answer) => answer.status).sort()).toEqual([200, 410]);
    expect(await t.database.db.select().from(users).where(eq(users.email, 'race@example.org'))).toHaveLength(1);
  });

  it('refuses an expired link, and creates nobody', async () => {
    const { id, token } = await invite('late@example.org', 'analyst');
    await t.database.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, id));
    const preview = await t.anonymous().get(`/api/auth/invitations/${token}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error).toMatch(/expired/);
    expect((await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: 'Late', password: PASSWORD })).status).toBe(410);
    expect(await t.database.db.select().from(users).where(eq(users.email, 'late@example.org'))).toHaveLength(0);
  });

  it('expires after seven days', async () => {
    const { id } = await invite('week@example.org', 'staff');
    const [row] = await t.database.db.select().from(invitations).where(eq(invitations.id, id));
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBe(7 * 86_400_000);
  });

  it('answers 404 for a link that was never sent, however it is spelled', async () => {
    for (const token of ['A'.repeat(43), 'short', '..%2F..%2Fetc', 'x'.repeat(2000)]) {
      const response = await t.anonymous().get(`/api/auth/invitations/${token}`);
      expect(response.status).toBe(404);
      expect(response.body.error).toMatch(/not known/);
      expect((await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: 'N', password: PASSWORD })).status).toBe(404);
    }
  });

  it('revokes an unused invitation: its link stops working and it leaves the list', async () => {
    const { id, token } = await invite('revoked@example.org', 'council');
    expect((await admin.delete(`/api/admin/invitations/${id}`)).status).toBe(204);
    expect((await admin.delete(`/api/admin/invitations/${id}`)).status).toBe(204);
    const preview = await t.anonymous().get(`/api/auth/invitations/${token}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error).toMatch(/withdrawn/);
    expect((await admin.get('/api/admin/invitations')).body).toEqual({ items: [], total: 0 });
    const revoked = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'invitation.revoked')).orderBy(auditEvents.id);
    expect(revoked).toHaveLength(1);
    expect(revoked[0].subject).toBe(`invitation:${id}`);
  });

  it('refuses to revoke an accepted invitation or one that does not exist', async () => {
    const { id, token } = await invite('kept@example.org', 'staff');
    await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send({ name: 'Kept', password: PASSWORD });
    expect((await admin.delete(`/api/admin/invitations/${id}`)).status).toBe(409);
    expect((await admin.delete('/api/admin/invitations/no-such-invitation')).status).toBe(404);
  });

  it('replaces the earlier link when the same address is invited again', async () => {
    const first = await invite('twice@example.org', 'staff');
    const second = await invite('twice@example.org', 'analyst');
    expect((await t.anonymous().get(`/api/auth/invitations/${first.token}`)).status).toBe(410);
    expect((await t.anonymous().get(`/api/auth/invitations/${second.token}`)).body).toEqual({ email: 'twice@example.org', role: 'analyst' });
    expect((await admin.get('/api/admin/invitations')).body.total).toBe(1);
  });

  it('refuses to invite an address that already has an account', async () => {
    const response = await admin.post('/api/admin/invitations').send({ email: 'analyst@demo.test', role: 'admin' });
    expect(response.status).toBe(409);
    expect((await waitForOutbox(admin, 0)).total).toBe(0);
  });

  it('answers bad input with 400 and stores nothing', async () => {
    for (const body of [{}, { email: 'not an address', role: 'analyst' }, { email: 'a@example.org', role: 'owner' }, { email: 'a@example.org', role: 'staff', extra: 1 }, { email: 42, role: 'staff' }]) {
      const response = await admin.post('/api/admin/invitations').send(body);
      expect(response.status).toBe(400);
      expect(response.body.error).toEqual(expect.any(String));
    }
    expect(await t.database.db.select().from(invitations)).toHaveLength(0);
    const { token } = await invite('weak@example.org', 'staff');
    for (const body of [{ name: 'Weak', password: 'short' }, { name: '', password: PASSWORD }, { password: PASSWORD }, { name: 'Weak', password: PASSWORD, role: 'admin' }]) {
      expect((await t.anonymous().post(`/api/auth/invitations/${token}/accept`).send(body)).status).toBe(400);
    }
    // a refused attempt does not use the link up
    expect((await t.anonymous().get(`/api/auth/invitations/${token}`)).status).toBe(200);
    expect((await admin.get('/api/admin/invitations').query({ page: 0 })).status).toBe(400);
  });

  it('lets only admins invite, list, revoke and read the outbox', async () => {
    const { id } = await invite('target@example.org', 'staff');
    for (const role of ['analyst', 'council', 'stakeholder', 'staff'] as const) {
      const agent = await t.signInAs(role);
      expect((await agent.post('/api/admin/invitations').send({ email: `${role}-pick@example.org`, role: 'admin' })).status).toBe(403);
      expect((await agent.get('/api/admin/invitations')).status).toBe(403);
      expect((await agent.delete(`/api/admin/invitations/${id}`)).status).toBe(403);
      expect((await agent.get('/api/admin/outbox')).status).toBe(403);
    }
    expect((await t.anonymous().post('/api/admin/invitations').send({ email: 'x@example.org', role: 'admin' })).status).toBe(401);
    expect((await t.anonymous().get('/api/admin/outbox')).status).toBe(401);
    expect((await admin.get('/api/admin/invitations')).body.total).toBe(1);
    expect((await waitForOutbox(admin, 0)).total).toBe(1);
  });
});

describe('the outbox', () => {
  it('lists messages newest first, a page at a time', async () => {
    for (const name of ['first', 'second', 'third']) await invite(`${name}@example.org`, 'staff');
    const page1 = await admin.get('/api/admin/outbox').query({ page: 1, pageSize: 2 });
    expect(page1.body.total).toBe(3);
    expect(page1.body.items.map((m: { to: string }) => m.to)).toEqual(['third@example.org', 'second@example.org']);
    const page2 = await admin.get('/api/admin/outbox').query({ page: 2, pageSize: 2 });
    expect(page2.body.items.map((m: { to: string }) => m.to)).toEqual(['first@example.org']);
    expect((await admin.get('/api/admin/outbox').query({ pageSize: 1000 })).status).toBe(400);
  });
});

describe('when the mail server is down', () => {
  it('keeps the invitation, answers 502 saying the e-mail was not sent, and audits it', async () => {
    const gone = await startFakeSmtp({ store: async () => undefined });
    await gone.close();
    const broken = await createTestApp({ mailer: createMailer(gone.url) });
    try {
      const brokenAdmin = await broken.signInAs('admin');
      const response = await brokenAdmin.post('/api/admin/invitations').send({ email: 'unlucky@example.org', role: 'analyst' });
      expect(response.status).toBe(502);
      expect(response.body.error).toMatch(/saved but its e-mail could not be sent/);
      const list = await brokenAdmin.get('/api/admin/invitations');
      expect(list.body.items).toEqual([expect.objectContaining({ email: 'unlucky@example.org', role: 'analyst', acceptedAt: null })]);
      const failures = await broken.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'invitation.not-delivered')).orderBy(auditEvents.id);
      expect(failures).toHaveLength(1);
    } finally {
      await broken.close();
    }
  });
});
