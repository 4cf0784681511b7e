import { createDrawPool } from '@seinework/draw-pool';
import { parseHarvestOption, runOption, optionUncertainty } from '@seinework/harvest-options';
import { parseWeb } from '@seinework/network-analysis';
import { readJsonFile, runCommand } from './cli';

// npm run --silent scenario -- WEB.json OPTION.json  (METHODS.md §8 and §11)
await runCommand('scenario', async () => {
  const web = parseWeb(readJsonFile(process.argv[2], 'web'));
  const option = parseHarvestOption(readJsonFile(process.argv[3], 'option'));
  const run = runOption(web, option);
  if (!option.uncertainty) return run;
  // draws on every core; the pool is started for this run only
  const pool = createDrawPool();
  try {
    return { ...run, uncertainty: await optionUncertainty(web, option, option.uncertainty, { pool }) };
  } finally {
    await pool.destroy();
  }
});
