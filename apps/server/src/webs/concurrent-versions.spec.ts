import { createTestApp, type TestApp } from '../testing/test-app';
import { tinyWeb } from './test-webs';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
}, 60_000);
afterEach(async () => {
  await t.close();
});

describe('saving versions at the same time', () => {
  it('keeps all of 50 concurrent saves on one web, numbered 2 to 51 without gaps or repeats', async () => {
    const analyst = await t.signInAs('analyst');
    const created = await analyst.post('/api/webs').send(tinyWeb());
    const saves = await Promise.all(Array.from({ length: 50 }, (_, k) => analyst.post(`/api/webs/${created.body.id}/versions`).send({ web: tinyWeb(), note: `save ${k}` })));
    expect(saves.map((r) => r.status)).toEqual(new Array(50).fill(201));
    expect(new Set(saves.map((r) => r.body.versionId)).size).toBe(50);
    const versions = (await analyst.get(`/api/webs/${created.body.id}`)).body.versions as { number: number; note: string }[];
    expect(versions.map((v) => v.number).sort((a, b) => a - b)).toEqual(Array.from({ length: 51 }, (_, k) => k + 1));
    expect(new Set(versions.map((v) => v.note))).toEqual(new Set(['', ...Array.from({ length: 50 }, (_, k) => `save ${k}`)]));
  });
});
