import { and, count, eq, isNull } from 'drizzle-orm';
import fc from 'fast-check';
import type { Comparison, OptionSummary, PreferenceSummary } from '@seinework/contracts';
import { auditEvents, preferences, shares } from '../db/schema';
import { createTestApp, type TestApp } from '../testing/test-app';
import { createOption, forageCut, gillnetClosure, publishedBaseline, shareForCouncil, storeRun, type Baseline } from './test-options';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 60_000);
afterAll(() => t.close());

const auditCount = async (action: string) => (await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.action, action)))[0]!.n;

/** A result document as the scenario command prints it, reduced to two indicators; bands only with draws. */
function result(totalCatch: [number, number], band?: [number, number, number]) {
  const [before, after] = totalCatch;
  return {
    baseline: { totalCatch: before, ascendency: 100 },
    option: { totalCatch: after, ascendency: 101 },
    difference: { totalCatch: after - before, ascendency: 1, fishingInBalance: 0.02 },
    web: {},
    ...(band ? { uncertainty: { indicators: { totalCatch: { difference: { p5: band[0], median: band[1], p95: band[2] } } } } } : {}),
  };
}

async function twoSharedOptions(): Promise<{ baseline: Baseline; forage: string; gillnet: string; forageRun: string; gillnetRun: string; forageShare: string }> {
  const baseline = await publishedBaseline(t);
  const forage = await createOption(baseline, forageCut);
  const gillnet = await createOption(baseline, gillnetClosure);
  const a = await shareForCouncil(t, baseline, forage, result([10, 6], [-4.5, -4, -3.2]));
  const b = await shareForCouncil(t, baseline, gillnet, result([10, 9.7], [-0.6, -0.3, 0.1]));
  return { baseline, forage, gillnet, forageRun: a.runId, gillnetRun: b.runId, forageShare: a.shareId };
}

describe('council review', () => {
  it('shows council an option only while it is shared with them (404 otherwise), staff every shared option, analysts all', async () => {
    const baseline = await publishedBaseline(t);
    const shared = await createOption(baseline, forageCut);
    const unshared = await createOption(baseline, gillnetClosure);
    const [council, staff, stakeholder] = [await t.signInAs('council'), await t.signInAs('staff'), await t.signInAs('stakeholder')];
    expect((await council.get(`/api/options/${shared}`)).status).toBe(404);
    expect((await council.get(baseline.base)).status).toBe(404);
    expect((await staff.get(baseline.base)).body).toEqual({ items: [], total: 0 });

    const before = await auditCount('option.shared');
    const { shareId, runId } = await shareForCouncil(t, baseline, shared);
    expect(await auditCount('option.shared')).toBe(before + 1);
    const seen = await council.get(`/api/options/${shared}`);
    expect(seen.status).toBe(200);
    expect(seen.body.shares).toEqual([{ id: shareId, audience: 'council', runId, sharedBy: 'Ana Demo (analyst)', sharedAt: expect.any(String), closesAt: null }]);
    expect((await council.get(`/api/options/${unshared}`)).status).toBe(404);
    for (const reader of [council, staff]) {
      const list = (await reader.get(baseline.base)).body as { items: OptionSummary[]; total: number };
      expect(list.items.map((o) => o.id)).toEqual([shared]);
    }
    expect((await baseline.analyst.get(baseline.base)).body.total).toBe(2);
    // stakeholders read only options shared for public comment (discussion/discussion-visibility.spec.ts)
    expect((await stakeholder.get(`/api/options/${shared}`)).status).toBe(404);
    expect((await stakeholder.get(baseline.base)).status).toBe(403);

    const withdrawn = await baseline.analyst.delete(`/api/shares/${shareId}`);
    expect(withdrawn.status).toBe(204);
    expect((await baseline.analyst.delete(`/api/shares/${shareId}`)).status).toBe(409);
    expect((await council.get(`/api/options/${shared}`)).status).toBe(404);
    expect((await staff.get(`/api/options/${shared}`)).status).toBe(404);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.subject, `option:${shared}`)).orderBy(auditEvents.id);
    expect(events.map((e) => e.action)).toEqual(['option.created', 'option.shared', 'option.share-withdrawn']);
  });

  it("narrows council's webs to published baselines carrying an option shared for council review; staff see every published baseline", async () => {
    const baseline = await publishedBaseline(t);
    const [council, staff] = [await t.signInAs('council'), await t.signInAs('staff')];
    const version = `/api/webs/${baseline.webId}/versions/${baseline.versionId}`;
    expect((await council.get(`/api/webs/${baseline.webId}`)).status).toBe(404);
    expect((await council.get(version)).status).toBe(404);
    expect(((await council.get('/api/webs')).body.items as { id: string }[]).map((w) => w.id)).not.toContain(baseline.webId);
    expect((await staff.get(version)).status).toBe(200);

    const option = await createOption(baseline);
    expect((await council.get(version)).status).toBe(404);
    const { shareId } = await shareForCouncil(t, baseline, option);
    expect((await council.get(version)).status).toBe(200);
    expect((await council.get(`/api/webs/${baseline.webId}`)).body.versions.map((v: { id: string }) => v.id)).toEqual([baseline.versionId]);
    expect(((await council.get('/api/webs')).body.items as { id: string }[]).map((w) => w.id)).toContain(baseline.webId);
    await baseline.analyst.delete(`/api/shares/${shareId}`);
    expect((await council.get(version)).status).toBe(404);
    expect((await staff.get(version)).status).toBe(200);
  });

  it('refuses a closing date in the past, a share without a finished run, and a second share', async () => {
    const baseline = await publishedBaseline(t);
    const option = await createOption(baseline);
    const publicShare = await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'public' });
    // the closing date is optional (open until withdrawn): refused here only for want of a finished run
    expect(publicShare.status).toBe(409);
    expect(publicShare.body.error).toMatch(/no finished run/);
    const past = await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'public', closesAt: new Date(Date.now() - 60_000).toISOString() });
    expect(past.status).toBe(422);
    expect(past.body.error).toMatch(/future/);
    const noRun = await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council' });
    expect(noRun.status).toBe(409);
    expect(noRun.body.error).toMatch(/no finished run/);
    const queued = await storeRun(t.database.db, option, null, 'queued');
    expect((await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council', runId: queued })).status).toBe(409);
    expect((await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council', runId: 'no-such-run' })).status).toBe(422);
    expect((await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'everyone' })).status).toBe(400);
    await shareForCouncil(t, baseline, option);
    expect((await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council' })).status).toBe(409);
    expect(await t.database.db.select({ n: count() }).from(shares).where(and(eq(shares.optionId, option), isNull(shares.withdrawnAt)))).toEqual([{ n: 1 }]);
  });
});

