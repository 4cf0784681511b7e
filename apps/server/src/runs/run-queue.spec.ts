import type { IncomingMessage } from 'node:http';
import { count, eq, inArray } from 'drizzle-orm';
import type { RunDetail, RunSummary } from '@seinework/contracts';
import { runTool, temporaryFile } from '../../../../tests/support/run-command';
import { auditEvents, runs } from '../db/schema';
import { createEngineJobs } from '../engine/engine-jobs';
import { createTestApp, type TestApp } from '../testing/test-app';
import { ENGINE_VERSION } from '../seed/demo-run-document';
import { readWeb } from '../webs/version-rows';
import { createDrawPool, type DrawPool } from '@seinework/draw-pool';
import { createOption, forageCut, gillnetClosure, publishedBaseline, type Baseline } from '../options/test-options';
import { createRunQueue, type RunQueue } from './run-queue';

/**
 * The run queue on the test database (PGlite, or PostgreSQL with TEST_DATABASE_URL). The app's
 * queue loop is not started: tests drain it, or race queues of their own on the same database.
 */

let t: TestApp;
let baseline: Baseline;
let drawPool: DrawPool;
const engine = createEngineJobs();
beforeAll(async () => {
  t = await createTestApp();
  baseline = await publishedBaseline(t);
  drawPool = createDrawPool(undefined, { keepAlive: false });
}, 60_000);
afterAll(async () => {
  await t.close();
  await Promise.all([engine.destroy(), drawPool.destroy()]);
});

/** Another server process's queue on the same database. */
const otherQueue = (owner: string, leaseMs?: number): RunQueue => createRunQueue({ db: t.database.db, engine, drawPool, owner, leaseMs });

async function startRun(optionId: string, body: object = {}): Promise<string> {
  const response = await baseline.analyst.post(`/api/options/${optionId}/runs`).send(body);
  expect(response.status).toBe(202);
  return response.body.id as string;
}

const row = async (id: string) => (await t.database.db.select().from(runs).where(eq(runs.id, id)))[0]!;
const detail = async (id: string) => (await baseline.analyst.get(`/api/runs/${id}?tables=all`)).body as RunDetail;

/** Runs left queued by a test would be computed by the next one's drain: each test leaves none. */
afterEach(async () => {
  await t.database.db.update(runs).set({ status: 'cancelled' }).where(inArray(runs.status, ['queued', 'running']));
});

describe('starting a run', () => {
  it('answers 202 with the id, stores the exact inputs as queued, and audits it', async () => {
    const optionId = await createOption(baseline, { ...forageCut, uncertainty: { draws: 300, cv: 0.2, seed: 11 } });
    const before = (await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.action, 'run.started')))[0]!.n;
    const id = await startRun(optionId, { draws: 40 });
    const stored = await row(id);
    expect(stored).toMatchObject({ status: 'queued', draws: 40, cv: 0.2, seed: 11, progressDone: 0, progressTotal: 40, engineVersion: ENGINE_VERSION });
    expect(stored.inputs).toEqual({ webId: baseline.webId, versionId: baseline.versionId, option: { name: forageCut.name, response: forageCut.response, adjustments: forageCut.adjustments }, uncertainty: { draws: 40, cv: 0.2, seed: 11 } });
    expect((await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.action, 'run.started')))[0]!.n).toBe(before + 1);
    expect(await detail(id)).toMatchObject({ id, optionId, status: 'queued', progress: { done: 0, total: 40 }, timings: null });
  });

  it('accepts 20,000 draws and refuses 20,001 (400, naming draws); a run needs an option the person may start runs on', async () => {
    const optionId = await createOption(baseline);
    expect((await baseline.analyst.post(`/api/options/${optionId}/runs`).send({ draws: 20_000, cv: 0.25, seed: 1 })).status).toBe(202);
    const refused = await baseline.analyst.post(`/api/options/${optionId}/runs`).send({ draws: 20_001 });
    expect(refused.status).toBe(400);
    expect(refused.body.details).toEqual(['draws: draws must be at most 20000']);
    expect((await baseline.analyst.post(`/api/options/${optionId}/runs`).send({ draws: 10, colour: 'red' })).status).toBe(400);
    expect((await baseline.analyst.post('/api/options/no-such-option/runs').send({})).status).toBe(404);
    const council = await t.signInAs('council');
    expect((await council.post(`/api/options/${optionId}/runs`).send({})).status).toBe(403);
    // not shared with the council: as if it did not exist
    const [run] = (await baseline.analyst.get(`/api/options/${optionId}/runs`)).body.items as RunSummary[];
    expect((await council.get(`/api/runs/${run!.id}`)).status).toBe(404);
    expect((await council.get(`/api/options/${optionId}/runs`)).status).toBe(404);
    expect((await council.post(`/api/runs/${run!.id}/cancel`)).status).toBe(403);
    expect((await t.anonymous().get(`/api/runs/${run!.id}`)).status).toBe(401);
  });
});

