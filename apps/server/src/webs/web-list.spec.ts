import type { WebSummary } from '@seinework/contracts';
import { createTestApp, type TestApp } from '../testing/test-app';
import { tinyWeb } from './test-webs';

/** The list of webs in one query (web-service.ts): what each role sees of a web's versions. */

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 60_000);
afterAll(() => t.close());

it('shows each web with its latest visible version and its newest published one, per role', async () => {
  const analyst = await t.signInAs('analyst');
  const staff = await t.signInAs('staff');
  const council = await t.signInAs('council');
  const draftOnly = (await analyst.post('/api/webs?place=Draft%20cove').send({ ...tinyWeb(), name: 'Draft only' })).body as { id: string; versionId: string };
  const both = (await analyst.post('/api/webs?place=Both%20cove').send({ ...tinyWeb(), name: 'Published then edited' })).body as { id: string; versionId: string };
  expect((await analyst.post(`/api/webs/${both.id}/versions/${both.versionId}/publish`)).status).toBe(200);
  const second = (await analyst.post(`/api/webs/${both.id}/versions`).send({ web: tinyWeb(), note: 'second', basedOn: both.versionId })).body as { versionId: string };

  const listed = async (agent: typeof analyst, query = '') => ((await agent.get(`/api/webs?sort=name&direction=asc${query}`)).body as { items: WebSummary[]; total: number });
  const mine = await listed(analyst);
  const byName = (items: WebSummary[], name: string) => items.find((w) => w.name === name);
  expect(byName(mine.items, 'Draft only')).toMatchObject({ id: draftOnly.id, place: 'Draft cove', latestVersion: { id: draftOnly.versionId, number: 1, status: 'draft' }, published: null });
  expect(byName(mine.items, 'Published then edited')).toMatchObject({
    latestVersion: { id: second.versionId, number: 2, status: 'draft' },
    published: { id: both.versionId, number: 1, publishedBy: 'Ana Demo (analyst)' },
  });
  const published = byName(mine.items, 'Published then edited')!.published!;
  expect(new Date(published.publishedAt).toISOString()).toBe(published.publishedAt);

  // staff never see a draft: the web with none published is not listed, the other shows its published version as its latest
  const theirs = await listed(staff);
  expect(theirs.items.map((w) => w.name)).not.toContain('Draft only');
  expect(byName(theirs.items, 'Published then edited')).toMatchObject({ latestVersion: { id: both.versionId, number: 1, status: 'published' } });
  expect(theirs.total).toBe(theirs.items.length);
  // council members only see baselines with an option shared with them: none of these
  expect((await listed(council)).items.map((w) => w.id)).not.toContain(both.id);

  // the status filter is on the latest version the person may see
  expect((await listed(analyst, '&status=draft')).items.map((w) => w.name)).toEqual(expect.arrayContaining(['Draft only', 'Published then edited']));
  expect((await listed(analyst, '&status=published')).items.map((w) => w.name)).not.toContain('Published then edited');
  expect((await listed(staff, '&status=published')).items.map((w) => w.name)).toContain('Published then edited');

  // a page past the end still tells the total
  const past = await listed(analyst, '&pageSize=1&page=99');
  expect(past).toEqual({ items: [], total: mine.total });
});
