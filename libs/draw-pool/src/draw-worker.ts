import { runDraws, type DrawJob, type DrawOutcome } from '@seinework/harvest-options';

/** Worker-thread entry of the draw pool: runs one chunk of draws with the shared engine. */
export default function drawChunk(job: DrawJob): DrawOutcome[] {
  return runDraws(job);
}
