import type { Analysis, FleetSummary, HarvestOption, Web } from '@seinework/contracts';
import { analyze, createNetwork, fishingInBalance, ownValue, requireAnalysable, toWeb, type AnalyzeOptions } from '@seinework/network-analysis';
import { applyOption } from './apply-option';
import { difference, type DifferenceMap } from './difference';

/**
 * One harvest option end to end (METHODS.md §8 and §11): the baseline analysis, the balanced
 * option web under the option's response rule, its analysis, and option − baseline.
 */

export interface OptionRun {
  readonly baseline: Analysis;
  readonly option: Analysis;
  readonly difference: DifferenceMap;
  /** The balanced option web in WEB.json form; the input web itself when there is no adjustment. */
  readonly web: Web;
}

export function runOption(web: Web, option: HarvestOption, options: AnalyzeOptions = {}): OptionRun {
  const network = createNetwork(web);
  requireAnalysable(network);
  const baseline = analyze(network, options);
  if (option.adjustments.length === 0) {
    return { baseline, option: baseline, difference: differenceWithFib(baseline, baseline), web: structuredClone(web) };
  }
  const optionNetwork = applyOption(network, option);
  const analysis = analyze(optionNetwork, options);
  return {
    baseline,
    option: analysis,
    difference: differenceWithFib(baseline, analysis),
    web: toWeb(optionNetwork, `${web.name} — option "${option.name}"`),
  };
}

/**
 * option − baseline, plus the Fishing-in-Balance index of the option against the baseline
 * (METHODS.md §9; Pauly, Christensen & Walters 2000, ICES J. Mar. Sci. 57:697-706, TE = 0.1) for
 * the whole catch and per fleet: 0 when a change in catch is what the change in its mean trophic
 * level would yield. null where either side lands nothing.
 */
export function differenceWithFib(baseline: Analysis, option: Analysis): DifferenceMap {
  const result = difference(baseline, option);
  result['fishingInBalance'] = fib(baseline.totalCatch, baseline.meanTrophicLevelOfCatch, option.totalCatch, option.meanTrophicLevelOfCatch);
  const fleets = (ownValue(result, 'fleets') ?? {}) as Record<string, Record<string, unknown>>;
  for (const [name, change] of Object.entries(fleets)) {
    const before = ownValue(baseline.fleets, name) as FleetSummary | undefined;
    const after = ownValue(option.fleets, name) as FleetSummary | undefined;
    change['fishingInBalance'] = fib(before?.catch ?? 0, before?.meanTrophicLevelOfCatch ?? null, after?.catch ?? 0, after?.meanTrophicLevelOfCatch ?? null);
  }
  return result;
}

function fib(catchBefore: number, levelBefore: number | null, catchAfter: number, levelAfter: number | null): number | null {
  if (!(catchBefore > 0 && catchAfter > 0) || levelBefore === null || levelAfter === null) return null;
  return fishingInBalance(catchAfter, levelAfter, catchBefore, levelBefore);
}
