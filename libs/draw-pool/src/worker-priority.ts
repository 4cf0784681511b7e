import { constants, setPriority } from 'node:os';

/**
 * Called first by every worker file: the worker thread lowers its own scheduling priority (on
 * Linux the nice value is per thread), so that on a machine with few cores the thread answering
 * requests gets the processor ahead of the engine's work — /api/health answers at once while
 * every worker computes. Never call it on the main thread. Where the system refuses, the worker
 * keeps normal priority.
 */
export function lowerWorkerPriority(): void {
  try {
    setPriority(0, constants.priority.PRIORITY_BELOW_NORMAL);
  } catch {
    // not permitted here: normal priority
  }
}
