import type { DrawPool } from '@seinework/draw-pool';
import { optionUncertainty } from '@seinework/harvest-options';
import type { Db } from '../db/database';
import type { RunInputs } from '../db/schema';
import type { EngineJobs } from '../engine/engine-jobs';
import { readWeb } from '../webs/version-rows';

/**
 * A run's result document, as the `scenario` command prints it (tools/scenario.ts):
 * `{baseline, option, difference, web}` of the deterministic run, plus `uncertainty` when draws
 * were asked for. The deterministic run goes to an engine worker (every table kept), the draws
 * to the server's draw pool in chunks, whose progress is reported; `signal` drops the chunks not
 * yet run and stops the running ones. Same inputs and seed, same document, bit for bit: each
 * draw's seed depends only on (seed, draw index) and the summary is taken in draw order.
 */

export interface RunComputation {
  readonly engine: EngineJobs;
  readonly drawPool: DrawPool;
}

export async function computeRun(
  db: Db,
  { engine, drawPool }: RunComputation,
  inputs: RunInputs,
  signal: AbortSignal,
  onProgress: (done: number, total: number) => void,
): Promise<unknown> {
  const web = await readWeb(db, inputs.versionId);
  const document = JSON.parse((await engine.runOptionOffThread(web, inputs.option, { tables: 'all', signal })).toString('utf8')) as Record<string, unknown>;
  if (!inputs.uncertainty) return document;
  signal.throwIfAborted();
  const uncertainty = await optionUncertainty(web, inputs.option, inputs.uncertainty, { pool: drawPool.withSignal(signal), onProgress });
  // as printed: through JSON, so the stored document equals the command's output
  return { ...document, uncertainty: JSON.parse(JSON.stringify(uncertainty)) };
}
