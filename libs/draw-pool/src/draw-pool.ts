import { availableParallelism } from 'node:os';
import { createRequire } from 'node:module';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import type { DrawJob, DrawOutcome, DrawRunner } from '@seinework/harvest-options';

/**
 * Worker threads for the Monte Carlo draws of a harvest option (METHODS.md §8), on piscina: the
 * Node-only half of uncertainty, kept out of the pure engine. The server starts one pool for its
 * lifetime; the CLI starts one per run. Each worker runs chunks with the same engine as in process.
 */

export interface DrawPool extends DrawRunner {
  destroy(): Promise<void>;
}

export function createDrawPool(workers = availableParallelism()): DrawPool {
  const threads = Math.max(1, Math.floor(workers));
  const pool = new Piscina({
    filename: fileURLToPath(new URL('./draw-worker.ts', import.meta.url)),
    // the worker file is TypeScript: load it through tsx, in the tsx CLI and under vitest alike
    execArgv: ['--import', pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href],
    env: { ...process.env, TSX_TSCONFIG_PATH: process.env['TSX_TSCONFIG_PATH'] ?? fileURLToPath(new URL('../../../tsconfig.json', import.meta.url)) },
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: Infinity,
  });
  return {
    workers: threads,
    run: (job: DrawJob) => pool.run(job) as Promise<DrawOutcome[]>,
    destroy: () => pool.destroy(),
  };
}
