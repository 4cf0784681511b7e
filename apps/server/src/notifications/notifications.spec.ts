import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { closingSoonOf, notificationsOf } from '../app';
import { follows, notificationPreferences, shareNotices, unsubscribeTokens } from '../db/schema';
import { hashOneTimeToken } from '../auth/one-time-token';
import { DAY_MS, mailTo, RESULT, share, sharedOption, unsubscribeToken } from '../discussion/test-discussion';
import type { Mailer } from '../mail/mailer';
import { createOption, gillnetClosure, publishedBaseline, storeRun, userId } from '../options/test-options';
import { demoEmail } from '../seed/demo-users';
import { createTestApp, TEST_ORIGIN, type TestAgent, type TestApp } from '../testing/test-app';

/** The three notices, read back from the fake SMTP server's outbox, and their unsubscribe links. */

let t: TestApp;
let stakeholder: TestAgent;
let council: TestAgent;
let staff: TestAgent;
beforeAll(async () => {
  t = await createTestApp();
  [stakeholder, council, staff] = [await t.signInAs('stakeholder'), await t.signInAs('council'), await t.signInAs('staff')];
}, 60_000);
afterAll(() => t.close());

const STAKEHOLDER = demoEmail('stakeholder');
const COUNCIL = demoEmail('council');

/** The link as a mail scanner would open it: no cookie, no Origin header, nothing pressed. */
const peekLink = (token: string) => request(t.app).get('/api/notifications/unsubscribe').query({ token });

/**
 * Opens a link as someone who clicked it in their mail and pressed "Stop these e-mails": no cookie; the
 * page's form posts the token back from our own origin. A link used before (or unknown) answers at once.
 */
async function openLink(token: string) {
  const opened = await peekLink(token);
  if (!opened.text.includes('<form method="post"')) return opened;
  const field = /name="token" value="([^"]*)"/.exec(opened.text)![1]!;
  return request(t.app).post('/api/notifications/unsubscribe').set('Origin', TEST_ORIGIN).type('form').send({ token: field });
}

describe('preferences', () => {
  it('are every kind on by default, and changed by PUT /api/me/notifications', async () => {
    const admin = await t.signInAs('admin');
    expect((await admin.get('/api/me/notifications')).body).toEqual({ optionShared: true, newComment: true, closingSoon: true });
    const changed = await admin.put('/api/me/notifications').send({ optionShared: false, newComment: true, closingSoon: false });
    expect(changed.status).toBe(200);
    expect(changed.body).toEqual({ optionShared: false, newComment: true, closingSoon: false });
    expect((await admin.get('/api/me/notifications')).body).toEqual({ optionShared: false, newComment: true, closingSoon: false });
    expect((await admin.put('/api/me/notifications').send({ optionShared: false })).status).toBe(400);
    expect((await admin.put('/api/me/notifications').send({ optionShared: 'no', newComment: true, closingSoon: true })).status).toBe(400);
  });
});

describe('option shared', () => {
  it('tells stakeholders of a public share and council members of a council share, once each, with an unsubscribe link that works', async () => {
    const beforeStakeholder = (await mailTo(t, STAKEHOLDER, /^Open for public comment/)).length;
    const beforeCouncil = (await mailTo(t, COUNCIL, /^Shared for council review/)).length;
    const shared = await sharedOption(t, 'public');
    const toStakeholder = await mailTo(t, STAKEHOLDER, /^Open for public comment/);
    expect(toStakeholder).toHaveLength(beforeStakeholder + 1);
    const message = toStakeholder.at(-1)!;
    expect(message.text).toContain(`${TEST_ORIGIN}/options/${shared.optionId}/discussion`);
    expect(message.text).toMatch(/Comments close at \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
    expect(await mailTo(t, COUNCIL, /^Open for public comment/)).toHaveLength(0);
    expect(await t.database.db.select().from(shareNotices).where(eq(shareNotices.shareId, shared.shareId))).toEqual([expect.objectContaining({ kind: 'optionShared' })]);

    await sharedOption(t, 'council');
    expect(await mailTo(t, COUNCIL, /^Shared for council review/)).toHaveLength(beforeCouncil + 1);

    // the stakeholder turns "shared with you" off from the link, without signing in
    const page = await openLink(unsubscribeToken(message.text));
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/^text\/html/);
    expect(page.headers['content-security-policy']).toContain("default-src 'none'");
    expect(page.text).toContain('no longer e-mail you when a harvest option is shared with you');
    expect((await stakeholder.get('/api/me/notifications')).body.optionShared).toBe(false);
    await sharedOption(t, 'public');
    expect(await mailTo(t, STAKEHOLDER, /^Open for public comment/)).toHaveLength(beforeStakeholder + 1);
    await stakeholder.put('/api/me/notifications').send({ optionShared: true, newComment: true, closingSoon: true });
  });
});

