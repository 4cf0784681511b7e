import type { BalanceChange, BalancePreview } from '@seinework/contracts';
import { balanceNetwork, isBalanced, toWeb, type BalancingMethod, type Flux, type Network } from '@seinework/network-analysis';

/**
 * The editor's "balance and see what changed": the engine balances the web (METHODS.md §7) and
 * each number it changed is listed with its value before and after. Nothing is stored.
 */

/** Changes smaller than this share of the number are rounding, not a change to show. */
const UNCHANGED = 1e-12;

export function balancePreview(network: Network, method: BalancingMethod): BalancePreview {
  const balanced = balanceNetwork(network, { method });
  const changes: BalanceChange[] = [];
  balanced.fluxes.forEach((after, k) => {
    const before = network.fluxes[k] as Flux | undefined;
    const was = before?.value ?? 0;
    if (Math.abs(after.value - was) <= UNCHANGED * Math.max(Math.abs(was), Math.abs(after.value))) return;
    changes.push({
      kind: after.kind,
      from: after.from < 0 ? null : network.ids[after.from],
      to: after.to < 0 ? null : network.ids[after.to],
      fleet: after.fleet ?? null,
      before: was,
      after: after.value,
    });
  });
  return { method, wasBalanced: isBalanced(network), web: toWeb(balanced), changes };
}
