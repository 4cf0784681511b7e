import { EventEmitter, setMaxListeners } from 'node:events';
import { randomUUID } from 'node:crypto';
import { and, asc, eq, lt, or, sql } from 'drizzle-orm';
import type { Express } from 'express';
import { WebError } from '@seinework/network-analysis';
import type { Db } from '../db/database';
import { runs } from '../db/schema';
import { computeRun, type RunComputation } from './run-computation';

/**
 * The queue of harvest-option runs: the runs table itself. A worker loop claims the oldest waiting
 * run — queued, or running under a lease that expired (its server stopped mid-run) — with
 * `SELECT … FOR UPDATE SKIP LOCKED` in a transaction, so that several server processes on one
 * PostgreSQL never take the same run: a row one claimer holds locked is skipped by the others, and
 * the claim sets status, lease owner and expiry before the lock is released. While it computes, the
 * worker renews its lease (heartbeat), writes progress at most every PROGRESS_MS and reads
 * `cancel_requested`; a cancellation aborts the draws between chunks. Every write of the worker
 * is conditioned on still holding the lease, so a worker whose run was taken up again by another
 * (its lease ran out) changes nothing.
 */

export interface RunQueueSettings extends RunComputation {
  readonly db: Db;
  /** This process's name on the leases it holds (default: a random one). */
  readonly owner?: string;
  /** How long a lease lasts without a heartbeat (default 30 s). */
  readonly leaseMs?: number;
  /** How often an idle worker looks for waiting runs (default 1 s); a run started here is taken at once. */
  readonly pollMs?: number;
}

export interface RunQueue {
  readonly owner: string;
  /** Starts the worker loop (one run at a time: its draws already use every core). */
  start(): void;
  /** Stops the loop: the run being computed goes back to the queue, unless `finish` lets it end first. */
  stop(options?: { finish?: boolean }): Promise<void>;
  /** Computes waiting runs until none is left (tests; the loop need not run). Returns how many it took. */
  drain(): Promise<number>;
  /** Claims and computes one waiting run; false if none was waiting. */
  runOne(): Promise<boolean>;
  /** Claims one waiting run without computing it (tests of the claim). */
  claim(): Promise<ClaimedRun | undefined>;
  /** Wakes the loop: a run was queued, or a cancellation was asked for. */
  notify(runId?: string): void;
  /** In-process news of runs (status or progress changed): listeners get the run id. */
  readonly events: EventEmitter<{ changed: [runId: string] }>;
}

export type ClaimedRun = typeof runs.$inferSelect;

/** Why a computation stopped early: a cancellation, a lease another worker took over, the server stopping. */
type StopReason = 'cancelled' | 'lost' | 'stopping';

/** Progress is written to the row at most this often. */
export const PROGRESS_MS = 250;
const DEFAULT_LEASE_MS = 30_000;
const DEFAULT_POLL_MS = 1_000;

