import { count, eq, like } from 'drizzle-orm';
import type { OptionDetail, OptionPreview, OptionSummary } from '@seinework/contracts';
import { auditEvents, options, runs } from '../db/schema';
import { createTestApp, type TestApp } from '../testing/test-app';
import { brannockBay } from '../webs/test-webs';
import { createOption, forageCut, gillnetClosure, publishedBaseline, shareForCouncil, storeRun } from './test-options';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 60_000);
afterAll(() => t.close());

const optionRows = async () => (await t.database.db.select({ n: count() }).from(options))[0]!.n;
const auditCount = async (action: string) => (await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.action, action)))[0]!.n;

/** A catch the forage fish cannot supply, as the second adjustment. */
const beyondSupply = {
  name: 'Too much forage fish',
  response: 'bottom-up',
  adjustments: [
    { type: 'close-fleet', fleet: 'Set gillnet' },
    { type: 'set-catch', fleet: 'Purse seine', compartment: 'forage-fish', amount: 1e6 },
  ],
};

describe('creating options', () => {
  it('stores an option on a published version, reads it back and audits it', async () => {
    const baseline = await publishedBaseline(t);
    const before = await auditCount('option.created');
    const created = await baseline.analyst.post(baseline.base).send({ ...forageCut, purpose: 'Leave more forage fish for seabirds', uncertainty: { draws: 500, cv: 0.25, seed: 7 } });
    expect(created.status).toBe(201);
    const detail = (await baseline.analyst.get(`/api/options/${created.body.id}`)).body as OptionDetail;
    expect(detail).toMatchObject({
      id: created.body.id,
      webId: baseline.webId,
      versionId: baseline.versionId,
      name: forageCut.name,
      purpose: 'Leave more forage fish for seabirds',
      response: 'bottom-up',
      adjustments: 1,
      frozen: false,
      createdBy: 'Ana Demo (analyst)',
      latestRun: null,
      shares: [],
    });
    expect(detail.option).toEqual({ ...forageCut, uncertainty: { draws: 500, cv: 0.25, seed: 7 } });
    expect(await auditCount('option.created')).toBe(before + 1);
  });

  it('refuses a draft version with 409 and a missing one with 404, storing nothing', async () => {
    const analyst = await t.signInAs('analyst');
    const draft = await analyst.post('/api/webs').send(brannockBay);
    const before = await optionRows();
    const refused = await analyst.post(`/api/webs/${draft.body.id}/versions/${draft.body.versionId}/options`).send(forageCut);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/draft/);
    expect((await analyst.post(`/api/webs/${draft.body.id}/versions/no-such-version/options`).send(forageCut)).status).toBe(404);
    expect(await optionRows()).toBe(before);
  });

  it('answers 422 naming the adjustment the engine refuses, storing nothing and auditing nothing', async () => {
    const baseline = await publishedBaseline(t);
    const [rowsBefore, auditBefore] = [await optionRows(), await auditCount('option.created')];
    const refused = await baseline.analyst.post(baseline.base).send(beyondSupply);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toContain('adjustments[1]');
    const details = refused.body.details as { adjustment: number | null; problem: string }[];
    expect(details).toContainEqual({ adjustment: 1, problem: expect.stringMatching(/^adjustments\[1\] \(set-catch fleet "Purse seine" on "forage-fish" to 1000000\): /) });
    // catches held at their baseline are named too, against no adjustment
    for (const detail of details) expect(detail.adjustment === null ? !detail.problem.startsWith('adjustments[') : detail.problem.startsWith(`adjustments[${detail.adjustment}]`)).toBe(true);
    const unknownFleet = await baseline.analyst.post(baseline.base).send({ ...forageCut, adjustments: [{ type: 'close-fleet', fleet: 'Longline' }] });
    expect(unknownFleet.status).toBe(422);
    expect(unknownFleet.body.details[0]).toMatchObject({ adjustment: 0, problem: expect.stringContaining('Longline') });
    expect([await optionRows(), await auditCount('option.created')]).toEqual([rowsBefore, auditBefore]);
  });

  it('answers 400 for a body that is not OPTION.json, each problem against its adjustment', async () => {
    const baseline = await publishedBaseline(t);
    const before = await optionRows();
    const bad = await baseline.analyst.post(baseline.base).send({ ...forageCut, adjustments: [forageCut.adjustments[0], { type: 'scale-catch', fleet: 'Purse seine', compartment: 'forage-fish', percent: -140 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual([{ adjustment: 1, problem: expect.stringMatching(/^adjustments\.1\.percent: percent must not be below -100/) }]);
    expect((await baseline.analyst.post(baseline.base).send({ ...forageCut, colour: 'red' })).status).toBe(400);
    expect((await baseline.analyst.post(baseline.base).send([forageCut])).status).toBe(400);
    expect((await baseline.analyst.post(baseline.base)).status).toBe(400);
    expect(await optionRows()).toBe(before);
  });
});

describe('listing, editing, duplicating and deleting', () => {
  it('lists the options of a version with their latest run and shares', async () => {
    const baseline = await publishedBaseline(t);
    const first = await createOption(baseline, forageCut);
    const second = await createOption(baseline, gillnetClosure);
    const runId = await storeRun(t.database.db, second, { baseline: {}, option: {}, difference: {} });
    const list = (await baseline.analyst.get(baseline.base)).body as { items: OptionSummary[]; total: number };
    expect(list.total).toBe(2);
    expect(list.items.map((o) => [o.id, o.frozen, o.latestRun?.id ?? null])).toEqual([
      [first, false, null],
      [second, true, runId],
    ]);
    expect(list.items[1]!.latestRun).toMatchObject({ status: 'done', optionId: second, createdBy: 'Ana Demo (analyst)' });
  });

  it('edits an option without runs, and refuses with 409 once it has one', async () => {
    const baseline = await publishedBaseline(t);
    const id = await createOption(baseline);
    const edited = await baseline.analyst.put(`/api/options/${id}`).send({ ...forageCut, name: 'Cut by a third', adjustments: [{ ...forageCut.adjustments[0], percent: -33 }] });
    expect(edited.status).toBe(200);
    expect(edited.body.option).toMatchObject({ name: 'Cut by a third', adjustments: [{ percent: -33 }] });
    expect((await baseline.analyst.put(`/api/options/${id}`).send(beyondSupply)).status).toBe(422);
    await storeRun(t.database.db, id, {});
    const frozen = await baseline.analyst.put(`/api/options/${id}`).send(forageCut);
    expect(frozen.status).toBe(409);
    expect(frozen.body.error).toBe('This option has runs; duplicate it to change it');
    expect((await baseline.analyst.get(`/api/options/${id}`)).body.name).toBe('Cut by a third');
    expect((await baseline.analyst.put('/api/options/no-such-option').send(forageCut)).status).toBe(404);
  });

  it('duplicates a frozen option into a new one that can be edited', async () => {
    const baseline = await publishedBaseline(t);
    const id = await createOption(baseline);
    await storeRun(t.database.db, id, {});
    const before = await auditCount('option.duplicated');
    const copy = await baseline.analyst.post(`/api/options/${id}/duplicate`);
    expect(copy.status).toBe(201);
    const detail = (await baseline.analyst.get(`/api/options/${copy.body.id}`)).body as OptionDetail;
    expect(detail).toMatchObject({ name: `${forageCut.name} (copy)`, frozen: false, versionId: baseline.versionId, latestRun: null });
    expect(detail.option.adjustments).toEqual(forageCut.adjustments);
    expect((await baseline.analyst.post(`/api/options/${id}/duplicate`).send({ name: 'Named copy' })).status).toBe(201);
    expect((await baseline.analyst.put(`/api/options/${copy.body.id}`).send({ ...forageCut, name: 'Changed copy' })).status).toBe(200);
    expect(await auditCount('option.duplicated')).toBe(before + 2);
  });

  it('deletes an option with its runs, but not while shared or running', async () => {
    const baseline = await publishedBaseline(t);
    const shared = await createOption(baseline);
    const { shareId } = await shareForCouncil(t, baseline, shared);
    expect((await baseline.analyst.delete(`/api/options/${shared}`)).status).toBe(409);
    expect((await baseline.analyst.delete(`/api/shares/${shareId}`)).status).toBe(204);
    const deleted = await baseline.analyst.delete(`/api/options/${shared}`);
    expect(deleted.status).toBe(204);
    expect((await baseline.analyst.get(`/api/options/${shared}`)).status).toBe(404);
    expect(await t.database.db.select().from(runs).where(eq(runs.optionId, shared))).toEqual([]);

    const running = await createOption(baseline);
    await storeRun(t.database.db, running, null, 'running');
    expect((await baseline.analyst.delete(`/api/options/${running}`)).status).toBe(409);
    expect((await baseline.analyst.delete('/api/options/no-such-option')).status).toBe(404);
    const audited = await t.database.db.select().from(auditEvents).where(like(auditEvents.subject, `option:${shared}`)).orderBy(auditEvents.id);
    expect(audited.map((e) => e.action)).toEqual(['option.created', 'option.shared', 'option.share-withdrawn', 'option.deleted']);
  });
});

describe('preview', () => {
  it('answers the deterministic run in brief and stores nothing', async () => {
    const baseline = await publishedBaseline(t);
    const before = await optionRows();
    const response = await baseline.analyst.post(`${baseline.base}/preview`).send(forageCut);
    expect(response.status).toBe(200);
    const preview = response.body as OptionPreview;
    const totalCatch = preview.indicators.find((i) => i.key === 'totalCatch')!;
    expect(totalCatch.difference).toBeCloseTo(totalCatch.option! - totalCatch.baseline!, 9);
    expect(totalCatch.difference).toBeLessThan(0);
    expect(preview.indicators.map((i) => i.key)).toContain('fishingInBalance');
    const purse = preview.fleets.find((f) => f.fleet === 'Purse seine')!;
    expect(purse.option!.catch).toBeCloseTo(purse.baseline!.catch * 0.6, 9);
    expect(await optionRows()).toBe(before);
  });

  it('answers 422 with each problem against its adjustment', async () => {
    const baseline = await publishedBaseline(t);
    const response = await baseline.analyst.post(`${baseline.base}/preview`).send(beyondSupply);
    expect(response.status).toBe(422);
    expect(response.body.details[0]).toMatchObject({ adjustment: 1 });
  });
});
