import type { Network } from './network';
import { requireAnalysable } from './balance-check';
import { inverseOfIdentityMinus, zeros } from './linear-algebra';

/**
 * Indirect diet dependence (METHODS.md §2): all-pathway dependency N − I, total dependency d and
 * total contribution c, from the dietary matrix G and the donor matrix F.
 * Source: Szyrmer & Ulanowicz 1987, Ecol. Model. 35:123-136.
 */

/** G_ij = T_ij / T_j: share of j's input (imports included) that comes from i. */
export function dietMatrix(network: Network): number[][] {
  const { n, T, throughflow } = network;
  const G = zeros(n, n);
  for (let i = 0; i < n; i++) {
    const row = T[i];
    for (let j = 0; j < n; j++) {
      if (row[j] !== 0 && throughflow[j] !== 0) G[i][j] = row[j] / throughflow[j];
    }
  }
  return G;
}

/** F_ij = T_ij / T_i: share of i's throughflow that goes to j. */
export function donorMatrix(network: Network): number[][] {
  const { n, T, throughflow } = network;
  const F = zeros(n, n);
  for (let i = 0; i < n; i++) {
    const Ti = throughflow[i];
    if (Ti === 0) continue;
    const row = T[i];
    for (let j = 0; j < n; j++) {
      if (row[j] !== 0) F[i][j] = row[j] / Ti;
    }
  }
  return F;
}

export interface Dependencies {
  /** N − I: material counted again on each pass round a cycle. */
  allPathway: number[][];
  /** d[i][j]: share of j's input that passed through i at least once; d[j][j] its cycled share. */
  total: number[][];
  /** c[i][j]: share of i's output that passes through j at least once; c[i][i] its cycled share. */
  totalContribution: number[][];
  /**
   * N_jj = M_jj: the expected number of passes through j of a unit entering j (the two diagonals
   * agree because M = D⁻¹ N D). The Finn cycling index needs nothing else from the inverse.
   */
  passesThrough: number[];
}

/**
 * N = (I − G)⁻¹; d_ij = N_ij / N_ii (i ≠ j), d_jj = 1 − 1/N_jj.
 * M = (I − F)⁻¹; c_ij = M_ij / M_jj (i ≠ j). Because F = D⁻¹ G D with D = diag(T_j), M = D⁻¹ N D,
 * so one inverse serves both. The diagonal c_jj = 1 − 1/M_jj is the share of j's output that comes
 * back to j (M_jj / M_jj would be a trivial 1).
 */
export function dependencies(network: Network): Dependencies {
  requireAnalysable(network);
  const { n, throughflow } = network;
  const N = inverseOfIdentityMinus(dietMatrix(network), 'dependencies, N = (I − G)⁻¹');
  // A compartment with no throughflow has neither diet nor donor fractions; any nonzero scale fits.
  const D = throughflow.map((t) => (t === 0 ? 1 : t));
  const allPathway = zeros(n, n);
  const total = zeros(n, n);
  const totalContribution = zeros(n, n);
  for (let i = 0; i < n; i++) {
    const Ni = N[i];
    const Nii = Ni[i];
    for (let j = 0; j < n; j++) {
      if (i === j) {
        allPathway[i][i] = Nii - 1;
        total[i][i] = 1 - 1 / Nii;
        totalContribution[i][i] = 1 - 1 / Nii;
      } else if (Ni[j] !== 0) {
        allPathway[i][j] = Ni[j];
        total[i][j] = Ni[j] / Nii;
        totalContribution[i][j] = (Ni[j] * D[j]) / (D[i] * N[j][j]);
      }
    }
  }
  return { allPathway, total, totalContribution, passesThrough: N.map((row, i) => row[i]) };
}