export function createRunQueue(settings: RunQueueSettings): RunQueue {
  const { db } = settings;
  const owner = settings.owner ?? `server-${randomUUID()}`;
  const leaseMs = settings.leaseMs ?? DEFAULT_LEASE_MS;
  const pollMs = settings.pollMs ?? DEFAULT_POLL_MS;
  const events = new EventEmitter<{ changed: [runId: string] }>();
  events.setMaxListeners(Infinity);
  let running = false;
  let loop: Promise<void> | undefined;
  let wake: (() => void) | undefined;
  let current: { id: string; stop: (why: StopReason) => void } | undefined;
  const cancelAsked = new Set<string>();

  const leaseUntil = () => new Date(Date.now() + leaseMs);
  const holding = (id: string) => and(eq(runs.id, id), eq(runs.leaseOwner, owner), eq(runs.status, 'running'));

  async function claim(): Promise<ClaimedRun | undefined> {
    return db.transaction(async (tx) => {
      const [waiting] = await tx
        .select({ id: runs.id })
        .from(runs)
        .where(or(eq(runs.status, 'queued'), and(eq(runs.status, 'running'), lt(runs.leaseExpiresAt, new Date()))))
        .orderBy(asc(runs.createdAt), asc(runs.id))
        .limit(1)
        .for('update', { skipLocked: true });
      if (!waiting) return undefined;
      const now = new Date();
      const [claimed] = await tx
        .update(runs)
        .set({ status: 'running', leaseOwner: owner, leaseExpiresAt: leaseUntil(), heartbeatAt: now, startedAt: now, progressDone: 0, attempts: sql`${runs.attempts} + 1` })
        .where(eq(runs.id, waiting.id))
        .returning();
      return claimed;
    });
  }

  /** Renews the lease, writes progress, and says whether a cancellation was asked for (false once the lease is lost). */
  async function heartbeat(id: string, done: number): Promise<{ held: boolean; cancel: boolean }> {
    const [row] = await db
      .update(runs)
      .set({ leaseExpiresAt: leaseUntil(), heartbeatAt: new Date(), progressDone: done })
      .where(holding(id))
      .returning({ cancel: runs.cancelRequested });
    events.emit('changed', id);
    return { held: row !== undefined, cancel: row?.cancel ?? false };
  }

  async function compute(run: ClaimedRun): Promise<void> {
    const abort = new AbortController();
    // the reason travels with the signal: the draw pool's chunks and the engine job stop on it
    const stop = (reason: StopReason) => abort.abort(reason);
    // every chunk of draws listens to it
    setMaxListeners(Infinity, abort.signal);
    current = { id: run.id, stop };
    events.emit('changed', run.id);
    const started = performance.now();
    let done = 0;
    let written = 0;
    let beating: Promise<void> = Promise.resolve();
    const beat = () => {
      beating = beating.then(async () => {
        written = Date.now();
        const { held, cancel } = await heartbeat(run.id, done);
        if (!held) stop('lost');
        else if (cancel) stop('cancelled');
      });
    };
    const timer = setInterval(beat, Math.max(PROGRESS_MS, Math.floor(leaseMs / 3)));
    timer.unref();
    try {
      if (cancelAsked.delete(run.id) || run.cancelRequested) stop('cancelled');
      const result = await computeRun(db, settings, run.inputs, abort.signal, (finished) => {
        done = finished;
        if (cancelAsked.delete(run.id)) stop('cancelled');
        // the abort is checked between chunks: the draw pool drops what is left
        if (Date.now() - written >= PROGRESS_MS) beat();
      });
      clearInterval(timer);
      await beating;
      if (abort.signal.aborted) throw new Error(`run ${String(abort.signal.reason)}`);
      await finish(run.id, { status: 'done', result, progressDone: run.draws, runMs: Math.round(performance.now() - started) });
    } catch (error) {
      clearInterval(timer);
      await beating.catch(() => undefined);
      const runMs = Math.round(performance.now() - started);
      const why = abort.signal.aborted ? (abort.signal.reason as StopReason) : undefined;
      if (why === 'cancelled') await finish(run.id, { status: 'cancelled', runMs, progressDone: done });
      // the server stops: back in the queue at once, for the next start (or another server) to take up
      else if (why === 'stopping') await release(run.id);
      // the lease was lost: the run is another worker's now, nothing to write
      else if (why === undefined) {
        await finish(run.id, { status: 'failed', error: failureMessage(error), runMs, progressDone: done });
      }
    } finally {
      current = undefined;
    }
  }

  async function finish(id: string, outcome: Partial<typeof runs.$inferInsert>): Promise<void> {
    await db
      .update(runs)
      .set({ ...outcome, finishedAt: new Date(), leaseOwner: null, leaseExpiresAt: null })
      .where(holding(id));
    events.emit('changed', id);
  }

  async function release(id: string): Promise<void> {
    await db.update(runs).set({ status: 'queued', progressDone: 0, leaseOwner: null, leaseExpiresAt: null }).where(holding(id));
    events.emit('changed', id);
  }

  async function runOne(): Promise<boolean> {
    const run = await claim();
    if (!run) return false;
    await compute(run);
    return true;
  }

  async function work(): Promise<void> {
    while (running) {
      let found = false;
      try {
        found = await runOne();
      } catch (error) {
        // the database went away for a moment, say: try again at the next poll
        console.error('Run queue:', error instanceof Error ? error.message : error);
      }
      if (found || !running) continue;
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, pollMs);
        wake = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      wake = undefined;
    }
  }

  return {
    owner,
    events,
    claim,
    runOne,
    start() {
      if (running) return;
      running = true;
      loop = work();
    },
    async stop({ finish: finishCurrent = false } = {}) {
      running = false;
      wake?.();
      if (!finishCurrent) current?.stop('stopping');
      await loop;
      loop = undefined;
    },
    async drain() {
      let count = 0;
      while (await runOne()) count++;
      return count;
    },
    notify(runId) {
      if (runId && current?.id === runId) cancelAsked.add(runId);
      wake?.();
    },
  };
}

/** The engine's refusal as it words it; anything else by its message. */
function failureMessage(error: unknown): string {
  if (error instanceof WebError) return error.problems.length > 0 ? error.problems.join('; ') : error.message;
  return error instanceof Error ? error.message : String(error);
}

/** The queue the app was built with (app.locals), for main.ts and the test harness. */
export function runQueueOf(app: Express): RunQueue {
  const queue = app.locals['runQueue'] as RunQueue | undefined;
  if (!queue) throw new Error('This app has no database, so no run queue');
  return queue;
}
