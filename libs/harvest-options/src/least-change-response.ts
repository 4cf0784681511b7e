import { WebError, leastChangeBalance, type Network } from '@seinework/network-analysis';
import { withTargets, type OptionPlan } from './option-web';

/**
 * Least-change response of METHODS.md §8: every catch (targets and unadjusted ones, new fisheries
 * included) and every import into a producer is pinned; §7's least-change balance (weighted least
 * squares, Vézina & Platt 1988, Mar. Ecol. Prog. Ser. 42:269-287) moves every other existing flux as
 * little as it can. Zero fluxes stay zero, so no new link appears and none goes negative.
 */

export interface LeastChangeResponseOptions {
  /** cv of fluxes that carry none, weighting how readily they move (the balancer's default otherwise). */
  readonly defaultCv?: number;
}

export function leastChangeResponse(plan: OptionPlan, options: LeastChangeResponseOptions = {}): Network {
  const { network } = plan;
  const pinned = new Set<number>(plan.catches.map((c) => c.flux));
  network.fluxes.forEach((f, k) => {
    if (f.kind === 'import' && network.kinds[f.to] === 'producer') pinned.add(k);
  });
  try {
    return leastChangeBalance(withTargets(plan), { pinned, defaultCv: options.defaultCv });
  } catch (error) {
    if (!(error instanceof WebError)) throw error;
    const adjusted = plan.catches.filter((c) => c.label.startsWith('adjustments[')).map((c) => c.label);
    const by = adjusted.length > 0 ? ` with ${adjusted.join(', ')}` : '';
    throw new WebError(
      'infeasible',
      error.problems.map((p) => `least-change response cannot balance the option web${by}: ${p}`),
    );
  }
}
