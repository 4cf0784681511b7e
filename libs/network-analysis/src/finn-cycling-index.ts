import type { Network } from './network';
import { requireAnalysable } from './balance-check';
import { diagonalOfInverseOfIdentityMinus } from './linear-algebra';

/**
 * Finn cycling index (Finn 1976, J. theor. Biol. 56:363-380; Finn 1980), METHODS.md §5.
 * With output fractions F_ij = T_ij / T_i and M = (I − F)⁻¹, M_ii is the expected number of
 * visits to i of a unit entering i, so 1 − 1/M_ii is the chance that it comes back: the cycled
 * part of i's throughflow is T_i (1 − 1/M_ii). FCI = Σ cycled / Σ T_i, the denominator being
 * the sum of throughflows (TST in Finn's sense), and Finn's ratio TST_c / (TST − TST_c).
 */

export interface FinnCycling {
  finnCyclingIndex: number;
  /** T_i (1 − 1/M_ii), per compartment. */
  cycledThroughflow: number[];
  /** TST_c = Σ_i cycledThroughflow_i. */
  totalCycledThroughflow: number;
  /** TST_c / (TST − TST_c). */
  cycledToStraightRatio: number;
}

/**
 * `passesThrough` (the diagonal of M, as `dependencies()` already computes it) spares a second
 * matrix inverse when the whole analysis runs; without it M is computed here.
 */
export function finnCycling(network: Network, passesThrough: readonly number[] = diagonalOfM(network)): FinnCycling {
  requireAnalysable(network);
  const { throughflow } = network;
  const cycledThroughflow = throughflow.map((Ti, i) => Ti * (1 - 1 / passesThrough[i]));
  const totalCycledThroughflow = cycledThroughflow.reduce((s, c) => s + c, 0);
  const tst = throughflow.reduce((s, t) => s + t, 0);
  return {
    finnCyclingIndex: tst > 0 ? totalCycledThroughflow / tst : 0,
    cycledThroughflow,
    totalCycledThroughflow,
    cycledToStraightRatio: tst > totalCycledThroughflow ? totalCycledThroughflow / (tst - totalCycledThroughflow) : 0,
  };
}

function diagonalOfM(network: Network): number[] {
  const { T, throughflow } = network;
  // A compartment with no throughflow passes nothing on: its row of F is zero.
  const F = T.map((row, i) => row.map((t) => (throughflow[i] > 0 ? t / throughflow[i] : 0)));
  return diagonalOfInverseOfIdentityMinus(F, 'the Finn cycling index, M = (I − F)⁻¹');
}
