import fc from 'fast-check';
import type { Adjustment, Web } from '@seinework/contracts';
import { createNetwork } from '@seinework/network-analysis';
import { balancedWeb } from '../../../network-analysis/src/testing/arbitraries';

/**
 * fast-check arbitraries of a balanced generated web with a valid set of adjustments on it: scale
 * or set existing catches (moderate increases, any cut), close a fleet, open a new fishery on a
 * consumer at a tenth of its throughflow, scale a producer's production. No two adjustments
 * contradict each other.
 */
export interface WebWithAdjustments {
  readonly web: Web;
  readonly adjustments: Adjustment[];
}

export function webWithAdjustments(options: { min?: number; max?: number } = {}): fc.Arbitrary<WebWithAdjustments> {
  return balancedWeb({ min: options.min ?? 4, max: options.max ?? 15 }).chain((web) => {
    const network = createNetwork(web);
    const catches = web.exports.filter((e) => e.fleet !== undefined && e.value > 0);
    const consumers = web.compartments.filter((c) => c.kind === 'consumer');
    const producers = web.compartments.filter((c) => c.kind === 'producer' && network.z[network.index.get(c.id)!] > 0);
    const onCatch = catches.map((e) =>
      fc.oneof(
        // a cut deeper than 99.9 % is a closure in practice; the fuzz properties cover cuts to almost nothing
        fc.double({ min: -100, max: 30, noNaN: true }).map((percent): Adjustment => ({ type: 'scale-catch', fleet: e.fleet!, compartment: e.from, percent: percent < -99.9 ? -100 : percent })),
        fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 1.3, noNaN: true })).map((share): Adjustment => ({ type: 'set-catch', fleet: e.fleet!, compartment: e.from, amount: share * e.value })),
        fc.constant<Adjustment | null>(null),
      ),
    );
    const open = consumers.length === 0
      ? fc.constant(null)
      : fc.option(
          fc.constantFrom(...consumers).map((c): Adjustment => ({
            type: 'open-fishery',
            fleet: 'new-fleet',
            compartment: c.id,
            amount: 0.1 * network.throughflow[network.index.get(c.id)!],
          })),
        );
    const production = producers.length === 0
      ? fc.constant(null)
      : fc.option(
          fc.record({ c: fc.constantFrom(...producers), percent: fc.double({ min: -50, max: 50, noNaN: true }) })
            .map(({ c, percent }): Adjustment => ({ type: 'scale-production', compartment: c.id, percent })),
        );
    const close = fc.option(fc.constantFrom(...new Set(catches.map((e) => e.fleet!)), 'none'));
    return fc.tuple(fc.tuple(...onCatch), open, production, close).map(([catchAdjustments, opened, scaled, closed]) => {
      const closing = closed && closed !== 'none' ? closed : null;
      const adjustments: Adjustment[] = (catchAdjustments as (Adjustment | null)[]).filter(
        (a): a is Adjustment => a !== null && !(closing !== null && 'fleet' in a && a.fleet === closing),
      );
      if (closing !== null) adjustments.push({ type: 'close-fleet', fleet: closing });
      if (opened) adjustments.push(opened);
      if (scaled) adjustments.push(scaled);
      return { web, adjustments };
    });
  });
}
