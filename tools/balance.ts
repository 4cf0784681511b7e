import { BALANCING_METHODS, balanceNetwork, createNetwork, parseWeb, toWeb, type BalancingMethod } from '@seinework/network-analysis';
import { InputError, readJsonFile, runCommand } from './cli';

// npm run --silent balance -- WEB.json [input|output|average|least-change]   (METHODS.md §7)
// Prints the balanced web in WEB.json form; a web that is already balanced comes back unchanged.
await runCommand('balance', () => {
  const method = process.argv[3] ?? 'least-change';
  if (!isBalancingMethod(method)) {
    throw new InputError(`unknown balancing method "${method}" (methods: ${BALANCING_METHODS.join(', ')})`);
  }
  const network = createNetwork(parseWeb(readJsonFile(process.argv[2], 'web')));
  return toWeb(balanceNetwork(network, { method }));
});

function isBalancingMethod(method: string): method is BalancingMethod {
  return (BALANCING_METHODS as readonly string[]).includes(method);
}
