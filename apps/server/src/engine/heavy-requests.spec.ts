import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import { createDrawPool, type DrawPool } from '@seinework/draw-pool';
import cone from '../../../../tests/fixtures/cone-spring.json';
import detritivoreFishery from '../../../../tests/fixtures/cone-spring-detritivore-fishery.json';
import { generateWeb } from '../../../../libs/network-analysis/src/testing/generated-web';
import { createApp } from '../app';
import { createEngineJobs, type EngineJobs, type EngineJobsSettings } from './engine-jobs';
import { LEFT_OUT_KEYS } from './analysis-tables';
import { EngineStopping } from './engine-errors';

/**
 * Heavy and abandoned requests (issue 6, items 2 and 4), checked by structure only — which answer
 * comes first, what is left running — never by timing; latency is measured in `npm run bench`.
 */

const demoWebPath = resolve(import.meta.dirname, '../../../../seeds/brannock-bay.json');
/** At the API's limit of compartments, one link in eight: seconds of engine work. */
const heavyWeb = generateWeb({ compartments: 400, seed: 400, density: 0.12, fleets: 4 });

interface Running {
  readonly base: string;
  readonly engine: EngineJobs;
  readonly drawPool: DrawPool;
  close(): Promise<void>;
}

async function start(settings: Omit<EngineJobsSettings, 'drawPool'> = {}, drawQueue?: number): Promise<Running> {
  const drawPool = createDrawPool(1, { maxQueue: drawQueue });
  const engine = createEngineJobs({ threads: 1, keepAlive: true, ...settings, drawPool });
  const server: Server = (await createApp({ demoWebPath, engine, drawPool })).listen(0, '127.0.0.1');
  await new Promise((ready) => server.once('listening', ready));
  return {
    base: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    engine,
    drawPool,
    close: async () => {
      server.closeAllConnections();
      await new Promise((done) => server.close(done));
      await Promise.all([engine.destroy(), drawPool.destroy()]);
    },
  };
}

