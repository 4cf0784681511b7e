import { availableParallelism } from 'node:os';
import { createRequire } from 'node:module';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';

/**
 * A bounded pool of worker threads on piscina, for the engine's heavy work (draws, analyses), so
 * that the thread answering requests never computes. At most `maxQueue` tasks wait for a worker;
 * one more is refused with QueueFullError (the server answers 503 with Retry-After) instead of
 * waiting behind abandoned work. A task given an AbortSignal leaves the queue when it is aborted,
 * or has its worker stopped if it is already running.
 */

export interface WorkerPoolSettings {
  /** Worker threads (default: one per core). */
  readonly threads?: number;
  /** Tasks that may wait for a free worker. */
  readonly maxQueue: number;
  /**
   * Keep the workers running between tasks (a server's pool, stopped with destroy()); otherwise
   * they start on demand and stop when idle, so a pool nobody destroys never holds a process open.
   */
  readonly keepAlive?: boolean;
}

export interface WorkerPool<Task, Result> {
  readonly threads: number;
  run(task: Task, signal?: AbortSignal): Promise<Result>;
  /** Tasks waiting for a worker now. */
  readonly queueSize: number;
  /** Tasks that ran to the end (not aborted, not refused). */
  readonly finished: number;
  destroy(): Promise<void>;
}

/** Every worker is busy and the queue is full. */
export class QueueFullError extends Error {
  constructor() {
    super('Every worker is busy and the queue is full');
    this.name = 'QueueFullError';
  }
}

/** The task was aborted (its signal fired) before it finished. */
export function isAbortError(error: unknown): boolean {
  return error instanceof Error && error.name === 'AbortError';
}

const QUEUE_FULL_MESSAGES = new Set(['Task queue is at limit', 'No task queue available and all Workers are busy']);

/** `workerFile`: a TypeScript module whose default export runs one task. */
export function createWorkerPool<Task, Result>(workerFile: URL, settings: WorkerPoolSettings): WorkerPool<Task, Result> {
  const threads = Math.max(1, Math.floor(settings.threads ?? availableParallelism()));
  const keepAlive = settings.keepAlive ?? true;
  const pool = new Piscina({
    filename: fileURLToPath(workerFile),
    // the worker file is TypeScript: load it through tsx, in the tsx CLI and under vitest alike
    execArgv: ['--import', pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href],
    env: { ...process.env, TSX_TSCONFIG_PATH: process.env['TSX_TSCONFIG_PATH'] ?? fileURLToPath(new URL('../../../tsconfig.json', import.meta.url)) },
    minThreads: keepAlive ? threads : 0,
    maxThreads: threads,
    idleTimeout: keepAlive ? Infinity : 1_000,
    maxQueue: settings.maxQueue,
  });
  let finished = 0;
  return {
    threads,
    run: async (task, signal) => {
      // checked here too: piscina queues tasks that carry a signal apart, past its own maxQueue
      if (pool.queueSize >= settings.maxQueue) throw new QueueFullError();
      try {
        const result = (await pool.run(task, signal ? { signal } : {})) as Result;
        finished++;
        return result;
      } catch (error) {
        if (error instanceof Error && QUEUE_FULL_MESSAGES.has(error.message)) throw new QueueFullError();
        throw error;
      }
    },
    get queueSize() {
      return pool.queueSize;
    },
    get finished() {
      return finished;
    },
    destroy: () => pool.destroy(),
  };
}
