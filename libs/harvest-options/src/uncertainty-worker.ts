import { runDraws, type DrawJob, type DrawOutcome } from './uncertainty-draw';

/** Worker-thread entry of the Monte Carlo pool: runs one chunk of draws with the shared engine. */
export default function drawChunk(job: DrawJob): DrawOutcome[] {
  return runDraws(job);
}
