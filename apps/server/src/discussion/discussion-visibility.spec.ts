import { eq } from 'drizzle-orm';
import { auditEvents } from '../db/schema';
import { ROLES, type CommentPage, type Role, type ShareAudience } from '@seinework/contracts';
import { storeRun } from '../options/test-options';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { DAY_MS, RESULT, setClosesAt, share, sharedOption, type SharedOption } from './test-discussion';

/**
 * Who reads and who may post (DEVELOPERS.md, "Discussion"): role × audience × open / closed /
 * withdrawn, on GET /api/options/:id, GET /api/options/:id/comments and POST /api/options/:id/comments;
 * and what stakeholders may read besides (the shared run, its baseline) and may not.
 */

let t: TestApp;
const agents = new Map<Role, TestAgent>();
beforeAll(async () => {
  t = await createTestApp();
  for (const role of ROLES) agents.set(role, await t.signInAs(role));
}, 60_000);
afterAll(() => t.close());

type State = 'open' | 'closed' | 'withdrawn';

/** Who sees an option with one active share of that audience. */
function sees(role: Role, audience: ShareAudience, state: State): boolean {
  if (role === 'admin' || role === 'analyst') return true;
  if (state === 'withdrawn') return false;
  if (role === 'stakeholder') return audience === 'public';
  return true;
}

function postStatus(role: Role, audience: ShareAudience, state: State): number {
  if (!sees(role, audience, state)) return 404;
  return state === 'open' ? 201 : 403;
}

const CASES = (['council', 'public'] as const).flatMap((audience) => (['open', 'closed', 'withdrawn'] as const).map((state) => ({ audience, state })));

describe('the visibility matrix', () => {
  describe.each(CASES)('an option shared for $audience, $state', ({ audience, state }) => {
    let shared: SharedOption;
    beforeAll(async () => {
      shared = await sharedOption(t, audience, new Date(Date.now() + 30 * DAY_MS));
      if (state === 'closed') await setClosesAt(t, shared.shareId, new Date(Date.now() - DAY_MS));
      if (state === 'withdrawn') expect((await shared.baseline.analyst.delete(`/api/shares/${shared.shareId}`)).status).toBe(204);
    }, 60_000);

    it.each(ROLES)('as %s', async (role) => {
      const agent = agents.get(role)!;
      const readable = sees(role, audience, state);
      expect((await agent.get(`/api/options/${shared.optionId}`)).status).toBe(readable ? 200 : 404);
      const listed = await agent.get(`/api/options/${shared.optionId}/comments`);
      expect(listed.status).toBe(readable ? 200 : 404);
      const posted = await agent.post(`/api/options/${shared.optionId}/comments`).send({ text: `A remark by ${role}` });
      expect(posted.status, JSON.stringify(posted.body)).toBe(postStatus(role, audience, state));
      if (posted.status === 403 && state === 'closed') expect(posted.body.error).toMatch(/closed on \d{1,2} \w+ \d{4} at \d\d:\d\d UTC/);
      if (readable) {
        const page = (await agent.get(`/api/options/${shared.optionId}/comments`)).body as CommentPage;
        expect(page.discussion.open).toBe(state === 'open');
        if (state === 'closed') expect(page.discussion.closedReason).toMatch(/closed on/);
        if (posted.status === 201) expect(page.items.map((c) => c.id)).toContain(posted.body.id);
      }
    });
  });
});

