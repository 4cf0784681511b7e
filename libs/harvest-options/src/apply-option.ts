import type { Adjustment, ResponseRule } from '@seinework/contracts';
import type { Network } from '@seinework/network-analysis';
import { bottomUpResponse } from './bottom-up';
import { leastChangeResponse } from './least-change-response';
import { planOption } from './option-web';

/**
 * The balanced option web of METHODS.md §8: the adjustments' targets on the baseline, then the
 * response rule (bottom-up by default, or least change). The engine both the deterministic run,
 * the Monte Carlo draws and the harvest sensitivity share.
 */

export interface OptionSpec {
  readonly response?: ResponseRule;
  readonly adjustments: readonly Adjustment[];
}

/** With no adjustments the baseline itself is the option web (not a recomputation of it). */
export function applyOption(baseline: Network, option: OptionSpec): Network {
  if (option.adjustments.length === 0) return baseline;
  const plan = planOption(baseline, option.adjustments);
  return (option.response ?? 'bottom-up') === 'least-change' ? leastChangeResponse(plan) : bottomUpResponse(plan);
}
