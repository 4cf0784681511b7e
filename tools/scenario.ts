import { parseHarvestOption, runOption, optionUncertainty } from '@seinework/harvest-options';
import { parseWeb } from '@seinework/network-analysis';
import { readJsonFile, runCommand } from './cli';

// npm run --silent scenario -- WEB.json OPTION.json  (METHODS.md §8 and §11)
await runCommand('scenario', async () => {
  const web = parseWeb(readJsonFile(process.argv[2], 'web'));
  const option = parseHarvestOption(readJsonFile(process.argv[3], 'option'));
  const run = runOption(web, option);
  if (!option.uncertainty) return run;
  return { ...run, uncertainty: await optionUncertainty(web, option, option.uncertainty) };
});
