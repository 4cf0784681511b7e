import { count } from 'drizzle-orm';
import type { VersionDetail, WebDetail, WebSummary } from '@seinework/contracts';
import { auditEvents } from '../db/schema';
import { createTestApp, type TestApp } from '../testing/test-app';
import { brannockBay, tinyWeb } from './test-webs';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
}, 60_000);
afterEach(async () => {
  await t.close();
});

async function createWeb(web: object = tinyWeb(), query = '?place=Tiny%20Bay&period=2020') {
  const analyst = await t.signInAs('analyst');
  const response = await analyst.post(`/api/webs${query}`).send(web);
  expect(response.status).toBe(201);
  return { analyst, id: response.body.id as string, versionId: response.body.versionId as string };
}

describe('webs and versions', () => {
  it('creates a web from WEB.json with a first draft version that reads back unchanged', async () => {
    const { analyst, id, versionId } = await createWeb(brannockBay);
    const version = await analyst.get(`/api/webs/${id}/versions/${versionId}`);
    expect(version.status).toBe(200);
    const body = version.body as VersionDetail;
    expect(body).toMatchObject({ id: versionId, webId: id, number: 1, status: 'draft', createdBy: 'Ana Demo (analyst)', publishedBy: null, basedOn: null });
    expect(body.web).toEqual(brannockBay);
    const detail = (await analyst.get(`/api/webs/${id}`)).body as WebDetail;
    expect(detail).toMatchObject({ id, name: brannockBay.name, place: 'Tiny Bay', period: '2020', unit: brannockBay.unit });
    expect(detail.versions.map((v) => v.number)).toEqual([1]);
  });

  it('refuses a web the engine refuses, with its problems, storing nothing', async () => {
    const analyst = await t.signInAs('analyst');
    const before = await t.database.db.select({ n: count() }).from(auditEvents);
    const bad = { ...tinyWeb(), flows: [{ from: 'algae', to: 'shark', value: 1 }] };
    const response = await analyst.post('/api/webs').send(bad);
    expect(response.status).toBe(422);
    expect(response.body.details).toEqual(['flows[0]: unknown compartment "shark"']);
    expect((await analyst.post('/api/webs').send({ ...tinyWeb(), extra: 1 })).status).toBe(422);
    expect((await analyst.post('/api/webs?colour=red').send(tinyWeb())).status).toBe(400);
    expect((await analyst.get('/api/webs')).body.total).toBe(0);
    expect(await t.database.db.select({ n: count() }).from(auditEvents)).toEqual(before);
  });

  it('publishes a balanced version once; staff then see it, and never a draft', async () => {
    const { analyst, id, versionId } = await createWeb();
    // staff read every published baseline (council only those with an option shared with them)
    const staff = await t.signInAs('staff');
    expect((await staff.get(`/api/webs/${id}`)).status).toBe(404);
    expect((await staff.get(`/api/webs/${id}/versions/${versionId}`)).status).toBe(404);
    expect((await staff.get('/api/webs')).body).toEqual({ items: [], total: 0 });

    const published = await analyst.post(`/api/webs/${id}/versions/${versionId}/publish`);
    expect(published.status).toBe(200);
    expect(published.body).toMatchObject({ status: 'published', publishedBy: 'Ana Demo (analyst)' });
    expect((await analyst.post(`/api/webs/${id}/versions/${versionId}/publish`)).status).toBe(409);

    const draft = await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb(5), note: 'fish respiration revised', basedOn: versionId });
    expect(draft.status).toBe(201);
    const detail = (await staff.get(`/api/webs/${id}`)).body as WebDetail;
    expect(detail.versions.map((v) => [v.number, v.status])).toEqual([[1, 'published']]);
    expect((await staff.get(`/api/webs/${id}/versions/${draft.body.versionId}`)).status).toBe(404);
    const list = (await staff.get('/api/webs')).body as { items: WebSummary[]; total: number };
    expect(list.total).toBe(1);
    expect(list.items[0]).toMatchObject({ latestVersion: { number: 1, status: 'published' }, published: { number: 1, publishedBy: 'Ana Demo (analyst)' } });
    const analystList = (await analyst.get('/api/webs')).body as { items: WebSummary[] };
    expect(analystList.items[0].latestVersion).toMatchObject({ number: 2, status: 'draft' });
  });

  it('refuses to publish an unbalanced version, naming its compartments', async () => {
    const { analyst, id, versionId } = await createWeb(tinyWeb(5));
    const response = await analyst.post(`/api/webs/${id}/versions/${versionId}/publish`);
    expect(response.status).toBe(422);
    expect(response.body.error).toMatch(/not balanced \(fish\)/);
    expect(response.body.details).toEqual(['compartment "fish" is unbalanced: inputs 10 and outputs 9 differ by 1']);
    expect((await analyst.get(`/api/webs/${id}/versions/${versionId}`)).body.status).toBe('draft');
  });

  it('numbers versions in order and checks basedOn', async () => {
    const { analyst, id, versionId } = await createWeb();
    const second = await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb(), basedOn: versionId });
    const third = await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb() });
    expect([second.status, third.status]).toEqual([201, 201]);
    const detail = (await analyst.get(`/api/webs/${id}`)).body as WebDetail;
    expect(detail.versions.map((v) => [v.number, v.basedOn])).toEqual([
      [3, null],
      [2, versionId],
      [1, null],
    ]);
    expect((await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb(), basedOn: 'nope' })).status).toBe(422);
    expect((await analyst.post(`/api/webs/nope/versions`).send({ web: tinyWeb() })).status).toBe(404);
    expect((await analyst.post(`/api/webs/${id}/versions`).send({ web: { name: 'x' } })).status).toBe(422);
  });

  it('clones a version into a new web whose first draft is based on it', async () => {
    const { analyst, id, versionId } = await createWeb();
    const clone = await analyst.post(`/api/webs/${id}/versions/${versionId}/clone`).send({ name: 'Tiny bay, 2021' });
    expect(clone.status).toBe(201);
    const version = (await analyst.get(`/api/webs/${clone.body.id}/versions/${clone.body.versionId}`)).body as VersionDetail;
    expect(version).toMatchObject({ number: 1, status: 'draft', basedOn: versionId });
    expect(version.web).toEqual({ ...tinyWeb(), name: 'Tiny bay, 2021' });
    const detail = (await analyst.get(`/api/webs/${clone.body.id}`)).body as WebDetail;
    expect(detail).toMatchObject({ name: 'Tiny bay, 2021', place: 'Tiny Bay', period: '2020' });
    expect((await analyst.post(`/api/webs/${id}/versions/${versionId}/clone`).send({ name: '' })).status).toBe(400);
  });

  it('lists with paging, sorting and a filter on name or place', async () => {
    const analyst = await t.signInAs('analyst');
    for (const [name, place] of [
      ['Bravo', 'North sound'],
      ['alpha', 'South bay'],
      ['Charlie', 'Bay of 100%'],
    ]) {
      expect((await analyst.post(`/api/webs?place=${encodeURIComponent(place)}`).send({ ...tinyWeb(), name })).status).toBe(201);
    }
    const names = async (query: string) => ((await analyst.get(`/api/webs?${query}`)).body.items as WebSummary[]).map((w) => w.name);
    expect(await names('sort=name&direction=asc')).toEqual(['alpha', 'Bravo', 'Charlie']);
    expect(await names('sort=place&direction=desc')).toEqual(['alpha', 'Bravo', 'Charlie']);
    expect(await names('filter=bay&sort=name&direction=asc')).toEqual(['alpha', 'Charlie']);
    expect(await names('filter=100%25')).toEqual(['Charlie']);
    const page = (await analyst.get('/api/webs?pageSize=2&page=2&sort=name&direction=asc')).body;
    expect(page.total).toBe(3);
    expect(page.items.map((w: WebSummary) => w.name)).toEqual(['Charlie']);
    expect(await names('status=published')).toEqual([]);
    expect((await analyst.get('/api/webs?pageSize=500')).status).toBe(400);
    expect((await analyst.get('/api/webs?sort=colour')).status).toBe(400);
  });

  it('exports a version as WEB.json, CSV and XLSX', async () => {
    const { analyst, id, versionId } = await createWeb();
    const json = await analyst.get(`/api/webs/${id}/versions/${versionId}/export?format=json`);
    expect(json.status).toBe(200);
    expect(json.headers['content-disposition']).toBe('attachment; filename=tiny-bay-v1.json');
    expect(JSON.parse(json.text)).toEqual(tinyWeb());
    const csv = await analyst.get(`/api/webs/${id}/versions/${versionId}/export?format=csv`);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.text).toContain('web,place,Tiny Bay');
    const xlsx = await analyst.get(`/api/webs/${id}/versions/${versionId}/export?format=xlsx`).buffer(true);
    expect(xlsx.headers['content-type']).toMatch(/spreadsheetml/);
    expect((await analyst.get(`/api/webs/${id}/versions/${versionId}/export?format=pdf`)).status).toBe(400);
  });

  it('analyses a version once and keeps the analysis; an unbalanced draft is refused', async () => {
    const { analyst, id, versionId } = await createWeb();
    const first = await analyst.get(`/api/webs/${id}/versions/${versionId}/analysis`);
    expect(first.status).toBe(200);
    expect(first.body.totalCatch).toBeCloseTo(4, 10);
    const direct = await analyst.post('/api/analyses').send(tinyWeb());
    expect(first.body.tst).toBe(direct.body.tst);
    expect((await analyst.get(`/api/webs/${id}/versions/${versionId}/analysis`)).body).toEqual(first.body);
    const unbalanced = await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb(5) });
    expect((await analyst.get(`/api/webs/${id}/versions/${unbalanced.body.versionId}/analysis`)).status).toBe(422);
  });

  it('previews a balancing with every changed number, storing nothing', async () => {
    const analyst = await t.signInAs('analyst');
    const response = await analyst.post('/api/webs/balance').send({ web: tinyWeb(5), method: 'output' });
    expect(response.status).toBe(200);
    expect(response.body.wasBalanced).toBe(false);
    expect(response.body.changes.length).toBeGreaterThan(0);
    for (const change of response.body.changes) expect(change.before).not.toBe(change.after);
    const unchanged = await analyst.post('/api/webs/balance').send({ web: tinyWeb() });
    expect(unchanged.body).toMatchObject({ method: 'least-change', wasBalanced: true, changes: [] });
    expect((await analyst.post('/api/webs/balance').send({ web: tinyWeb(), method: 'magic' })).status).toBe(400);
    expect((await analyst.get('/api/webs')).body.total).toBe(0);
  });

  it('writes an audit event for every change', async () => {
    const { analyst, id, versionId } = await createWeb();
    await analyst.post(`/api/webs/${id}/versions/${versionId}/publish`);
    await analyst.post(`/api/webs/${id}/versions`).send({ web: tinyWeb() });
    await analyst.post(`/api/webs/${id}/versions/${versionId}/clone`).send({ name: 'Copy' });
    const admin = await t.signInAs('admin');
    const audit = (await admin.get('/api/admin/audit?pageSize=10')).body.items.map((e: { action: string }) => e.action);
    expect(audit.filter((a: string) => a.startsWith('web.'))).toEqual(['web.cloned', 'web.version-created', 'web.published', 'web.created']);
  });
});
