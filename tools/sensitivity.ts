import { responseRuleSchema } from '@seinework/contracts';
import { harvestSensitivity } from '@seinework/harvest-options';
import { createNetwork, parseWeb } from '@seinework/network-analysis';
import { InputError, readJsonFile, runCommand } from './cli';

// npm run --silent sensitivity -- WEB.json [bottom-up|least-change]
// The change of every scalar indicator per +1 % of each catch, a balanced finite difference (METHODS.md §8).
await runCommand('sensitivity', () => {
  const response = responseRuleSchema.safeParse(process.argv[3] ?? 'bottom-up');
  if (!response.success) throw new InputError(`unknown response rule "${process.argv[3]}" (bottom-up or least-change)`);
  return harvestSensitivity(createNetwork(parseWeb(readJsonFile(process.argv[2], 'web'))), response.data);
});
