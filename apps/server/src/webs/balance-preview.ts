import type { BalanceChange, BalancePreview, Web } from '@seinework/contracts';

/**
 * The editor's "balance and see what changed": the engine balances the web (METHODS.md §7, on a
 * worker) keeping every flow, import, export and respiration in place, and each number it changed
 * is listed here with its value before and after. Nothing is stored.
 */

/** Changes smaller than this share of the number are rounding, not a change to show. */
const UNCHANGED = 1e-12;

export function balanceChanges(before: Web, after: Web): BalanceChange[] {
  const changes: BalanceChange[] = [];
  const compare = (kind: BalanceChange['kind'], was: { value: number } | undefined, now: { value: number; from?: string; to?: string; fleet?: string }) => {
    const old = was?.value ?? 0;
    if (Math.abs(now.value - old) <= UNCHANGED * Math.max(Math.abs(old), Math.abs(now.value))) return;
    changes.push({ kind, from: now.from ?? null, to: now.to ?? null, fleet: now.fleet ?? null, before: old, after: now.value });
  };
  after.flows.forEach((f, k) => compare('flow', before.flows[k], f));
  after.imports.forEach((f, k) => compare('import', before.imports[k], f));
  after.exports.forEach((f, k) => compare('export', before.exports[k], f));
  after.respiration.forEach((f, k) => compare('respiration', before.respiration[k], f));
  return changes;
}

export function balancePreview(before: Web, balanced: Omit<BalancePreview, 'changes'>): BalancePreview {
  return { ...balanced, changes: balanceChanges(before, balanced.web) };
}