describe('at the same moment', () => {
  it('keeps one share of ten asked for at once, and one current preference of ten recorded at once', async () => {
    const baseline = await publishedBaseline(t);
    const option = await createOption(baseline);
    await storeRun(t.database.db, option, {});
    const asked = await Promise.all(Array.from({ length: 10 }, () => baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council' })));
    expect(asked.map((r) => r.status).sort()).toEqual([201, ...Array<number>(9).fill(409)]);
    expect(await t.database.db.select({ n: count() }).from(shares).where(eq(shares.optionId, option))).toEqual([{ n: 1 }]);

    const council = await t.signInAs('council');
    const recorded = await Promise.all(Array.from({ length: 10 }, (_, i) => council.post(`/api/options/${option}/preferences`).send({ reason: `reason ${i}` })));
    for (const response of recorded) expect([201, 409]).toContain(response.status);
    const current = await t.database.db.select().from(preferences).where(and(eq(preferences.versionId, baseline.versionId), isNull(preferences.supersededAt)));
    expect(current).toHaveLength(1);
    expect((await council.get(`/api/options/${option}/preferences`)).body.total).toBe(1);
  });
});

describe('preferences', () => {
  it('records a council preference on a shared option; a new one on the same baseline supersedes it, the old kept', async () => {
    const { baseline, forage, gillnet, forageRun, gillnetRun } = await twoSharedOptions();
    const council = await t.signInAs('council');
    const before = await auditCount('preference.recorded');
    const first = await council.post(`/api/options/${forage}/preferences`).send({ reason: 'Seabirds need the forage fish', comparedRuns: [forageRun, gillnetRun] });
    expect(first.status).toBe(201);
    const listed = (await council.get(`/api/options/${forage}/preferences`)).body as { items: PreferenceSummary[] };
    expect(listed.items).toEqual([{ id: first.body.id, optionId: forage, optionName: forageCut.name, member: 'Cole Demo (council member)', reason: 'Seabirds need the forage fish', createdAt: expect.any(String) }]);

    const second = await council.post(`/api/options/${gillnet}/preferences`).send({ reason: 'Fewer porpoise by-catches' });
    expect(second.status).toBe(201);
    expect((await council.get(`/api/options/${forage}/preferences`)).body.items).toEqual([]);
    expect((await council.get(`/api/options/${gillnet}/preferences`)).body.items.map((p: PreferenceSummary) => p.id)).toEqual([second.body.id]);
    const kept = await t.database.db.select().from(preferences).where(eq(preferences.versionId, baseline.versionId));
    expect(kept.map((p) => [p.id, p.supersededAt === null])).toEqual(
      expect.arrayContaining([
        [first.body.id, false],
        [second.body.id, true],
      ]),
    );
    expect(await auditCount('preference.recorded')).toBe(before + 2);
  });

  it('keeps, whatever the order of recording, one current preference per member per baseline: the last one', async () => {
    const { baseline, forage, gillnet } = await twoSharedOptions();
    const members = { council: await t.signInAs('council'), admin: await t.signInAs('admin') };
    const step = fc.record({ member: fc.constantFrom('council' as const, 'admin' as const), option: fc.constantFrom(forage, gillnet) });
    // the database keeps its preferences from one sequence to the next: so does the model
    const last = new Map<string, { id: string; option: string }>();
    await fc.assert(
      fc.asyncProperty(fc.array(step, { minLength: 1, maxLength: 5 }), async (steps) => {
        for (const { member, option } of steps) {
          const recorded = await members[member].post(`/api/options/${option}/preferences`).send({ reason: `${member} prefers ${option}` });
          expect(recorded.status).toBe(201);
          last.set(member, { id: recorded.body.id, option });
        }
        const current = await t.database.db.select().from(preferences).where(and(eq(preferences.versionId, baseline.versionId), isNull(preferences.supersededAt)));
        expect(current.map((p) => p.id).sort()).toEqual([...last.values()].map((p) => p.id).sort());
        const listed = [...((await members.council.get(`/api/options/${forage}/preferences`)).body.items as PreferenceSummary[]), ...((await members.council.get(`/api/options/${gillnet}/preferences`)).body.items as PreferenceSummary[])];
        expect(listed.map((p) => [p.id, p.optionId]).sort()).toEqual([...last.values()].map((p) => [p.id, p.option]).sort());
      }),
      { numRuns: 6 },
    );
  }, 120_000);

  it('refuses a preference on an option not shared with the member (404), other roles (403), bad bodies (400) and runs of other baselines (422)', async () => {
    const { baseline, forage, forageShare } = await twoSharedOptions();
    const unshared = await createOption(baseline, { ...forageCut, name: 'Not shared' });
    const council = await t.signInAs('council');
    expect((await council.post(`/api/options/${unshared}/preferences`).send({ reason: 'x' })).status).toBe(404);
    expect((await (await t.signInAs('staff')).post(`/api/options/${forage}/preferences`).send({ reason: 'x' })).status).toBe(403);
    expect((await baseline.analyst.post(`/api/options/${forage}/preferences`).send({ reason: 'x' })).status).toBe(403);
    // an admin sees every option but records preferences only among options under council review
    expect((await (await t.signInAs('admin')).post(`/api/options/${unshared}/preferences`).send({ reason: 'x' })).status).toBe(409);
    expect((await council.post(`/api/options/${forage}/preferences`).send({ reason: '' })).status).toBe(400);
    expect((await council.post(`/api/options/${forage}/preferences`).send({})).status).toBe(400);
    const elsewhere = await twoSharedOptions();
    const otherBaseline = await council.post(`/api/options/${forage}/preferences`).send({ reason: 'x', comparedRuns: [elsewhere.forageRun] });
    expect(otherBaseline.status).toBe(422);
    expect(otherBaseline.body.details).toEqual([`comparedRuns: run "${elsewhere.forageRun}" is on another baseline`]);
    await baseline.analyst.delete(`/api/shares/${forageShare}`);
    expect((await council.post(`/api/options/${forage}/preferences`).send({ reason: 'x' })).status).toBe(404);
    expect(await t.database.db.select({ n: count() }).from(preferences).where(eq(preferences.versionId, baseline.versionId))).toEqual([{ n: 0 }]);
  });
});

describe('comparisons', () => {
  it('sets every scalar indicator of the runs side by side, marking differences whose band excludes zero, with the preferences', async () => {
    const { forage, forageRun, gillnetRun } = await twoSharedOptions();
    const council = await t.signInAs('council');
    const preference = await council.post(`/api/options/${forage}/preferences`).send({ reason: 'Seabirds' });
    const response = await council.get(`/api/comparisons?runs=${forageRun},${gillnetRun}`);
    expect(response.status).toBe(200);
    const comparison = response.body as Comparison;
    expect(comparison.runs.map((r) => [r.id, r.optionName, r.status])).toEqual([
      [forageRun, forageCut.name, 'done'],
      [gillnetRun, gillnetClosure.name, 'done'],
    ]);
    expect(comparison.indicators.map((i) => i.key)).toEqual([
      'tst',
      'totalSystemThroughflow',
      'developmentCapacity',
      'ascendency',
      'overhead',
      'averageMutualInformation',
      'flowDiversity',
      'relativeAscendency',
      'robustness',
      'effectiveRoles',
      'effectiveConnectance',
      'finnCyclingIndex',
      'totalCatch',
      'meanTrophicLevelOfCatch',
      'primaryProductionRequired',
      'primaryProductionRequiredShare',
      'fishingInBalance',
    ]);
    const totalCatch = comparison.indicators.find((i) => i.key === 'totalCatch')!;
    expect(totalCatch).toEqual({
      key: 'totalCatch',
      baseline: 10,
      values: [
        { runId: forageRun, after: 6, difference: -4, band: { p5: -4.5, median: -4, p95: -3.2 }, exceedsUncertainty: true },
        { runId: gillnetRun, after: 9.7, difference: expect.closeTo(-0.3, 12), band: { p5: -0.6, median: -0.3, p95: 0.1 }, exceedsUncertainty: false },
      ],
    });
    // no draws for ascendency: no band, never marked
    expect(comparison.indicators.find((i) => i.key === 'ascendency')!.values[0]).toEqual({ runId: forageRun, after: 101, difference: 1, band: null, exceedsUncertainty: false });
    expect(comparison.indicators.find((i) => i.key === 'fishingInBalance')!).toMatchObject({ baseline: null, values: [{ after: null, difference: 0.02 }, { difference: 0.02 }] });
    expect(comparison.preferences.map((p) => [p.id, p.optionId])).toEqual([[preference.body.id, forage]]);
  });

  it('refuses fewer than 2 or more than 6 runs, unfinished runs, runs on two baselines, and runs a council member may not see', async () => {
    const one = await twoSharedOptions();
    const two = await twoSharedOptions();
    const council = await t.signInAs('council');
    expect((await council.get(`/api/comparisons?runs=${one.forageRun}`)).status).toBe(400);
    expect((await council.get('/api/comparisons?runs=a,b,c,d,e,f,g')).status).toBe(400);
    expect((await council.get(`/api/comparisons?runs=${one.forageRun},${one.forageRun}`)).status).toBe(400);
    expect((await council.get('/api/comparisons')).status).toBe(400);
    const mixed = await council.get(`/api/comparisons?runs=${one.forageRun},${two.gillnetRun}`);
    expect(mixed.status).toBe(422);
    expect(mixed.body.error).toMatch(/one baseline/);
    const queued = await storeRun(t.database.db, one.forage, null, 'queued');
    const unfinished = await council.get(`/api/comparisons?runs=${one.forageRun},${queued}`);
    expect(unfinished.status).toBe(409);
    expect(unfinished.body.details).toEqual([`run ${queued} ("${forageCut.name}") is queued`]);
    const unshared = await createOption(one.baseline, { ...forageCut, name: 'Not shared' });
    const hidden = await storeRun(t.database.db, unshared, result([10, 8]));
    expect((await council.get(`/api/comparisons?runs=${one.forageRun},${hidden}`)).status).toBe(404);
    expect((await one.baseline.analyst.get(`/api/comparisons?runs=${one.forageRun},${hidden}`)).status).toBe(200);
    expect((await (await t.signInAs('stakeholder')).get(`/api/comparisons?runs=${one.forageRun},${one.gillnetRun}`)).status).toBe(403);
  });
});
