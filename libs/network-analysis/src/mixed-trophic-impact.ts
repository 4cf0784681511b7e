import { requireAnalysable } from './balance-check';
import { inverseOfIdentityMinus, zeros } from './linear-algebra';
import type { Network } from './network';
import { WebError } from './web-error';

/**
 * Mixed trophic impact (METHODS.md §6; Ulanowicz & Puccia 1990, Coenoses 5:7-16) and keystoneness
 * (Libralato, Christensen & Pauly 2006, Ecol. Model. 195:153-171).
 *
 * Direct net impact of i on j: q_ij = G_ij − f_ji, the share of j's input that i supplies (G_ij =
 * T_ij / T_j) less the share of j's output that i takes (f_ji = T_ji / T_j). Detritus takes no prey,
 * so a detritus recipient has no f terms. Fleets are extra nodes after the compartments: a fleet's
 * "diet" is its catch (G_i,fleet = share of the fleet's catch that is i), it takes f_i,fleet =
 * catch of i by the fleet / T_i, and nothing eats a fleet. Total impact M = (I − Q)⁻¹ − I, the
 * direct and every indirect path summed.
 *
 * Keystoneness KS_i = log10(ε_i (1 − p_i)) with ε_i = sqrt(Σ_{j≠i} m_ij²) over living compartments
 * (producers and consumers) and p_i the biomass share of i among the living compartments that give
 * a biomass.
 */

export interface MixedTrophicImpact {
  /** Compartment ids, then fleet names. */
  ids: string[];
  /** q_ij: direct net impact of i on j. */
  direct: number[][];
  /** m_ij: total (direct and indirect) impact of i on j. */
  total: number[][];
  /** KS_i per compartment; null overall when no compartment has a biomass. */
  keystoneness: (number | null)[] | null;
}

export function mixedTrophicImpact(network: Network): MixedTrophicImpact {
  requireAnalysable(network);
  const direct = netImpacts(network);
  let total: number[][];
  try {
    total = inverseOfIdentityMinus(direct).map((row, i) => row.map((m, j) => (i === j ? m - 1 : m)));
  } catch {
    throw new WebError('infeasible', [`the net impact matrix I − Q of "${network.name}" is singular: total impacts are undefined`]);
  }
  return {
    ids: [...network.ids, ...network.fleets],
    direct,
    total,
    keystoneness: keystoneness(network, total),
  };
}

function netImpacts(network: Network): number[][] {
  const { n, T, throughflow, kinds, fleets, catches } = network;
  const Q = zeros(n + fleets.length, n + fleets.length);
  const share = (value: number, total: number) => (total > 0 ? value / total : 0);
  for (let i = 0; i < n; i++) {
    const preys = kinds[i] !== 'detritus';
    for (let j = 0; j < n; j++) {
      Q[i][j] = share(T[i][j], throughflow[j]) - (preys ? share(T[j][i], throughflow[j]) : 0);
    }
  }
  catches.forEach((caught, f) => {
    const landed = caught.reduce((sum, y) => sum + y, 0);
    for (let i = 0; i < n; i++) {
      Q[i][n + f] = share(caught[i], landed);
      Q[n + f][i] = -share(caught[i], throughflow[i]);
    }
  });
  return Q;
}

function keystoneness(network: Network, total: readonly number[][]): (number | null)[] | null {
  const { n, kinds, biomass } = network;
  if (biomass.every((b) => b === undefined)) return null;
  const living = Array.from({ length: n }, (_, i) => i).filter((i) => kinds[i] !== 'detritus');
  const livingBiomass = living.reduce((sum, i) => sum + (biomass[i] ?? 0), 0);
  return Array.from({ length: n }, (_, i) => {
    const b = biomass[i];
    if (b === undefined || kinds[i] === 'detritus' || !(livingBiomass > 0)) return null;
    const epsilon = Math.sqrt(living.reduce((sum, j) => (j === i ? sum : sum + total[i][j] ** 2), 0));
    const product = epsilon * (1 - b / livingBiomass);
    // log10 of 0 is undefined: a compartment with no effect, or holding all living biomass
    return product > 0 ? Math.log10(product) : null;
  });
}
