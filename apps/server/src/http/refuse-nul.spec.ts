import { eq } from 'drizzle-orm';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { sharedOption, type SharedOption } from '../discussion/test-discussion';
import { comments } from '../db/schema';
import { isUnstorableText } from '../db/postgres-error';

/** U+0000 cannot be stored in PostgreSQL text: every route to the stored data says so with a 400, never a 500. */

let t: TestApp;
let staff: TestAgent;
let shared: SharedOption;
beforeAll(async () => {
  t = await createTestApp();
  staff = await t.signInAs('staff');
  shared = await sharedOption(t, 'public');
}, 60_000);
afterAll(() => t.close());

describe('a NUL character', () => {
  it('in an id of the address or in the query is refused in words before any query', async () => {
    const answers = [
      await staff.get('/api/options/%00/comments'),
      await staff.patch('/api/comments/%00').send({ text: 'x' }),
      await staff.put('/api/options/%00/follow'),
      await staff.get(`/api/options/${shared.optionId}/brief?run=%00`),
      await staff.get('/api/comparisons/brief?runs=%00,b'),
    ];
    for (const answer of answers) {
      expect(answer.status).toBe(400);
      expect(answer.body.error).toMatch(/NUL character/);
    }
  });

  it('in a body field is refused in words (by its schema, or as text the database cannot store), and nothing is stored', async () => {
    const url = `/api/options/${shared.optionId}/comments`;
    const reply = await staff.post(url).send({ text: 'a reply', parentId: 'a\u0000b' });
    expect(reply.status).toBe(400);
    expect(reply.body.error).toMatch(/cannot store \(such as NUL\)/);
    const anchored = await staff.post(url).send({ text: 'about', anchor: { kind: 'indicator', key: 'a\u0000b' } });
    expect(anchored.status).toBe(422);
    expect(anchored.body.details).toContain('anchor.key: anchor.key must not contain control characters');
    const hidden = await staff.post('/api/comments/whatever/hide').send({ reason: 'bad\u0000reason' });
    expect(hidden.status).toBe(400);
    expect(hidden.body.details).toContain('reason: reason must not contain control characters');
    expect(await t.database.db.select().from(comments)).toEqual([]);
  });

  it('other control characters in a hide reason or an anchor are refused by the schema', async () => {
    const posted = await staff.post(`/api/options/${shared.optionId}/comments`).send({ text: 'To be hidden' });
    expect(posted.status).toBe(201);
    const hide = await staff.post(`/api/comments/${posted.body.id}/hide`).send({ reason: 'ring \u0007 the bell' });
    expect(hide.status).toBe(400);
    expect(hide.body.details).toContain('reason: reason must not contain control characters');
    const anchored = await staff.post(`/api/options/${shared.optionId}/comments`).send({ text: 'x', anchor: { kind: 'indicator', key: 'tst\u001b' } });
    expect(anchored.status).toBe(422);
    expect(anchored.body.details).toContain('anchor.key: anchor.key must not contain control characters');
  });

  it('that reaches the database anyway is recognised as text it cannot store (the backstop of the error handler)', async () => {
    const refused = await t.database.db.select().from(comments).where(eq(comments.id, 'nul\u0000id')).then(() => null, (error: unknown) => error);
    expect(isUnstorableText(refused)).toBe(true);
    expect(isUnstorableText(new Error('something else'))).toBe(false);
  });
});