const post = (base: string, path: string, body: unknown, init: RequestInit = {}) =>
  fetch(`${base}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', ...init.headers }, body: JSON.stringify(body), signal: init.signal });

/** Resolves with how the promise settled, and lets a test ask whether it has yet. */
function track<T>(promise: Promise<T>) {
  const state = { settled: false };
  promise.then(
    () => (state.settled = true),
    () => (state.settled = true),
  );
  return state;
}

const manyDraws = { ...detritivoreFishery, uncertainty: { draws: 5000, cv: 0.1, seed: 3 } };

describe('heavy requests', () => {
  let running: Running;
  beforeAll(async () => {
    running = await start();
  });
  afterAll(() => running.close());

  it('answers /api/health while a 400-compartment analysis is still being computed', async () => {
    const heavy = post(running.base, '/api/analyses', heavyWeb);
    const state = track(heavy);
    await vi.waitFor(() => expect(running.engine.pending).toBe(1));
    const health = await fetch(`${running.base}/api/health`);
    expect(health.status).toBe(200);
    expect(state.settled).toBe(false);
    expect((await heavy).status).toBe(200);
    expect(running.engine.pending).toBe(0);
  });

  it('leaves the n² tables out unless asked for, naming them; ?tables=all keeps the whole document', async () => {
    const dense = generateWeb({ compartments: 40, seed: 3, density: 0.6 });
    const summary = await (await post(running.base, '/api/analyses', dense)).json();
    for (const key of ['totalDependency', 'allPathwayDependency', 'totalContribution', 'mixedTrophicImpact', 'robustnessGradient']) expect(summary).not.toHaveProperty(key);
    expect(summary.cycles).not.toHaveProperty('cycledFlow');
    expect(summary.tablesLeftOut).toEqual(LEFT_OUT_KEYS);
    expect(summary.cycles.nexusCount).toBeGreaterThan(summary.cycles.nexuses.length);
    expect(summary.cycles.nexuses).toHaveLength(50);
    expect(Object.keys(summary.trophicLevels)).toHaveLength(40);
    const all = await (await post(running.base, '/api/analyses?tables=all', dense)).json();
    expect(all).not.toHaveProperty('tablesLeftOut');
    expect(Object.keys(all.totalDependency)).toHaveLength(40);
    expect(all.cycles.nexuses).toHaveLength(summary.cycles.nexusCount);
    // the rest of the document is the same either way
    const { tablesLeftOut: _, cycles: summaryCycles, ...summaryRest } = summary;
    const { totalDependency: _t, allPathwayDependency: _a, totalContribution: _c, mixedTrophicImpact: _m, robustnessGradient: _r, cycles, ...allRest } = all;
    expect(summaryRest).toEqual(allRest);
    expect(summaryCycles.count).toBe(cycles.count);
  });

  it('leaves the tables out of an option run too (baseline, option and difference)', async () => {
    const run = await (await post(running.base, '/api/options/run', { web: cone, option: detritivoreFishery })).json();
    expect(run.baseline).not.toHaveProperty('totalDependency');
    expect(run.option).not.toHaveProperty('mixedTrophicImpact');
    expect(run.difference).not.toHaveProperty('totalDependency');
    expect(run.difference.cycles).not.toHaveProperty('acyclicFlow');
    const all = await (await post(running.base, '/api/options/run?tables=all', { web: cone, option: detritivoreFishery })).json();
    expect(all.difference.totalDependency.plants).toBeDefined();
  });

  it('stops an analysis whose client went away', async () => {
    const client = new AbortController();
    const heavy = post(running.base, '/api/analyses', heavyWeb, { signal: client.signal });
    await vi.waitFor(() => expect(running.engine.pending).toBe(1));
    client.abort();
    await expect(heavy).rejects.toThrow();
    await vi.waitFor(() => expect(running.engine.pending).toBe(0));
  });

  it('stops the draws of an NDJSON run whose client went away, and the next run is not kept waiting behind them', async () => {
    const client = new AbortController();
    const response = await post(running.base, '/api/options/run', { web: cone, option: manyDraws }, { signal: client.signal, headers: { accept: 'application/x-ndjson' } });
    const reader = response.body!.getReader();
    const first = JSON.parse(new TextDecoder().decode((await reader.read()).value).split('\n')[0]);
    expect(first.progress.total).toBe(5000);
    client.abort();
    await vi.waitFor(() => expect(running.drawPool.queueSize).toBe(0));
    const chunksRun = running.drawPool.finished;
    // 50 chunks of 100 draws were asked for; after the abort none is left queued and none more finish
    expect(chunksRun).toBeLessThan(50);
    const small = await post(running.base, '/api/options/run', { web: cone, option: { ...detritivoreFishery, uncertainty: { draws: 20, cv: 0.1, seed: 1 } } });
    expect(small.status).toBe(200);
    expect((await small.json()).uncertainty.succeeded).toBe(20);
    expect(running.drawPool.finished - chunksRun).toBeLessThanOrEqual(8 + 1);
  });
});

describe('limits on waiting and working', () => {
  it('answers 503 with Retry-After when the draw queue is full, and drops the refused request’s queued chunks', async () => {
    const running = await start({}, 60);
    try {
      const first = new AbortController();
      const response = await post(running.base, '/api/options/run', { web: cone, option: manyDraws }, { signal: first.signal, headers: { accept: 'application/x-ndjson' } });
      expect(response.status).toBe(200);
      const refused = await post(running.base, '/api/options/run', { web: cone, option: manyDraws });
      expect(refused.status).toBe(503);
      expect(refused.headers.get('retry-after')).toMatch(/^\d+$/);
      expect((await refused.json()).error).toMatch(/busy/);
      // only the first request's chunks wait: 50 chunks, one of them running
      expect(running.drawPool.queueSize).toBeLessThanOrEqual(49);
      first.abort();
      await vi.waitFor(() => expect(running.drawPool.queueSize).toBe(0));
    } finally {
      await running.close();
    }
  });

  it('answers 503 with Retry-After when every engine worker is busy and the queue is full', async () => {
    const running = await start({ maxQueue: 1 });
    try {
      // warm the one worker, so that the next task runs at once
      expect((await post(running.base, '/api/analyses', cone)).status).toBe(200);
      const clients = [new AbortController(), new AbortController()];
      const held = clients.map((client) => post(running.base, '/api/analyses', heavyWeb, { signal: client.signal }));
      await vi.waitFor(() => expect(running.engine.pending).toBe(2));
      const refused = await post(running.base, '/api/analyses', heavyWeb);
      expect(refused.status).toBe(503);
      expect(refused.headers.get('retry-after')).toMatch(/^\d+$/);
      for (const client of clients) client.abort();
      await Promise.allSettled(held);
      await vi.waitFor(() => expect(running.engine.pending).toBe(0));
    } finally {
      await running.close();
    }
  });

  it('refuses a job the engine was stopped under (shutting down) with EngineStopping, not an internal error', async () => {
    const engine = createEngineJobs({ threads: 1 });
    const job = engine.analyzeOffThread(heavyWeb);
    const refused = expect(job).rejects.toBeInstanceOf(EngineStopping);
    await new Promise((resolve) => setTimeout(resolve, 100));
    await engine.destroy();
    await refused;
  });

  it('stops a request that runs past its time budget and says so, naming the budget', async () => {
    const running = await start({ budgetMs: 300 });
    try {
      const response = await post(running.base, '/api/analyses?tables=all', heavyWeb);
      expect(response.status).toBe(503);
      expect((await response.json()).error).toMatch(/^The engine stopped after 300 ms, the time one request may take/);
      expect(running.engine.pending).toBe(0);
      // the worker that was stopped is replaced: once it has started, the next request is answered
      await vi.waitFor(async () => expect((await post(running.base, '/api/analyses', cone)).status).toBe(200), { timeout: 20_000, interval: 500 });
    } finally {
      await running.close();
    }
  });

  it('ends an NDJSON stream that runs past its budget with a line naming the budget', async () => {
    const running = await start({ budgetMs: 4000 });
    try {
      // both pools started (a cold start may itself run past the budget: try until it fits), so that the budget falls among the 5,000 draws (seconds of work)
      const warmUp = { web: cone, option: { ...detritivoreFishery, uncertainty: { draws: 20, cv: 0.1, seed: 1 } } };
      await vi.waitFor(async () => expect((await post(running.base, '/api/options/run', warmUp)).status).toBe(200), { timeout: 30_000, interval: 500 });
      // 5,000 draws of a 40-compartment web: far more work than the budget allows, its first chunk well within it
      const web = generateWeb({ compartments: 40, seed: 4, fleets: 2 });
      const landed = web.exports.find((e) => e.fleet !== undefined)!;
      const option = { name: 'cut', adjustments: [{ type: 'scale-catch', fleet: landed.fleet, compartment: landed.from, percent: -10 }], uncertainty: { draws: 5000, cv: 0.1, seed: 2 } };
      const response = await post(running.base, '/api/options/run', { web, option }, { headers: { accept: 'application/x-ndjson' } });
      const lines = (await response.text()).trim().split('\n').map((line) => JSON.parse(line));
      expect(lines[0]).toHaveProperty('progress');
      expect(lines.at(-1).error).toMatch(/^The engine stopped after 4 s/);
      await vi.waitFor(() => expect(running.drawPool.queueSize).toBe(0));
    } finally {
      await running.close();
    }
  });
});
