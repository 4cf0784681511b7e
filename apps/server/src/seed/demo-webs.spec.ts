import { createTestApp, type TestApp } from '../testing/test-app';
import { brannockBay } from '../webs/test-webs';
import { seedDemoWebs } from './demo-webs';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
}, 60_000);
afterEach(async () => {
  await t.close();
});

describe('seedDemoWebs', () => {
  it('creates the Brannock Bay web with its baseline published by the demo analyst, readable by staff', async () => {
    await seedDemoWebs(t.database.db);
    const staff = await t.signInAs('staff');
    const list = (await staff.get('/api/webs')).body;
    expect(list.total).toBe(1);
    expect(list.items[0]).toMatchObject({
      name: brannockBay.name,
      place: 'Brannock Bay (invented)',
      period: '2019–2023 average',
      latestVersion: { number: 1, status: 'published' },
      published: { number: 1, publishedBy: 'Ana Demo (analyst)' },
    });
    const version = (await staff.get(`/api/webs/${list.items[0].id}/versions/${list.items[0].published.id}`)).body;
    expect(version.web).toEqual(brannockBay);
  });
});
