import type { Network } from './network';
import { requireAnalysable } from './balance-check';
import { identityMinus, solve, zeros } from './linear-algebra';
import { WebError } from './web-error';
import { downstreamOf } from './reachability';

/**
 * Effective trophic level (METHODS.md §3): producers and detritus at level 1 (common practice);
 * a consumer one level above the diet-weighted mean level of what it eats,
 * TL_j = 1 + Σ_i g'_ij TL_i, solved as one linear system.
 * Source: Levine 1980, J. theor. Biol. 83:195-207.
 */

export interface TrophicLevels {
  levels: number[];
  /** Cautions about the data, one readable line per consumer placed at level 2 by default. */
  warnings: string[];
}

/**
 * g'_ij = T_ij / Σ_k T_kj for consumers j: the diet over internal intake only, because an import
 * into a consumer has no known level. Columns of producers, detritus and consumers without
 * internal intake are 0.
 */
export function internalDiet(network: Network): number[][] {
  const { n, T, kinds } = network;
  const g = zeros(n, n);
  for (let j = 0; j < n; j++) {
    if (kinds[j] !== 'consumer') continue;
    const intake = internalIntake(network, j);
    if (intake === 0) continue;
    for (let i = 0; i < n; i++) {
      if (T[i][j] !== 0) g[i][j] = T[i][j] / intake;
    }
  }
  return g;
}

export function trophicLevels(network: Network): TrophicLevels {
  requireAnalysable(network);
  const { n, ids, kinds } = network;
  const g = internalDiet(network);
  const levels = new Array<number>(n).fill(1);
  const warnings: string[] = [];
  const fed: number[] = [];
  for (let j = 0; j < n; j++) {
    if (kinds[j] !== 'consumer') continue;
    if (internalIntake(network, j) > 0) {
      fed.push(j);
    } else {
      levels[j] = 2;
      warnings.push(
        `consumer "${ids[j]}" takes no food from other compartments of the web (only imports): its trophic level is set to 2`,
      );
    }
  }
  requireGrounded(network, fed);

  // (I − g'ᵀ) TL = 1 + food from compartments of fixed level, over the fed consumers only.
  const position = new Map(fed.map((j, k) => [j, k]));
  const gT = fed.map((j) => fed.map((i) => g[i][j]));
  const b = fed.map((j) => {
    let sum = 1;
    for (let i = 0; i < n; i++) if (!position.has(i)) sum += g[i][j] * levels[i];
    return sum;
  });
  const solved = fed.length > 0 ? solve(identityMinus(gT), b, 'trophic levels') : [];
  fed.forEach((j, k) => (levels[j] = solved[k]));
  return { levels, warnings };
}

/** Σ_k T_kj: what consumer j takes from compartments of the web. */
function internalIntake(network: Network, j: number): number {
  let intake = 0;
  for (let k = 0; k < network.n; k++) intake += network.T[k][j];
  return intake;
}

/**
 * Every fed consumer must draw, along some food path, on a compartment of fixed level (producer,
 * detritus or a consumer fed only by imports); a group that feeds only on itself would sit
 * infinitely high, and I − g'ᵀ is singular.
 */
function requireGrounded(network: Network, fed: readonly number[]): void {
  const { n, T, ids } = network;
  const isFed = new Set(fed);
  const reached = downstreamOf(T, Array.from({ length: n }, (_, i) => !isFed.has(i)));
  const floating = fed.filter((j) => !reached[j]);
  if (floating.length > 0) {
    throw new WebError('invalid', [
      `consumers ${floating.map((j) => `"${ids[j]}"`).join(', ')} take all their food from one another, never ` +
        'through a producer, detritus or a consumer fed only by imports: their trophic level is undefined (add the link to their food)',
    ]);
  }
}