describe('what a stakeholder reads', () => {
  it('the publicly shared option, the run its share shows and the baseline it stands on; nothing else', async () => {
    const stakeholder = agents.get('stakeholder')!;
    const shared = await sharedOption(t, 'public');
    const { webId, versionId } = shared.baseline;
    const laterRun = await storeRun(t.database.db, shared.optionId, RESULT);
    expect((await stakeholder.get(`/api/runs/${shared.runId}`)).status).toBe(200);
    expect((await stakeholder.get(`/api/runs/${laterRun}`)).status).toBe(404);
    const detail = (await stakeholder.get(`/api/options/${shared.optionId}`)).body;
    expect(detail.latestRun.id).toBe(shared.runId);
    expect(detail.shares.map((s: { audience: string }) => s.audience)).toEqual(['public']);
    expect((await stakeholder.get(`/api/webs/${webId}/versions/${versionId}`)).status).toBe(200);
    // the other web routes stay closed to stakeholders (403), whatever is shared
    expect((await stakeholder.get('/api/webs')).status).toBe(403);
    expect((await stakeholder.get(`/api/webs/${webId}`)).status).toBe(403);
    expect((await stakeholder.get(`/api/webs/${webId}/versions/${versionId}/analysis`)).status).toBe(403);
    expect((await stakeholder.get(`/api/options/${shared.optionId}/runs`)).status).toBe(403);

    // an option shared only for council review on the same baseline: not theirs
    const councilOnly = await sharedOption(t, 'council', null, shared.baseline);
    expect((await stakeholder.get(`/api/options/${councilOnly.optionId}`)).status).toBe(404);
    expect((await stakeholder.get(`/api/runs/${councilOnly.runId}`)).status).toBe(404);

    // withdrawn: 404 again, the baseline included
    expect((await shared.baseline.analyst.delete(`/api/shares/${shared.shareId}`)).status).toBe(204);
    expect((await stakeholder.get(`/api/options/${shared.optionId}`)).status).toBe(404);
    expect((await stakeholder.get(`/api/runs/${shared.runId}`)).status).toBe(404);
    expect((await stakeholder.get(`/api/webs/${webId}/versions/${versionId}`)).status).toBe(404);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.subject, `option:${shared.optionId}`)).orderBy(auditEvents.id);
    expect(events.map((e) => [e.action, /for public comment|Public comment on/.test(e.detail)])).toEqual([
      ['option.created', false],
      ['option.shared', true],
      ['option.share-withdrawn', true],
    ]);
  });

  it('a baseline with no public option is 404 to a stakeholder; council members read the baseline of a public option', async () => {
    const stakeholder = agents.get('stakeholder')!;
    const council = agents.get('council')!;
    const shared = await sharedOption(t, 'public');
    const other = await sharedOption(t, 'council');
    expect((await stakeholder.get(`/api/webs/${other.baseline.webId}/versions/${other.baseline.versionId}`)).status).toBe(404);
    expect((await council.get(`/api/webs/${shared.baseline.webId}/versions/${shared.baseline.versionId}`)).status).toBe(200);
  });
});

describe('two discussions on one option', () => {
  it("keeps the council's discussion from stakeholders; council members join the public one with audience", async () => {
    const shared = await sharedOption(t, 'council');
    await share(shared.baseline, shared.optionId, 'public', new Date(Date.now() + 7 * DAY_MS));
    const [council, stakeholder, staff] = [agents.get('council')!, agents.get('stakeholder')!, agents.get('staff')!];
    const url = `/api/options/${shared.optionId}/comments`;
    const internal = await council.post(url).send({ text: 'For the council only' });
    expect(internal.body.audience).toBe('council');
    const outside = await stakeholder.post(url).send({ text: 'From the harbour' });
    expect(outside.body.audience).toBe('public');
    const answer = await council.post(url).send({ text: 'Thank you', audience: 'public' });
    expect(answer.status).toBe(201);
    expect(answer.body.audience).toBe('public');

    const seenByStakeholder = (await stakeholder.get(url)).body as CommentPage;
    expect(seenByStakeholder.items.map((c) => c.text)).toEqual(['From the harbour', 'Thank you']);
    expect(seenByStakeholder.total).toBe(2);
    expect(((await staff.get(url)).body as CommentPage).total).toBe(3);
    // a stakeholder cannot reply into the council's discussion, nor name it
    expect((await stakeholder.post(url).send({ text: 'Sneaking in', parentId: internal.body.id })).status).toBe(422);
    expect((await stakeholder.post(url).send({ text: 'Sneaking in', audience: 'council' })).status).toBe(403);
    // a reply joins its parent's discussion
    const reply = await council.post(url).send({ text: 'Noted', parentId: outside.body.id });
    expect(reply.body.audience).toBe('public');

    const discussions = (await stakeholder.get('/api/discussions')).body.items as { optionId: string; audience: string; comments: number; open: boolean }[];
    expect(discussions.filter((d) => d.optionId === shared.optionId)).toEqual([expect.objectContaining({ audience: 'public', comments: 3, open: true })]);
    const councils = (await council.get('/api/discussions')).body.items as { optionId: string; audience: string; comments: number }[];
    expect(councils.filter((d) => d.optionId === shared.optionId).map((d) => [d.audience, d.comments]).sort()).toEqual([
      ['council', 1],
      ['public', 3],
    ]);
  });
});
