import type { LadderLevelRow } from '@seinework/contracts';
import type { Network } from './network';
import { internalDiet, trophicLevels } from './trophic-levels';

/**
 * Trophic ladder (METHODS.md §4): each compartment's activity apportioned to integer trophic levels
 * (Lindeman aggregation) and the flows of each level, with transfer efficiencies.
 * Source: Ulanowicz & Kemp 1979, Am. Nat. 114:871-883.
 *
 * Shares: L_j1 = 1 for producers and detritus; for consumers L_jk = Σ_i g'_ij L_i,k-1 (a consumer
 * fed only by imports sits wholly at level 2, as its trophic level does).
 *
 * Bookkeeping per level k (every flow of compartment i apportioned by L_ik):
 * - Level I is producers merged with detritus, so flows among them (plants → detritus) stay inside
 *   the level: its returnedToDetritus is 0.
 * - input_I = imports to producers and detritus + every return from the higher levels (flows from
 *   consumers into level-I compartments, each counted at the level it leaves).
 * - input_k (k ≥ 2) = passedOn_{k-1} + imports to consumers apportioned by L_jk.
 * - passedOn_k = Σ_i L_ik Σ_{consumers j} T_ij; returnedToDetritus_k = Σ_{consumers i} L_ik Σ_{level-I j} T_ij.
 * - TE_k = passedOn_k / input_k.
 * - The top level K holds every share left above level K − 1 ("K and above"); what it feeds to
 *   consumers stays within it, so its passedOn is 0.
 * This reproduces Cone Spring's TE = 0.545, 0.0577, 0.0269 (input_I = 11,819 imported + 1,967
 * returned = 13,786), and every level's budget input = passedOn + returnedToDetritus + respired +
 * exported + harvested holds to the balance tolerance, level I included (its plants → detritus
 * flow is neither input nor output). Σ_k L_jk = 1 always; Σ_k k L_jk = TL_j holds when the shares
 * converge within 20 levels, and when cut at 20 falls short by Σ_{k>20} (k − 20) L_jk (only webs with
 * strong consumer cycles).
 */

export const MAX_LEVELS = 20;
export const REMAINING_SHARE = 1e-12;

/** One row of the ladder, as in the analysis document (libs/contracts). */
export type LadderLevel = LadderLevelRow;

export interface TrophicLadder {
  levels: LadderLevel[];
  /** shares[j][k-1] = L_jk. */
  shares: number[][];
  /** Geometric mean of the efficiencies of levels II–IV (common practice); null when any is missing or zero. */
  meanEfficiency: number | null;
}

export interface TrophicLadderOptions {
  /**
   * Set when trophicLevels() has already accepted this network (as the full analysis does), to
   * skip solving for the levels a second time.
   */
  readonly levelsChecked?: boolean;
}

export function trophicLadder(network: Network, options: TrophicLadderOptions = {}): TrophicLadder {
  // trophicLevels checks the web and that every consumer is grounded, so the shares converge.
  if (!options.levelsChecked) trophicLevels(network);
  const shares = levelShares(network);
  const count = shares.length > 0 ? shares[0].length : 0;
  const flows = Array.from({ length: count }, (_, k) => levelFlows(network, shares, k));
  const returns = flows.reduce((sum, f) => sum + f.returnedToDetritus, 0);
  const levels = flows.map(({ imported, ...out }, k): LadderLevel => {
    const input = imported + (k === 0 ? returns : flows[k - 1].passedOn);
    return { level: k + 1, input, ...out, efficiency: input > 0 ? out.passedOn / input : null };
  });
  return { levels, shares, meanEfficiency: meanEfficiency(levels) };
}

/**
 * L_jk for k = 1 … K, K the first level after which every consumer's remaining share is below 1e-12,
 * at most 20. The top level K takes the whole remaining share 1 − Σ_{k<K} L_jk, so Σ_k L_jk = 1
 * exactly: below 1e-12 when the shares converged, levels K and above together when cut at 20.
 */
export function levelShares(network: Network): number[][] {
  const { n, T, kinds } = network;
  const g = internalDiet(network);
  const intake = new Array<number>(n).fill(0);
  for (const row of T) for (let j = 0; j < n; j++) intake[j] += row[j];
  const importOnly = kinds.map((kind, j) => kind === 'consumer' && intake[j] === 0);
  const shares: number[][] = kinds.map((kind) => [kind === 'consumer' ? 0 : 1]);
  const cumulative = shares.map((s) => s[0]);
  for (let k = 1; k < MAX_LEVELS && remaining(cumulative) >= REMAINING_SHARE; k++) {
    for (let j = 0; j < n; j++) {
      let L = k === 1 && importOnly[j] ? 1 : 0;
      if (kinds[j] === 'consumer') for (let i = 0; i < n; i++) L += g[i][j] * shares[i][k - 1];
      shares[j].push(L);
      cumulative[j] += L;
    }
  }
  for (let j = 0; j < n; j++) {
    const top = shares[j].length - 1;
    shares[j][top] = Math.max(0, 1 - (cumulative[j] - shares[j][top]));
  }
  return shares;
}

function remaining(cumulative: readonly number[]): number {
  return cumulative.reduce((worst, sum) => Math.max(worst, 1 - sum), 0);
}

type LevelFlows = Omit<LadderLevel, 'level' | 'input' | 'efficiency'> & { imported: number };

/**
 * The flows of level k+1 (k zero-based): every flow of compartment i weighted by its share L_i,k+1.
 * What the top level feeds to consumers stays within it (it holds every level above), so it passes
 * nothing on.
 */
function levelFlows(network: Network, shares: readonly number[][], k: number): LevelFlows {
  const { n, T, z, e, r, kinds, catches } = network;
  const levelOne = kinds.map((kind) => kind !== 'consumer');
  const top = k === shares[0].length - 1;
  const flows: LevelFlows = { imported: 0, passedOn: 0, returnedToDetritus: 0, respired: 0, exported: 0, harvested: 0 };
  for (let i = 0; i < n; i++) {
    const L = shares[i][k];
    if (L === 0) continue;
    const harvest = catches.reduce((sum, fleet) => sum + fleet[i], 0);
    for (let j = 0; j < n; j++) {
      if (levelOne[j]) {
        if (!levelOne[i]) flows.returnedToDetritus += T[i][j] * L;
      } else if (!top) {
        flows.passedOn += T[i][j] * L;
      }
    }
    flows.imported += z[i] * L;
    flows.respired += r[i] * L;
    flows.exported += (e[i] - harvest) * L;
    flows.harvested += harvest * L;
  }
  return flows;
}

function meanEfficiency(levels: readonly LadderLevel[]): number | null {
  const TE = levels.slice(1, 4).map((level) => level.efficiency);
  if (TE.length < 3 || TE.some((e) => e === null || e <= 0)) return null;
  return Math.cbrt((TE as number[]).reduce((product, e) => product * e, 1));
}