describe('new comment', () => {
  it('e-mails the followers but not the author; the unsubscribe link unfollows without a session, idempotently', async () => {
    const shared = await sharedOption(t, 'public');
    const url = `/api/options/${shared.optionId}/comments`;
    expect((await council.put(`/api/options/${shared.optionId}/follow`)).body).toEqual({ following: true });
    expect((await council.get(url)).body.discussion.following).toBe(true);
    const subject = /^A new comment on an option you follow$/;
    const before = (await mailTo(t, COUNCIL, subject)).length;

    const posted = await stakeholder.post(url).send({ text: 'Seabirds first, please.\n<b>Really.</b>' });
    expect(posted.status).toBe(201);
    const toCouncil = await mailTo(t, COUNCIL, subject);
    expect(toCouncil).toHaveLength(before + 1);
    const message = toCouncil.at(-1)!;
    expect(message.text).toContain(`${TEST_ORIGIN}/options/${shared.optionId}/discussion`);
    expect(message.text).toContain('> Seabirds first, please.\n> <b>Really.</b>');
    expect(message.text).toContain('Sten Demo (stakeholder)');
    // the author (who now follows too) gets nothing about their own comment
    expect((await mailTo(t, STAKEHOLDER, subject)).filter((m) => m.text.includes(shared.optionId))).toHaveLength(0);

    // the council member answers: the stakeholder, who follows by posting, is told
    await council.post(url).send({ text: 'Noted', parentId: posted.body.id });
    expect((await mailTo(t, STAKEHOLDER, subject)).filter((m) => m.text.includes(shared.optionId))).toHaveLength(1);

    const token = unsubscribeToken(message.text);
    const page = await openLink(token);
    expect(page.status).toBe(200);
    expect(page.text).toContain('You no longer follow the discussion of');
    expect(page.text).toContain('Close the set-gillnet fleet');
    const councilId = await userId(t.database.db, 'council');
    expect(await t.database.db.select().from(follows).where(and(eq(follows.optionId, shared.optionId), eq(follows.userId, councilId)))).toEqual([]);
    const [used] = await t.database.db.select().from(unsubscribeTokens).where(eq(unsubscribeTokens.tokenHash, hashOneTimeToken(token)));
    expect(used!.usedAt).toBeInstanceOf(Date);
    // the same link again: the same page
    const again = await openLink(token);
    expect(again.status).toBe(200);
    expect(again.text).toBe(page.text);

    await stakeholder.post(url).send({ text: 'One more thing' });
    expect(await mailTo(t, COUNCIL, subject)).toHaveLength(before + 1);
    expect((await council.get(url)).body.discussion.following).toBe(false);
  });

  it('does not tell a follower who may no longer read the comment', async () => {
    const shared = await sharedOption(t, 'council');
    await share(shared.baseline, shared.optionId, 'public', new Date(Date.now() + 10 * DAY_MS));
    await stakeholder.put(`/api/options/${shared.optionId}/follow`);
    const mine = async () => (await mailTo(t, STAKEHOLDER, /^A new comment/)).filter((m) => m.text.includes(shared.optionId));
    // a council comment is not the stakeholder's to read
    await council.post(`/api/options/${shared.optionId}/comments`).send({ text: 'Internal', audience: 'council' });
    expect(await mine()).toHaveLength(0);
    await staff.post(`/api/options/${shared.optionId}/comments`).send({ text: 'Public note', audience: 'public' });
    expect(await mine()).toHaveLength(1);
  });

  it('escapes the option name on the unsubscribe page', async () => {
    const baseline = await publishedBaseline(t);
    const optionId = await createOption(baseline, { ...gillnetClosure, name: 'Gillnets <script>alert(1)</script> & "more"' });
    await storeRun(t.database.db, optionId, RESULT);
    await share(baseline, optionId, 'public', new Date(Date.now() + 3 * DAY_MS));
    await council.put(`/api/options/${optionId}/follow`);
    await stakeholder.post(`/api/options/${optionId}/comments`).send({ text: 'Hello' });
    const message = (await mailTo(t, COUNCIL, /^A new comment/)).filter((m) => m.text.includes(optionId)).at(-1)!;
    const page = await openLink(unsubscribeToken(message.text));
    expect(page.status).toBe(200);
    expect(page.text).toContain('Gillnets &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;more&quot;');
    expect(page.text).not.toContain('<script>');
  });

  it('only asks when the link is opened (mail scanners open every link): the button does it, from our own pages only', async () => {
    const shared = await sharedOption(t, 'public');
    await council.put(`/api/options/${shared.optionId}/follow`);
    await stakeholder.post(`/api/options/${shared.optionId}/comments`).send({ text: 'Scanned?' });
    const message = (await mailTo(t, COUNCIL, /^A new comment/)).filter((m) => m.text.includes(shared.optionId)).at(-1)!;
    const token = unsubscribeToken(message.text);
    for (let visit = 0; visit < 3; visit++) {
      const asked = await peekLink(token);
      expect(asked.status).toBe(200);
      expect(asked.text).toContain('Stop these e-mails?');
      expect(asked.text).toContain('Nothing changes until you press the button.');
      expect(asked.headers['content-security-policy']).toContain("form-action 'self'");
      expect(asked.headers['referrer-policy']).toBe('same-origin');
    }
    const [unused] = await t.database.db.select().from(unsubscribeTokens).where(eq(unsubscribeTokens.tokenHash, hashOneTimeToken(token)));
    expect(unused!.usedAt).toBeNull();
    expect((await council.get(`/api/options/${shared.optionId}/comments`)).body.discussion.following).toBe(true);
    // a form on another site cannot press it
    const foreign = await request(t.app).post('/api/notifications/unsubscribe').set('Origin', 'https://elsewhere.example').type('form').send({ token });
    expect(foreign.status).toBe(403);
    expect((await council.get(`/api/options/${shared.optionId}/comments`)).body.discussion.following).toBe(true);
    const pressed = await openLink(token);
    expect(pressed.text).toContain('You no longer follow the discussion of');
    expect((await council.get(`/api/options/${shared.optionId}/comments`)).body.discussion.following).toBe(false);
    // a form with no token, or a token we never sent: the unknown-link page
    expect((await request(t.app).post('/api/notifications/unsubscribe').set('Origin', TEST_ORIGIN).type('form').send({})).status).toBe(404);
    expect((await request(t.app).post('/api/notifications/unsubscribe').set('Origin', TEST_ORIGIN).type('form').send({ token: 'A'.repeat(43) })).status).toBe(404);
  });

  it('answers an unknown or malformed token with a 404 page', async () => {
    const unknown = await openLink('A'.repeat(43));
    expect(unknown.status).toBe(404);
    expect(unknown.text).toContain('This link is not known');
    expect((await request(t.app).get('/api/notifications/unsubscribe')).status).toBe(404);
    expect((await openLink('<script>')).status).toBe(404);
  });
});

