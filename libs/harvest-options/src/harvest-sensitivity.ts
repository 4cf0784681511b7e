import { SCALAR_INDICATORS, type ResponseRule, type ScalarIndicators } from '@seinework/contracts';
import {
  fisheryIndicators,
  requireAnalysable,
  scalarIndicators,
  trophicLevels,
  WebError,
  type Network,
} from '@seinework/network-analysis';
import { applyOption } from './apply-option';
import type { ScalarKey } from './uncertainty';

/**
 * Harvest sensitivity (built on METHODS.md §8 and §1): for every existing fleet × compartment
 * catch, the change of each scalar indicator per +1 % of that catch — a balanced finite difference
 * (the option web of a 1 % increase under the chosen response rule against the baseline), not the
 * local gradient ∂F/∂X of §1, which leaves the web unbalanced. Sorted views show which catches move
 * the web toward the fitness peak (a = 1/e; Ulanowicz et al. 2009, Ecol. Complexity 6:27-36) and
 * which move catch value.
 */

export interface CatchSensitivity {
  readonly fleet: string;
  readonly compartment: string;
  readonly catch: number;
  /** option − baseline of each scalar for +1 % of this catch; null where a side has no value. null when refused. */
  readonly perPercent: Record<ScalarKey, number | null> | null;
  /** Change of |a − 1/e|: negative moves the web toward the fitness peak. */
  readonly distanceFromPeakChange: number | null;
  /** Change of the total catch value (tonnes × price); null where the web gives no area, tonnes per unit or prices. */
  readonly catchValueChange: number | null;
  /** Why +1 % could not be applied (e.g. the compartment cannot supply it). */
  readonly refused?: string;
}

export interface HarvestSensitivity {
  readonly response: ResponseRule;
  readonly rows: CatchSensitivity[];
  /** Most toward the fitness peak first; refused rows last. */
  readonly byRobustness: CatchSensitivity[];
  /** Largest gain of catch value first; rows without a value last. */
  readonly byCatchValue: CatchSensitivity[];
}

const PEAK = 1 / Math.E;
const STEP_PERCENT = 1;

export function harvestSensitivity(network: Network, response: ResponseRule = 'bottom-up'): HarvestSensitivity {
  requireAnalysable(network);
  const baseline = measures(network);
  const rows = network.fluxes.flatMap((f): CatchSensitivity[] => {
    if (f.fleet === undefined || !(f.value > 0)) return [];
    const fleet = f.fleet;
    const compartment = network.ids[f.from];
    try {
      const option = measures(applyOption(network, { response, adjustments: [{ type: 'scale-catch', fleet, compartment, percent: STEP_PERCENT }] }));
      return [{
        fleet,
        compartment,
        catch: f.value,
        perPercent: perPercent(baseline.scalars, option.scalars),
        distanceFromPeakChange: (Math.abs(option.scalars.relativeAscendency - PEAK) - Math.abs(baseline.scalars.relativeAscendency - PEAK)) / STEP_PERCENT,
        catchValueChange: baseline.value === null || option.value === null ? null : (option.value - baseline.value) / STEP_PERCENT,
      }];
    } catch (error) {
      if (!(error instanceof WebError)) throw error;
      return [{ fleet, compartment, catch: f.value, perPercent: null, distanceFromPeakChange: null, catchValueChange: null, refused: error.problems.join('; ') }];
    }
  });
  return {
    response,
    rows,
    byRobustness: sortedBy(rows, (row) => row.distanceFromPeakChange),
    byCatchValue: sortedBy(rows, (row) => (row.catchValueChange === null ? null : -row.catchValueChange)),
  };
}

function measures(network: Network): { scalars: ScalarIndicators; value: number | null } {
  return { scalars: scalarIndicators(network), value: fisheryIndicators(network, trophicLevels(network).levels).totalValue };
}

function perPercent(before: ScalarIndicators, after: ScalarIndicators): Record<ScalarKey, number | null> {
  return Object.fromEntries(
    SCALAR_INDICATORS.map((key) => [key, before[key] === null || after[key] === null ? null : (after[key]! - before[key]!) / STEP_PERCENT]),
  ) as Record<ScalarKey, number | null>;
}

/** Ascending by key, rows without one last, ties in flux order. */
function sortedBy(rows: readonly CatchSensitivity[], key: (row: CatchSensitivity) => number | null): CatchSensitivity[] {
  return rows
    .map((row, order) => ({ row, order, k: key(row) }))
    .sort((a, b) => (a.k === null ? (b.k === null ? a.order - b.order : 1) : b.k === null ? -1 : a.k - b.k || a.order - b.order))
    .map(({ row }) => row);
}
