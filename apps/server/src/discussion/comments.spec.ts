import { count, eq } from 'drizzle-orm';
import { COMMENTS_PAGE_SIZE, MAX_COMMENT_LENGTH, type CommentItem, type CommentPage } from '@seinework/contracts';
import { auditEvents, comments, follows } from '../db/schema';
import { userId } from '../options/test-options';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { setClosesAt, sharedOption, type SharedOption } from './test-discussion';

/** Posting, listing, editing and hiding comments (DEVELOPERS.md, "Discussion"). */

let t: TestApp;
let stakeholder: TestAgent;
let council: TestAgent;
let staff: TestAgent;
beforeAll(async () => {
  t = await createTestApp();
  [stakeholder, council, staff] = [await t.signInAs('stakeholder'), await t.signInAs('council'), await t.signInAs('staff')];
}, 60_000);
afterAll(() => t.close());

const auditOf = async (subject: string) => (await t.database.db.select().from(auditEvents).where(eq(auditEvents.subject, subject)).orderBy(auditEvents.id)).map((e) => e.action);
const commentsUrl = (shared: SharedOption) => `/api/options/${shared.optionId}/comments`;

describe('posting', () => {
  it('keeps 50 comments posted at once: none lost, none duplicated, listed oldest first in pages of 50', async () => {
    const shared = await sharedOption(t, 'public');
    const texts = Array.from({ length: 50 }, (_, i) => `Remark number ${i + 1}`);
    const posted = await Promise.all(texts.map((text) => stakeholder.post(commentsUrl(shared)).send({ text })));
    expect(posted.map((r) => r.status)).toEqual(texts.map(() => 201));
    const ids = posted.map((r) => r.body.id as string);
    expect(new Set(ids).size).toBe(50);
    const [stored] = await t.database.db.select({ n: count() }).from(comments).where(eq(comments.optionId, shared.optionId));
    expect(stored!.n).toBe(50);

    const page = (await council.get(commentsUrl(shared))).body as CommentPage;
    expect(page.total).toBe(50);
    expect(page.pageSize).toBe(COMMENTS_PAGE_SIZE);
    expect(page.items.map((c) => c.text).sort()).toEqual([...texts].sort());
    const times = page.items.map((c) => c.createdAt);
    expect(times).toEqual([...times].sort());
    // one more makes a second page
    await stakeholder.post(commentsUrl(shared)).send({ text: 'The fifty-first' });
    const second = (await council.get(commentsUrl(shared)).query({ page: 2 })).body as CommentPage;
    expect(second.items.map((c) => c.text)).toEqual(['The fifty-first']);
    expect(second.total).toBe(51);
    expect((await council.get(commentsUrl(shared)).query({ page: 0 })).status).toBe(400);
    const huge = await council.get(`${commentsUrl(shared)}?page=99999999999999999999`);
    expect(huge.status).toBe(400);
    expect(huge.body.details).toEqual([...new Set(huge.body.details)]); // each problem said once
    expect(huge.body.details.join(' ')).toMatch(/page must/);
    // posting followed the discussion, once
    const followed = await t.database.db.select().from(follows).where(eq(follows.optionId, shared.optionId));
    expect(followed.map((f) => f.userId)).toEqual([await userId(t.database.db, 'stakeholder')]);
  }, 60_000);

  const KEPT: [string, string, string][] = [
    ['markup', '<b>bold</b> & <i>"quoted"</i> \'single\'', '<b>bold</b> & <i>"quoted"</i> \'single\''],
    ['a script', '<script>alert("x")</script><img src=x onerror=alert(1)>', '<script>alert("x")</script><img src=x onerror=alert(1)>'],
    ['right-to-left marks and overrides', 'quota \u202Eevil\u202C \u200Fשלום\u200E', 'quota \u202Eevil\u202C \u200Fשלום\u200E'],
    ['4000 characters', 'a'.repeat(MAX_COMMENT_LENGTH), 'a'.repeat(MAX_COMMENT_LENGTH)],
    ['4000 characters outside the basic plane', '🐟'.repeat(MAX_COMMENT_LENGTH), '🐟'.repeat(MAX_COMMENT_LENGTH)],
    ['tabs and line breaks (CRLF made LF, ends trimmed)', '  first\tline\r\nsecond line\n\nthird  ', 'first\tline\nsecond line\n\nthird'],
    ['SQL-looking text', "'); drop table comments; --", "'); drop table comments; --"],
  ];

  it.each(KEPT)('stores %s as typed and answers the same plain string', async (_what, text, expected) => {
    const shared = await sharedOption(t, 'public');
    const posted = await stakeholder.post(commentsUrl(shared)).send({ text });
    expect(posted.status, JSON.stringify(posted.body)).toBe(201);
    expect(posted.headers['content-type']).toMatch(/^application\/json/);
    expect(posted.body.text).toBe(expected);
    const [row] = await t.database.db.select().from(comments).where(eq(comments.id, posted.body.id));
    expect(row!.text).toBe(expected);
    const listed = (await staff.get(commentsUrl(shared))).body as CommentPage;
    expect(listed.items[0]!.text).toBe(expected);
  });

  const REFUSED: [string, unknown][] = [
    ['4001 characters', 'a'.repeat(MAX_COMMENT_LENGTH + 1)],
    ['4001 characters outside the basic plane', '🐟'.repeat(MAX_COMMENT_LENGTH + 1)],
    ['a NUL', 'before\u0000after'],
    ['a bell', 'ring\u0007'],
    ['an escape sequence', '\u001b[31mred'],
    ['a C1 control', 'next\u0085line'],
    ['only spaces', '   \n\t '],
    ['a number', 42],
  ];

  it.each(REFUSED)('refuses %s with 422 and stores nothing', async (_what, text) => {
    const shared = await sharedOption(t, 'public');
    const posted = await stakeholder.post(commentsUrl(shared)).send({ text });
    expect(posted.status).toBe(422);
    expect(posted.body.details.join(' ')).toMatch(/text/);
    expect(((await staff.get(commentsUrl(shared))).body as CommentPage).total).toBe(0);
  });

  it('checks anchors against the shared run: known indicators and compartments only', async () => {
    const shared = await sharedOption(t, 'public');
    const post = (anchor: object) => stakeholder.post(commentsUrl(shared)).send({ text: 'About this', anchor });
    const onCatch = await post({ kind: 'indicator', key: 'totalCatch' });
    expect(onCatch.status).toBe(201);
    expect(onCatch.body.anchor).toEqual({ kind: 'indicator', key: 'totalCatch' });
    expect((await post({ kind: 'indicator', key: 'fishingInBalance' })).status).toBe(201);
    expect((await post({ kind: 'compartment', key: 'forage-fish' })).status).toBe(201);
    // a scalar indicator the run's result does not carry, a made-up one, a compartment not in the web
    expect((await post({ kind: 'indicator', key: 'robustness' })).status).toBe(422);
    expect((await post({ kind: 'indicator', key: 'happiness' })).status).toBe(422);
    const unknown = await post({ kind: 'compartment', key: 'kraken' });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error).toContain('kraken');
    expect((await post({ kind: 'fleet', key: 'Purse seine' })).status).toBe(422);
  });

  it('takes replies one level deep', async () => {
    const shared = await sharedOption(t, 'public');
    const top = await stakeholder.post(commentsUrl(shared)).send({ text: 'A question' });
    const reply = await staff.post(commentsUrl(shared)).send({ text: 'An answer', parentId: top.body.id });
    expect(reply.status).toBe(201);
    expect(reply.body.parentId).toBe(top.body.id);
    const deeper = await stakeholder.post(commentsUrl(shared)).send({ text: 'Answering the answer', parentId: reply.body.id });
    expect(deeper.status).toBe(422);
    expect(deeper.body.error).toMatch(/one level/);
    expect((await stakeholder.post(commentsUrl(shared)).send({ text: 'Orphan', parentId: 'no-such-comment' })).status).toBe(422);
    const elsewhere = await sharedOption(t, 'public');
    expect((await stakeholder.post(commentsUrl(elsewhere)).send({ text: 'Wrong option', parentId: top.body.id })).status).toBe(422);
  });
});

