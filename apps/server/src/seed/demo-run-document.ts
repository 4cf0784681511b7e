import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { optionUncertainty, runOption, type DrawRunner } from '@seinework/harvest-options';
import type { Db } from '../db/database';
import type { RunInputs } from '../db/schema';
import { readWeb } from '../webs/version-rows';

/** The engine's version as runs record it: the package's. */
export const ENGINE_VERSION = `seinework ${(JSON.parse(readFileSync(resolve(import.meta.dirname, '../../../../package.json'), 'utf8')) as { version: string }).version}`;

/**
 * A run's result document, computed as the `scenario` command computes it (tools/scenario.ts):
 * `{baseline, option, difference, web}` of the deterministic run, plus `uncertainty` when draws are
 * asked for; the draws on the pool when one is given.
 */
export async function computeRunDocument(db: Db, inputs: RunInputs, pool?: DrawRunner): Promise<unknown> {
  const web = await readWeb(db, inputs.versionId);
  const option = { ...inputs.option, ...(inputs.uncertainty ? { uncertainty: inputs.uncertainty } : {}) };
  const run = runOption(web, option);
  const document = inputs.uncertainty ? { ...run, uncertainty: await optionUncertainty(web, option, inputs.uncertainty, { pool }) } : run;
  // as printed: JSON, so the stored document equals the command's output
  return JSON.parse(JSON.stringify(document));
}
