import { eq } from 'drizzle-orm';
import type { Comparison, OptionSummary } from '@seinework/contracts';
import { optionUncertainty } from '@seinework/harvest-options';
import { options, runs } from '../db/schema';
import { createTestApp, type TestApp } from '../testing/test-app';
import { brannockBay } from '../webs/test-webs';
import { runQueueOf } from '../runs/run-queue';
import { seedDemoOptions } from './demo-options';
import { seedDemoWebs } from './demo-webs';

let t: TestApp;
beforeEach(async () => {
  t = await createTestApp();
}, 60_000);
afterEach(() => t.close());

/** Few draws keep the test quick; the start-up seed draws 500. */
const FEW_DRAWS = { draws: 12, cv: 0.25, seed: 20261202 };

describe('demo harvest options', () => {
  it('seeds five options on the demo baseline with queued runs that the run queue computes, and shares three for council review, one of them for public comment too', async () => {
    // in one transaction, as seedDemo does on a first start
    await t.database.db.transaction(async (tx) => {
      await seedDemoWebs(tx);
      await seedDemoOptions(tx, FEW_DRAWS);
    });
    expect((await t.database.db.select().from(runs)).map((r) => r.status)).toEqual(['queued', 'queued', 'queued', 'queued', 'queued']);
    expect(await runQueueOf(t.app).drain()).toBe(5);

    const stored = await t.database.db.select().from(runs).innerJoin(options, eq(options.id, runs.optionId));
    for (const { runs: run, options: option } of stored) {
      expect(run).toMatchObject({ status: 'done', error: null, draws: 12, cv: 0.25, seed: 20261202 });
      expect(run.inputs).toEqual({ webId: option.webId, versionId: option.versionId, option: { name: option.name, response: option.response, adjustments: option.adjustments }, uncertainty: FEW_DRAWS });
      // the seeded inputs are the option's own: its draws, redone here, give the stored bands
      const expected = await optionUncertainty(brannockBay, option, FEW_DRAWS);
      expect((run.result as { uncertainty: unknown }).uncertainty).toEqual(JSON.parse(JSON.stringify(expected)));
    }

    const analyst = await t.signInAs('analyst');
    const council = await t.signInAs('council');
    const webs = (await council.get('/api/webs')).body;
    expect(webs.total).toBe(1);
    const base = `/api/webs/${webs.items[0].id}/versions/${webs.items[0].published.id}/options`;
    const all = (await analyst.get(base)).body as { items: OptionSummary[] };
    expect(all.items.map((o) => o.name)).toEqual([
      'Cut the forage-fish quota by 40 %',
      'Close the set-gillnet fleet',
      'Open a dredge fishery on filter feeders',
      'Raise the mid-water predator quota by 25 %',
      'A poorer phytoplankton year (production −15 %)',
    ]);
    expect(all.items.every((o) => o.frozen && o.latestRun?.status === 'done' && o.purpose.length > 0)).toBe(true);
    const shared = (await council.get(base)).body as { items: OptionSummary[] };
    expect(shared.items.map((o) => [o.name, o.shares.map((s) => s.audience)])).toEqual([
      ['Cut the forage-fish quota by 40 %', ['council', 'public']],
      ['Close the set-gillnet fleet', ['council']],
      ['Raise the mid-water predator quota by 25 %', ['council']],
    ]);
    const councilComparison = await council.get(`/api/comparisons?runs=${shared.items.map((o) => o.latestRun!.id).join(',')}`);
    expect(councilComparison.status).toBe(200);

    const comparison = (await analyst.get(`/api/comparisons?runs=${all.items.map((o) => o.latestRun!.id).join(',')}`)).body as Comparison;
    expect(comparison.runs).toHaveLength(5);
    const totalCatch = comparison.indicators.find((i) => i.key === 'totalCatch')!;
    expect(totalCatch.values.every((v) => v.band !== null)).toBe(true);
    // the forage-fish cut lands less in every draw
    expect(totalCatch.values[0]).toMatchObject({ exceedsUncertainty: true });
    expect(totalCatch.values[0]!.difference).toBeLessThan(0);
  }, 120_000);
});