describe('editing', () => {
  it('lets the author edit for 15 minutes, nobody else, and logs each post and edit', async () => {
    const shared = await sharedOption(t, 'public');
    const posted = await stakeholder.post(commentsUrl(shared)).send({ text: 'First thougts' });
    expect(posted.body.editable).toBe(true);
    const edited = await stakeholder.patch(`/api/comments/${posted.body.id}`).send({ text: 'First thoughts' });
    expect(edited.status).toBe(200);
    expect(edited.body.text).toBe('First thoughts');
    expect(edited.body.editedAt).toEqual(expect.any(String));
    expect((await council.patch(`/api/comments/${posted.body.id}`).send({ text: 'Not mine' })).status).toBe(403);
    expect((await council.get(commentsUrl(shared))).body.items[0].editable).toBe(false);
    expect((await stakeholder.patch(`/api/comments/${posted.body.id}`).send({ text: 'x'.repeat(MAX_COMMENT_LENGTH + 1) })).status).toBe(422);
    expect((await stakeholder.patch('/api/comments/no-such-comment').send({ text: 'Anything' })).status).toBe(404);

    // sixteen minutes later
    await t.database.db
      .update(comments)
      .set({ createdAt: new Date(Date.now() - 16 * 60 * 1000) })
      .where(eq(comments.id, posted.body.id));
    const late = await stakeholder.patch(`/api/comments/${posted.body.id}`).send({ text: 'Too late' });
    expect(late.status).toBe(403);
    expect(late.body.error).toMatch(/15 minutes/);
    expect((await stakeholder.get(commentsUrl(shared))).body.items[0]).toMatchObject({ text: 'First thoughts', editable: false });
    expect(await auditOf(`comment:${posted.body.id}`)).toEqual(['comment.posted', 'comment.edited']);
  });

  it('refuses an edit once the discussion closed, even within 15 minutes', async () => {
    const shared = await sharedOption(t, 'public');
    const posted = await stakeholder.post(commentsUrl(shared)).send({ text: 'Said in time' });
    await setClosesAt(t, shared.shareId, new Date(Date.now() - 1000));
    const late = await stakeholder.patch(`/api/comments/${posted.body.id}`).send({ text: 'Changed after closing' });
    expect(late.status).toBe(403);
    expect(late.body.error).toMatch(/closed on/);
    expect((await stakeholder.get(commentsUrl(shared))).body.items[0]).toMatchObject({ text: 'Said in time', editable: false });
  });
});

