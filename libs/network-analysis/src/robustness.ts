import type { Network } from './network';
import { informationIndices } from './information-indices';
import { zeros } from './linear-algebra';

/**
 * Robustness (fitness) F = −a ln a of relative ascendency a, where the web sits on that curve, and
 * the local sensitivity of F to each internal flow (METHODS.md §1).
 * Source: Ulanowicz, Goerner, Lietaer & Gomez 2009, Ecol. Complexity 6:27-36; the gradient is
 * derived from the definitions of A and C (Ulanowicz 1986, *Growth and Development*).
 */

/** a < 1/e: more flexibility than constraint; a > 1/e: more constraint than flexibility. */
export type FitnessSide = 'flexibility' | 'constraint' | 'peak';

export interface FitnessPosition {
  relativeAscendency: number;
  robustness: number;
  /** F / (1/e): 1 at the peak. */
  shareOfPeak: number;
  side: FitnessSide;
}

/** The relative ascendency at the top of the fitness curve, 1/e (where dF/da = 0). */
export const FITNESS_PEAK_A = 1 / Math.E;
const PEAK = FITNESS_PEAK_A;
const PEAK_TOLERANCE = 1e-9;

export function robustnessOf(relativeAscendency: number): number {
  // lim a→0 is 0 (0 · −∞ would be NaN); "0 −" makes a = 1 give +0 rather than −0
  return relativeAscendency === 0 ? 0 : 0 - relativeAscendency * Math.log(relativeAscendency);
}

export function fitnessPosition(relativeAscendency: number): FitnessPosition {
  const robustness = robustnessOf(relativeAscendency);
  return {
    relativeAscendency,
    robustness,
    shareOfPeak: robustness / PEAK,
    side: sideOf(relativeAscendency),
  };
}

function sideOf(a: number): FitnessSide {
  if (Math.abs(a - PEAK) < PEAK_TOLERANCE) return 'peak';
  return a < PEAK ? 'flexibility' : 'constraint';
}

/**
 * ∂F/∂X_ij = −(1 + ln a)/C · [log2(X_ij T.. / (T_i. T_.j)) + a log2(X_ij / T..)] for every internal
 * flow, all other entries of X held fixed. In X the row sum of compartment i is its output side
 * (network.outflow) and the column sum of j its input side (network.throughflow), so the marginals
 * come straight from the network even when it is unbalanced.
 */
export function robustnessGradient(network: Network): number[][] {
  const { n, T, outflow, throughflow } = network;
  const { tst, developmentCapacity: C, relativeAscendency: a } = informationIndices(network);
  const gradient = zeros(n, n);
  const factor = -(1 + Math.log(a)) / C;
  for (let i = 0; i < n; i++) {
    const row = T[i];
    for (let j = 0; j < n; j++) {
      const x = row[j];
      if (x <= 0) continue;
      // sums of logarithms, as in the indices: x T.. overflows for flows beyond about 1e154 (and
      // underflows below 1e-154) long before the gradient does
      const logX = Math.log2(x);
      const logTst = Math.log2(tst);
      gradient[i][j] = factor * (logX + logTst - Math.log2(outflow[i]) - Math.log2(throughflow[j]) + a * (logX - logTst));
    }
  }
  return gradient;
}
