import type { DrawJob, DrawOutcome, DrawRunner } from '@seinework/harvest-options';
import { createWorkerPool, type WorkerPool } from './worker-pool';

/**
 * Worker threads for the Monte Carlo draws of a harvest option (METHODS.md §8): the Node-only half
 * of uncertainty, kept out of the pure engine. The server starts one pool for its lifetime; the
 * CLI starts one per run. Each worker runs chunks with the same engine as in process.
 */

/**
 * A chunk whose web travels as JSON text: a server posts one string per chunk instead of copying
 * a large web's object graph on the thread that answers requests.
 */
export interface SerialisedDrawJob extends Omit<DrawJob, 'web'> {
  readonly webJson: string;
}

export type PoolDrawJob = DrawJob | SerialisedDrawJob;

export interface DrawPool extends DrawRunner {
  /** The same workers, for one request: its chunks are dropped or stopped when `signal` aborts. */
  withSignal(signal: AbortSignal): DrawRunner;
  /** One chunk given as text, dropped or stopped when `signal` aborts. */
  runSerialised(job: SerialisedDrawJob, signal?: AbortSignal): Promise<DrawOutcome[]>;
  /** Chunks waiting for a worker now. */
  readonly queueSize: number;
  /** Chunks that ran to the end (not aborted, not refused). */
  readonly finished: number;
  destroy(): Promise<void>;
}

export interface DrawPoolSettings {
  /**
   * Chunks that may wait for a worker (default 200: four requests of the most draws the API
   * allows); one more is refused with QueueFullError.
   */
  readonly maxQueue?: number;
  /** Keep the workers running between runs (default); otherwise they stop when idle. */
  readonly keepAlive?: boolean;
}

export const DEFAULT_DRAW_QUEUE = 200;

export function createDrawPool(workers?: number, settings: DrawPoolSettings = {}): DrawPool {
  const pool: WorkerPool<PoolDrawJob, DrawOutcome[]> = createWorkerPool(new URL('./draw-worker.ts', import.meta.url), {
    threads: workers,
    maxQueue: settings.maxQueue ?? DEFAULT_DRAW_QUEUE,
    keepAlive: settings.keepAlive,
  });
  return {
    workers: pool.threads,
    run: (job) => pool.run(job),
    withSignal: (signal) => ({ workers: pool.threads, run: (job) => pool.run(job, signal) }),
    runSerialised: (job, signal) => pool.run(job, signal),
    get queueSize() {
      return pool.queueSize;
    },
    get finished() {
      return pool.finished;
    },
    destroy: () => pool.destroy(),
  };
}
