import { eq, sql } from 'drizzle-orm';
import { versionFlows, webVersions } from '../db/schema';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { tinyWeb } from './test-webs';

/** A published version never changes: no route changes one, and the database refuses it too. */

let t: TestApp;
let analyst: TestAgent;
let address: string;
let versionId: string;
beforeEach(async () => {
  t = await createTestApp();
  analyst = await t.signInAs('analyst');
  const created = await analyst.post('/api/webs').send(tinyWeb());
  address = `/api/webs/${created.body.id}`;
  versionId = created.body.versionId;
  expect((await analyst.post(`${address}/versions/${versionId}/publish`)).status).toBe(200);
}, 60_000);
afterEach(async () => {
  await t.close();
});

describe('a published version', () => {
  it('is unchanged by every route that writes', async () => {
    const before = (await analyst.get(`${address}/versions/${versionId}`)).body;
    const admin = await t.signInAs('admin');
    const attempts = [
      await analyst.post(`${address}/versions/${versionId}/publish`),
      await admin.post(`${address}/versions/${versionId}/publish`),
      await analyst.post(`${address}/versions`).send({ web: tinyWeb(5), basedOn: versionId }),
      await analyst.post(`${address}/versions/${versionId}/clone`).send({ name: 'Copy' }),
      await analyst.put(`${address}/versions/${versionId}`).send({ web: tinyWeb(5) }),
      await analyst.patch(`${address}/versions/${versionId}`).send({ note: 'changed' }),
      await analyst.delete(`${address}/versions/${versionId}`),
      await analyst.post('/api/webs/balance').send({ web: tinyWeb(5) }),
    ];
    expect(attempts.map((r) => r.status)).toEqual([409, 409, 201, 201, 404, 404, 404, 200]);
    expect((await analyst.get(`${address}/versions/${versionId}`)).body).toEqual(before);
  });

  it('cannot be changed in the database either', async () => {
    const { db } = t.database;
    await expect(db.update(webVersions).set({ note: 'edited behind the server' }).where(eq(webVersions.id, versionId))).rejects.toThrow();
    await expect(db.update(versionFlows).set({ value: 99 }).where(eq(versionFlows.versionId, versionId))).rejects.toThrow();
    await expect(db.insert(versionFlows).values({ versionId, position: 5, fromId: 'fish', toId: 'algae', value: 1 })).rejects.toThrow();
    await expect(db.delete(versionFlows).where(eq(versionFlows.versionId, versionId))).rejects.toThrow();
    await expect(db.delete(webVersions).where(eq(webVersions.id, versionId))).rejects.toThrow();
    await expect(db.execute(sql`update web_versions set status = 'draft', published_at = null, published_by = null where id = ${versionId}`)).rejects.toThrow();
    expect((await analyst.get(`${address}/versions/${versionId}`)).body).toMatchObject({ status: 'published', note: '', web: tinyWeb() });
  });

  it('leaves drafts open to the database (the trigger guards published versions only)', async () => {
    const draft = await analyst.post(`${address}/versions`).send({ web: tinyWeb() });
    await t.database.db.update(versionFlows).set({ value: 11 }).where(eq(versionFlows.versionId, draft.body.versionId));
    expect((await analyst.get(`${address}/versions/${draft.body.versionId}`)).body.web.flows[0].value).toBe(11);
  });
});
