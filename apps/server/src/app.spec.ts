import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import fc from 'fast-check';
import cone from '../../../tests/fixtures/cone-spring.json';
import demo from '../../../seeds/brannock-bay.json';
import { generateWeb } from '../../../libs/network-analysis/src/testing/generated-web';
import type { HarvestOption, Web } from '@seinework/contracts';
import { createDrawPool, type DrawPool } from '@seinework/draw-pool';
import { optionUncertainty } from '@seinework/harvest-options';
import { createApp } from './app';
import { createEngineJobs, type EngineJobs } from './engine/engine-jobs';
import { HTTP_CYCLE_LIMITS } from './http/cycle-limits';

let server: Server;
let base: string;
let drawPool: DrawPool;
let engine: EngineJobs;

beforeAll(async () => {
  drawPool = createDrawPool(2);
  engine = createEngineJobs({ drawPool, threads: 2, keepAlive: true });
  const app = await createApp({ demoWebPath: resolve(import.meta.dirname, '../../../seeds/brannock-bay.json'), drawPool, engine });
  server = app.listen(0, '127.0.0.1');
  await new Promise((ready) => server.once('listening', ready));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((done) => server.close(done));
  await Promise.all([engine.destroy(), drawPool.destroy()]);
});

// Response bodies are read as loose JSON: the tests assert their shape.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const json = (response: Response): Promise<any> => response.json();