describe('hiding', () => {
  it('shows others a placeholder, the author and staff the text and the reason; logs the reason', async () => {
    const shared = await sharedOption(t, 'public');
    const analyst = shared.baseline.analyst;
    const posted = await stakeholder.post(commentsUrl(shared)).send({ text: 'Something rude', anchor: { kind: 'compartment', key: 'seabirds' } });
    expect((await stakeholder.post(`/api/comments/${posted.body.id}/hide`).send({ reason: 'No' })).status).toBe(403);
    expect((await staff.post(`/api/comments/${posted.body.id}/hide`).send({ reason: '' })).status).toBe(400);

    const hidden = await staff.post(`/api/comments/${posted.body.id}/hide`).send({ reason: 'Personal remarks about a named fisher' });
    expect(hidden.status).toBe(200);
    expect(hidden.body).toMatchObject({ hidden: true, text: 'Something rude', hiddenReason: 'Personal remarks about a named fisher' });
    expect((await staff.post(`/api/comments/${posted.body.id}/hide`).send({ reason: 'Again' })).status).toBe(409);

    const as = async (agent: TestAgent) => ((await agent.get(commentsUrl(shared))).body as CommentPage).items.find((c) => c.id === posted.body.id) as CommentItem;
    for (const other of [council, analyst]) expect(await as(other)).toMatchObject({ hidden: true, text: null, hiddenReason: null, anchor: null });
    expect(await as(stakeholder)).toMatchObject({ hidden: true, text: 'Something rude', hiddenReason: 'Personal remarks about a named fisher', editable: false });
    expect(await as(staff)).toMatchObject({ hidden: true, text: 'Something rude', hiddenReason: 'Personal remarks about a named fisher', anchor: { kind: 'compartment', key: 'seabirds' } });
    // the placeholder still counts
    expect(((await council.get(commentsUrl(shared))).body as CommentPage).total).toBe(1);
    expect((await stakeholder.patch(`/api/comments/${posted.body.id}`).send({ text: 'Something kind' })).status).toBe(409);

    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.subject, `comment:${posted.body.id}`)).orderBy(auditEvents.id);
    expect(events.map((e) => e.action)).toEqual(['comment.posted', 'comment.hidden']);
    expect(events[1]!.detail).toContain('Personal remarks about a named fisher');
    expect(events[1]!.actorId).toBe(await userId(t.database.db, 'staff'));
  });
});

describe('the record', () => {
  it('keeps an option with comments: deleting it is refused even after its share is withdrawn', async () => {
    const shared = await sharedOption(t, 'public');
    expect((await stakeholder.post(commentsUrl(shared)).send({ text: 'On the record' })).status).toBe(201);
    expect((await shared.baseline.analyst.delete(`/api/shares/${shared.shareId}`)).status).toBe(204);
    const refused = await shared.baseline.analyst.delete(`/api/options/${shared.optionId}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toBe('This option has comments from its discussion: it is kept as part of the record');
    expect(await t.database.db.select({ n: count() }).from(comments).where(eq(comments.optionId, shared.optionId))).toEqual([{ n: 1 }]);
  });
});