describe('closing soon', () => {
  it('reminds followers and commenters of a public share closing within a day, once', async () => {
    const shared = await sharedOption(t, 'public', new Date(Date.now() + 12 * 60 * 60 * 1000));
    const later = await sharedOption(t, 'public', new Date(Date.now() + 5 * DAY_MS));
    await stakeholder.post(`/api/options/${shared.optionId}/comments`).send({ text: 'Before it closes' });
    await council.put(`/api/options/${shared.optionId}/follow`);
    await stakeholder.post(`/api/options/${later.optionId}/comments`).send({ text: 'Plenty of time' });
    const subject = /^Public comment closes soon/;
    const scheduler = closingSoonOf(t.app);

    expect(await scheduler.runOnce()).toBeGreaterThanOrEqual(1);
    const forShared = async (to: string) => (await mailTo(t, to, subject)).filter((m) => m.text.includes(shared.optionId));
    expect(await forShared(STAKEHOLDER)).toHaveLength(1);
    expect(await forShared(COUNCIL)).toHaveLength(1);
    expect((await mailTo(t, STAKEHOLDER, subject)).filter((m) => m.text.includes(later.optionId))).toHaveLength(0);
    expect(await scheduler.runOnce()).toBe(0);
    expect(await forShared(STAKEHOLDER)).toHaveLength(1);

    // four days on, the later one is due: once
    const fourDaysOn = new Date(Date.now() + 4.5 * DAY_MS);
    expect(await scheduler.runOnce(fourDaysOn)).toBe(1);
    expect(await scheduler.runOnce(fourDaysOn)).toBe(0);
    const laterMail = (await mailTo(t, STAKEHOLDER, subject)).filter((m) => m.text.includes(later.optionId));
    expect(laterMail).toHaveLength(1);

    // its link turns the reminders off
    const page = await openLink(unsubscribeToken(laterMail[0]!.text));
    expect(page.text).toContain('public comment');
    const stakeholderId = await userId(t.database.db, 'stakeholder');
    const [preferences] = await t.database.db.select().from(notificationPreferences).where(eq(notificationPreferences.userId, stakeholderId));
    expect(preferences!.closingSoon).toBe(false);
    const third = await sharedOption(t, 'public', new Date(Date.now() + 2 * 60 * 60 * 1000));
    await stakeholder.post(`/api/options/${third.optionId}/comments`).send({ text: 'Last minute' });
    expect(await scheduler.runOnce()).toBe(1);
    expect((await mailTo(t, STAKEHOLDER, subject)).filter((m) => m.text.includes(third.optionId))).toHaveLength(0);
  });

  it('starts with a check at once and stops', async () => {
    const shared = await sharedOption(t, 'public', new Date(Date.now() + 60 * 60 * 1000));
    await staff.post(`/api/options/${shared.optionId}/comments`).send({ text: 'Closing within the hour' });
    const scheduler = closingSoonOf(t.app);
    scheduler.start();
    scheduler.stop();
    const deadline = Date.now() + 10_000;
    while ((await t.database.db.select().from(shareNotices).where(and(eq(shareNotices.shareId, shared.shareId), eq(shareNotices.kind, 'closingSoon')))).length === 0) {
      if (Date.now() > deadline) throw new Error('the first check did not run');
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    expect((await mailTo(t, demoEmail('staff'), /^Public comment closes soon/)).filter((m) => m.text.includes(shared.optionId))).toHaveLength(1);
  });
});

describe('a mail server that is down', () => {
  it('fails neither the share nor the comment; the failure is logged', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    const broken: Mailer = {
      destination: 'smtp://nowhere',
      send: () => new Promise((_resolve, reject) => setTimeout(() => reject(new Error('connection refused')), 50)),
      close() {},
    };
    const down = await createTestApp({ mailer: broken });
    try {
      const baseline = await publishedBaseline(down);
      const optionId = await createOption(baseline);
      await storeRun(down.database.db, optionId, { baseline: {}, option: {}, difference: {}, web: { compartments: [] } });
      const shared = await baseline.analyst.post(`/api/options/${optionId}/shares`).send({ audience: 'public', closesAt: new Date(Date.now() + DAY_MS * 3).toISOString() });
      expect(shared.status).toBe(201);
      const someone = await down.signInAs('stakeholder');
      await (await down.signInAs('council')).put(`/api/options/${optionId}/follow`);
      const started = Date.now();
      const posted = await someone.post(`/api/options/${optionId}/comments`).send({ text: 'Is anyone there?' });
      expect(posted.status).toBe(201);
      expect(Date.now() - started).toBeLessThan(2_000);
      await notificationsOf(down.app).queue.idle();
      const lines = logged.mock.calls.map((call) => String(call[0]));
      expect(lines).toContainEqual(expect.stringMatching(/^optionShared notice to stakeholder@demo\.test not sent: connection refused/));
      expect(lines).toContainEqual(expect.stringMatching(/^newComment notice to council@demo\.test not sent: connection refused/));
    } finally {
      logged.mockRestore();
      await down.close();
    }
  }, 60_000);
});