const post = (path: string, body: string, headers: Record<string, string> = {}) =>
  fetch(`${base}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body });

describe('server', () => {
  it('serves the analysed demo baseline', async () => {
    const response = await fetch(`${base}/api/demo/baseline`);
    expect(response.status).toBe(200);
    const body = await json(response);
    expect(body.compartments.length).toBeGreaterThan(10);
    expect(body.analysis.relativeAscendency).toBeGreaterThan(0);
  });

  it('analyses a posted web', async () => {
    const response = await post('/api/analyses', JSON.stringify(cone));
    expect(response.status).toBe(200);
    expect((await json(response)).tst).toBeCloseTo(42445, 6);
  });

  it('caps cycle enumeration for a dense web and says so, the cycled and acyclic flows still complete', async () => {
    const dense = generateWeb({ compartments: 40, seed: 3, density: 0.6 });
    const response = await post('/api/analyses?tables=all', JSON.stringify(dense));
    expect(response.status).toBe(200);
    const { cycles } = await json(response);
    expect(cycles.capped).toBe(true);
    expect(cycles.count).toBeLessThanOrEqual(HTTP_CYCLE_LIMITS.maxCycles!);
    // acyclic + cycled = original on every flow (METHODS.md §5)
    for (const flow of dense.flows) {
      const acyclic = cycles.acyclicFlow[flow.from]?.[flow.to] ?? 0;
      const cycled = cycles.cycledFlow[flow.from]?.[flow.to] ?? 0;
      expect(acyclic + cycled).toBeCloseTo(flow.value, 6);
    }
  });

  it('answers 400 to a body that is not JSON', async () => {
    const response = await post('/api/analyses', '{"name": ');
    expect(response.status).toBe(400);
    expect((await json(response)).error).toBe('The request body is not valid JSON');
  });

  it('answers 422 naming each problem of an invalid or unbalanced web', async () => {
    const invalid = await post('/api/analyses', JSON.stringify({ ...cone, flows: [{ from: 'plants', to: 'fish', value: -1 }] }));
    expect(invalid.status).toBe(422);
    expect((await json(invalid)).details).toEqual(['flows[0].value: flow value must not be negative']);
    const unbalanced = await post('/api/analyses', JSON.stringify({ ...cone, imports: [{ to: 'plants', value: 1 }] }));
    expect(unbalanced.status).toBe(422);
    expect((await json(unbalanced)).details.join(' ')).toMatch(/"plants" is unbalanced/);
  });

  it('balances a posted web by the method asked for, which then analyses', async () => {
    const unbalanced = { ...cone, imports: cone.imports.map((i) => (i.to === 'plants' ? { ...i, value: i.value + 50 } : i)) };
    for (const method of ['input', 'output', 'average', 'least-change']) {
      const response = await post('/api/balancing', JSON.stringify({ web: unbalanced, method }));
      expect(response.status).toBe(200);
      const body = await json(response);
      expect(body).toMatchObject({ method, wasBalanced: false });
      expect((await post('/api/analyses', JSON.stringify(body.web))).status).toBe(200);
    }
    const unknown = await post('/api/balancing', JSON.stringify({ web: unbalanced, method: 'guess' }));
    expect(unknown.status).toBe(400);
    expect((await json(unknown)).details).toEqual(['method: method must be one of input, output, average, least-change']);
  });

  it('refuses state-changing requests from another site', async () => {
    const response = await post('/api/analyses', JSON.stringify(cone), { origin: 'https://elsewhere.example' });
    expect(response.status).toBe(403);
  });

  it('answers 404 with a message for an unknown API route', async () => {
    const response = await fetch(`${base}/api/nothing-here`);
    expect(response.status).toBe(404);
    expect((await json(response)).error).toMatch(/No such API route/);
  });

  describe('harvest options', () => {
    const newDetritivoreFishery = {
      name: 'New detritivore fishery',
      adjustments: [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }],
    };

    it('runs an option: baseline, option, difference and the balanced option web', async () => {
      const response = await post('/api/options/run', JSON.stringify({ web: cone, option: newDetritivoreFishery }));
      expect(response.status).toBe(200);
      const body = await json(response);
      expect(Object.keys(body).sort()).toEqual(['baseline', 'difference', 'option', 'web']);
      // METHODS.md §8 check, computed from the Cone Spring table (Tilly 1968 via Finn 1976)
      const flow = body.web.flows.find((f: { from: string; to: string }) => f.from === 'detritivores' && f.to === 'carnivores');
      expect(flow.value).toBeCloseTo(353.881, 3);
      expect(body.difference.totalCatch).toBeCloseTo(100, 9);
    });

    it('adds seeded uncertainty bands when the option asks for them', async () => {
      const option = { ...newDetritivoreFishery, uncertainty: { draws: 12, cv: 0.1, seed: 7 } };
      const first = await json(await post('/api/options/run', JSON.stringify({ web: cone, option })));
      const again = await json(await post('/api/options/run', JSON.stringify({ web: cone, option })));
      expect(first.uncertainty.succeeded).toBe(12);
      expect(first.uncertainty.indicators.totalCatch.difference.median).toBeCloseTo(100, 9);
      expect(again.uncertainty).toEqual(first.uncertainty);
      // the server's chunks on its draw pool give what the engine gives in process
      expect(first.uncertainty).toEqual(JSON.parse(JSON.stringify(await optionUncertainty(cone as Web, option as HarvestOption, option.uncertainty))));
    });

    it('streams progress lines, then the same result, when asked for NDJSON', async () => {
      const option = { ...newDetritivoreFishery, uncertainty: { draws: 30, cv: 0.1, seed: 11 } };
      const body = JSON.stringify({ web: cone, option });
      const plain = await json(await post('/api/options/run', body));
      const streamed = await post('/api/options/run', body, { accept: 'application/x-ndjson' });
      expect(streamed.headers.get('content-type')).toMatch(/^application\/x-ndjson/);
      const lines = (await streamed.text()).trim().split('\n').map((l) => JSON.parse(l));
      const progress = lines.slice(0, -1).map((l) => l.progress);
      expect(progress.length).toBeGreaterThan(1);
      expect(progress.map((p: { done: number }) => p.done)).toEqual([...progress.map((p: { done: number }) => p.done)].sort((a, b) => a - b));
      expect(progress.at(-1)).toEqual({ done: 30, total: 30 });
      expect(lines.at(-1).result).toEqual(plain);
    });

    it('answers 422 naming an adjustment the web cannot take', async () => {
      const option = { name: 'x', adjustments: [{ type: 'close-fleet', fleet: 'nobody' }] };
      const response = await post('/api/options/run', JSON.stringify({ web: cone, option }));
      expect(response.status).toBe(422);
      expect((await json(response)).details[0]).toMatch(/^adjustments\[0\] \(close-fleet "nobody"\): unknown fleet "nobody"/);
    });

    it('answers 422 to more draws than one request may hold', async () => {
      const option = { ...newDetritivoreFishery, uncertainty: { draws: 50_000, cv: 0.1, seed: 1 } };
      const response = await post('/api/options/run', JSON.stringify({ web: cone, option }));
      expect(response.status).toBe(422);
      expect((await json(response)).details[0]).toMatch(/at most 5000 draws per request/);
    });

    it('answers 400 to a body of the wrong shape', async () => {
      const response = await post('/api/options/run', JSON.stringify({ web: cone, option: newDetritivoreFishery, extra: 1 }));
      expect(response.status).toBe(400);
      expect((await json(response)).error).toBe('The request body does not have the expected shape');
    });

    it('tabulates harvest sensitivity for every catch of the demo bay, sorted toward the fitness peak', async () => {
      const response = await post('/api/options/sensitivity', JSON.stringify({ web: demo, response: 'least-change' }));
      expect(response.status).toBe(200);
      const body = await json(response);
      expect(body.response).toBe('least-change');
      expect(body.rows).toHaveLength(demo.exports.filter((e) => 'fleet' in e).length);
      const toward = body.byRobustness.map((row: { distanceFromPeakChange: number }) => row.distanceFromPeakChange);
      expect(toward).toEqual([...toward].sort((a, b) => a - b));
    });
  });

  describe('bad input never gets a 500', () => {
    // any JSON at all, and Cone Spring or the demo option with one part replaced by any JSON
    const anyJson = fc.jsonValue({ maxDepth: 3 });
    const brokenWeb = fc.tuple(fc.constantFrom('name', 'unit', 'compartments', 'flows', 'imports', 'exports', 'respiration', 'areaKm2', 'extra'), anyJson)
      .map(([key, value]) => ({ ...cone, [key]: value }));
    const brokenFlow = fc.tuple(fc.nat(cone.flows.length - 1), fc.constantFrom('from', 'to', 'value', 'cv', 'fleet'), anyJson)
      .map(([k, key, value]) => ({ ...cone, flows: cone.flows.map((f, i) => (i === k ? { ...f, [key]: value } : f)) }));
    const brokenOption = fc.tuple(fc.constantFrom('name', 'response', 'adjustments', 'uncertainty'), anyJson)
      .map(([key, value]) => ({ name: 'x', adjustments: [{ type: 'scale-catch', fleet: 'net', compartment: 'carnivores', percent: 10 }], [key]: value }));

    const answersClearly = async (path: string, body: unknown) => {
      const response = await post(path, JSON.stringify(body));
      expect(response.status, JSON.stringify(body)).not.toBe(500);
      if (response.status >= 400) expect(typeof (await json(response)).error).toBe('string');
    };

    it('POST /api/analyses', async () => {
      await fc.assert(fc.asyncProperty(fc.oneof(anyJson, brokenWeb, brokenFlow), (body) => answersClearly('/api/analyses', body)), { numRuns: 150 });
    });

    it('POST /api/options/run, /api/options/sensitivity and /api/balancing', async () => {
      const bodies = fc.oneof(
        anyJson,
        fc.record({ web: fc.oneof(brokenWeb, brokenFlow), option: brokenOption }),
        fc.record({ web: fc.constant(cone), option: brokenOption }),
      );
      await fc.assert(fc.asyncProperty(bodies, (body) => answersClearly('/api/options/run', body)), { numRuns: 150 });
      await fc.assert(fc.asyncProperty(fc.oneof(anyJson, fc.record({ web: fc.oneof(brokenWeb, brokenFlow), response: anyJson })), (body) => answersClearly('/api/options/sensitivity', body)), { numRuns: 100 });
      await fc.assert(fc.asyncProperty(fc.oneof(anyJson, fc.record({ web: fc.oneof(brokenWeb, brokenFlow), method: anyJson })), (body) => answersClearly('/api/balancing', body)), { numRuns: 100 });
    });
  });
});