describe('computing runs', () => {
  it('stores exactly what the scenario command prints for the same inputs, and the timings', async () => {
    const optionId = await createOption(baseline, gillnetClosure);
    const id = await startRun(optionId, { draws: 60, cv: 0.25, seed: 20261202 });
    expect(await t.runQueue.drain()).toBe(1);
    const run = await detail(id);
    expect(run).toMatchObject({ status: 'done', progress: { done: 60, total: 60 }, error: null });
    expect(run.timings!.runMs).toBeGreaterThanOrEqual(0);
    expect(run.timings!.queuedMs).toBeGreaterThanOrEqual(0);
    const webFile = temporaryFile('web.json', await readWeb(t.database.db, baseline.versionId));
    const optionFile = temporaryFile('option.json', { ...run.inputs.option, uncertainty: run.inputs.uncertainty });
    const printed = runTool('scenario.ts', [webFile, optionFile]);
    expect(printed.status).toBe(0);
    expect(run.result).toEqual(JSON.parse(printed.stdout));
    // by default without the n² tables, as the analysis routes answer; read again, the same
    const summary = await baseline.analyst.get(`/api/runs/${id}`);
    const document = summary.body.result as Record<string, Record<string, unknown>>;
    expect(document['baseline']!).not.toHaveProperty('totalDependency');
    expect(document['baseline']!['tst']).toBe((run.result as typeof document)['baseline']!['tst']);
    expect(document['uncertainty']).toEqual((run.result as typeof document)['uncertainty']);
    expect((await baseline.analyst.get(`/api/runs/${id}`)).text).toBe(summary.text);
    expect((await baseline.analyst.get(`/api/runs/${id}?tables=some`)).status).toBe(400);
  }, 120_000);

  it('the same inputs and seed give the same result, bit for bit; another seed another', async () => {
    const optionId = await createOption(baseline);
    const first = await startRun(optionId, { draws: 50, cv: 0.3, seed: 5 });
    const second = await startRun(optionId, { draws: 50, cv: 0.3, seed: 5 });
    const third = await startRun(optionId, { draws: 50, cv: 0.3, seed: 6 });
    expect(await t.runQueue.drain()).toBe(3);
    const [a, b, c] = await Promise.all([row(first), row(second), row(third)]);
    expect(JSON.stringify(b.result)).toBe(JSON.stringify(a.result));
    expect(JSON.stringify(c.result)).not.toBe(JSON.stringify(a.result));
  }, 120_000);

  it('a run the engine refuses fails and keeps the engine\'s message', async () => {
    const optionId = await createOption(baseline);
    const id = await startRun(optionId, { draws: 10 });
    // inputs no stored option could have (the engine validates options when they are stored)
    const stored = await row(id);
    await t.database.db
      .update(runs)
      .set({ inputs: { ...stored.inputs, option: { ...stored.inputs.option, adjustments: [{ type: 'set-catch', fleet: 'Purse seine', compartment: 'forage-fish', amount: 1e6 }] } } })
      .where(eq(runs.id, id));
    await t.runQueue.drain();
    const run = await detail(id);
    expect(run.status).toBe('failed');
    expect(run.error).toMatch(/adjustments\[0\] \(set-catch fleet "Purse seine" on "forage-fish" to 1000000\): "forage-fish" cannot supply a catch of 1000000/);
    expect(run.result).toBeUndefined();
  }, 120_000);
});

