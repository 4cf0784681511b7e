import { runDraws, type DrawOutcome } from '@seinework/harvest-options';
import type { PoolDrawJob } from './draw-pool';
import { lowerWorkerPriority } from './worker-priority';

lowerWorkerPriority();

/** Worker-thread entry of the draw pool: runs one chunk of draws with the shared engine. */
export default function drawChunk(job: PoolDrawJob): DrawOutcome[] {
  if (!('webJson' in job)) return runDraws(job);
  const { webJson, ...rest } = job;
  return runDraws({ ...rest, web: JSON.parse(webJson) });
}
