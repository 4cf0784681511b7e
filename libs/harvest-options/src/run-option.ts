import type { Analysis, HarvestOption, Web } from '@seinework/contracts';
import { analyze, createNetwork, requireAnalysable, toWeb, type AnalyzeOptions } from '@seinework/network-analysis';
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
    return { baseline, option: baseline, difference: difference(baseline, baseline), web: structuredClone(web) };
  }
  const optionNetwork = applyOption(network, option);
  const analysis = analyze(optionNetwork, options);
  return {
    baseline,
    option: analysis,
    difference: difference(baseline, analysis),
    web: toWeb(optionNetwork, `${web.name} — option "${option.name}"`),
  };
}