describe('cancelling', () => {
  it('a queued run is cancelled at once and never computed', async () => {
    const optionId = await createOption(baseline);
    const id = await startRun(optionId, { draws: 30 });
    const cancelled = await baseline.analyst.post(`/api/runs/${id}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body).toMatchObject({ id, status: 'cancelled' });
    expect(await t.runQueue.drain()).toBe(0);
    expect((await row(id)).result).toBeNull();
    expect((await baseline.analyst.post(`/api/runs/${id}/cancel`)).status).toBe(409);
    expect((await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.subject, `run:${id}`)))[0]!.n).toBe(2);
  });

  it('a running run stops at its next chunk of draws', async () => {
    const optionId = await createOption(baseline);
    const id = await startRun(optionId, { draws: 20_000, cv: 0.25, seed: 3 });
    const computing = t.runQueue.runOne();
    await until(async () => (await row(id)).progressDone > 0);
    expect((await baseline.analyst.post(`/api/runs/${id}/cancel`)).body).toMatchObject({ status: 'running' });
    await computing;
    const stopped = await row(id);
    expect(stopped.status).toBe('cancelled');
    expect(stopped.progressDone).toBeLessThan(20_000);
    expect(stopped.result).toBeNull();
    expect(stopped.leaseOwner).toBeNull();
  }, 120_000);
});

describe('the queue across server processes', () => {
  // PGlite has one connection, so there its transactions run one after the other and the race
  // below proves only that each claim takes a run no earlier claim took. On PostgreSQL
  // (TEST_DATABASE_URL, as `npm test` runs it a second time) the claims overlap for real, and the
  // held-lock test shows SKIP LOCKED passing over a row another transaction has locked.
  it('two workers racing never take one run', async () => {
    const optionId = await createOption(baseline);
    const ids = await Promise.all(Array.from({ length: 6 }, () => startRun(optionId, { draws: 5 })));
    const [a, b] = [otherQueue('worker-a'), otherQueue('worker-b')];
    const claims = await Promise.all([a.claim(), b.claim(), a.claim(), b.claim(), a.claim(), b.claim(), a.claim(), b.claim()]);
    const taken = claims.filter((c) => c !== undefined).map((c) => c!.id);
    expect(new Set(taken).size).toBe(taken.length);
    expect([...taken].sort()).toEqual([...ids].sort());
    const owners = await t.database.db.select({ id: runs.id, owner: runs.leaseOwner, attempts: runs.attempts }).from(runs).where(inArray(runs.id, ids));
    for (const owner of owners) {
      expect(owner.attempts).toBe(1);
      expect(owner.owner).toBe(claims.find((c) => c?.id === owner.id)!.leaseOwner);
    }
  });

  // registered only where it means something: PGlite's single connection cannot hold a lock across transactions
  if (process.env['TEST_DATABASE_URL'] !== undefined) it('on PostgreSQL a claim skips a run another transaction holds locked', async () => {
    const optionId = await createOption(baseline);
    const first = await startRun(optionId, { draws: 5 });
    const second = await startRun(optionId, { draws: 5 });
    let claimedMeanwhile: string | undefined;
    await t.database.db.transaction(async (tx) => {
      await tx.select({ id: runs.id }).from(runs).where(eq(runs.id, first)).for('update');
      claimedMeanwhile = (await otherQueue('worker-c').claim())?.id;
    });
    expect(claimedMeanwhile).toBe(second);
    expect((await row(first)).status).toBe('queued');
  });

  it('a run whose lease expired (its server stopped mid-run) is taken up again and finished', async () => {
    const optionId = await createOption(baseline);
    const id = await startRun(optionId, { draws: 20 });
    const stopped = otherQueue('stopped-server', 60_000);
    expect((await stopped.claim())?.id).toBe(id);
    const next = otherQueue('next-server');
    // the lease still holds: nobody else takes it
    expect(await next.drain()).toBe(0);
    await t.database.db.update(runs).set({ leaseExpiresAt: new Date(Date.now() - 1000) }).where(eq(runs.id, id));
    expect(await next.drain()).toBe(1);
    const run = await row(id);
    expect(run).toMatchObject({ status: 'done', attempts: 2, leaseOwner: null, progressDone: 20 });
    expect(run.result).toHaveProperty('uncertainty.draws', 20);
  }, 120_000);
});

describe('following a run', () => {
  it('lists an option\'s runs and streams progress and status as server-sent events until done', async () => {
    const optionId = await createOption(baseline);
    const id = await startRun(optionId, { draws: 400, cv: 0.25, seed: 9 });
    expect((await baseline.analyst.get(`/api/options/${optionId}/runs`)).body).toMatchObject({ total: 1, items: [{ id, status: 'queued' }] });
    const [stream] = await Promise.all([baseline.analyst.get(`/api/runs/${id}/events`).buffer(true).parse(text), t.runQueue.drain()]);
    expect(stream.status).toBe(200);
    expect(stream.headers['content-type']).toMatch(/^text\/event-stream/);
    const events = (stream.body as string)
      .trim()
      .split('\n\n')
      .map((block) => ({ event: /^event: (\w+)/.exec(block)![1], data: JSON.parse(/\ndata: (.*)$/.exec(block)![1]!) as RunSummary }));
    // the queue may have taken the run before the stream's first look
    expect(events[0]!.event).toBe('status');
    expect(['queued', 'running']).toContain(events[0]!.data.status);
    expect(events.at(-1)).toMatchObject({ event: 'status', data: { status: 'done', progress: { done: 400, total: 400 } } });
    const done = events.map((e) => e.data.progress.done);
    expect(done).toEqual([...done].sort((x, y) => x - y));
    expect((await baseline.analyst.get('/api/runs/no-such-run/events')).status).toBe(404);
  }, 120_000);
});

/** The event stream's text as the body (superagent hands the parser the Node response stream). */
function text(response: unknown, callback: (error: Error | null, body: string) => void): void {
  const stream = response as IncomingMessage;
  let body = '';
  stream.setEncoding('utf8');
  stream.on('data', (chunk: string) => (body += chunk));
  stream.on('end', () => callback(null, body));
}

async function until(condition: () => Promise<boolean>, timeoutMs = 60_000): Promise<void> {
  const started = Date.now();
  while (!(await condition())) {
    if (Date.now() - started > timeoutMs) throw new Error('condition not met in time');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
