import type { Network } from './network';
import { WebError } from './web-error';
import { upstreamOf } from './reachability';

/**
 * Balance (METHODS.md §0): inputs z_j + Σ_i T_ij equal outputs e_j + r_j + Σ_k T_jk for every
 * compartment within a relative tolerance (1e-6 of T_j by contract).
 */

export const BALANCE_TOLERANCE = 1e-6;

export interface Imbalance {
  readonly id: string;
  readonly inputs: number;
  readonly outputs: number;
  /** inputs − outputs */
  readonly imbalance: number;
}

export function imbalances(network: Network, tolerance = BALANCE_TOLERANCE): Imbalance[] {
  const found: Imbalance[] = [];
  for (let j = 0; j < network.n; j++) {
    const inputs = network.throughflow[j];
    const outputs = network.outflow[j];
    const scale = Math.max(Math.abs(inputs), Math.abs(outputs));
    if (Math.abs(inputs - outputs) > tolerance * scale) {
      found.push({ id: network.ids[j], inputs, outputs, imbalance: inputs - outputs });
    }
  }
  return found;
}

export function isBalanced(network: Network, tolerance = BALANCE_TOLERANCE): boolean {
  return imbalances(network, tolerance).length === 0;
}

/**
 * Every analysis but the information indices needs a balanced web whose compartments all reach an
 * exit (export or respiration); otherwise I − G is singular. Throws WebError naming each one.
 */
export function requireAnalysable(network: Network): void {
  if (analysable.has(network)) return;
  if (!fitsDoublePrecision(network)) throw tooLarge(network);
  if (network.throughflow.every((t) => t === 0)) {
    throw new WebError('invalid', [`"${network.name}" carries no flow: give it imports (primary production) and flows`]);
  }
  const unbalanced = imbalances(network);
  if (unbalanced.length > 0) {
    throw new WebError(
      'unbalanced',
      unbalanced.map(
        (u) =>
          `compartment "${u.id}" is unbalanced: inputs ${u.inputs} and outputs ${u.outputs} differ by ${u.imbalance}`,
      ),
    );
  }
  const trapped = compartmentsWithoutExit(network);
  if (trapped.length > 0) {
    throw new WebError(
      'closed',
      [`no path to an export or respiration from ${trapped.map((id) => `"${id}"`).join(', ')}: material would circulate forever`],
    );
  }
  analysable.add(network);
}

/**
 * Networks that passed requireAnalysable. A network never changes once built (balancing and
 * options build new ones), so one check serves every method run on it: a Monte Carlo draw runs
 * half a dozen methods on each of its webs, each of which checks first.
 */
const analysable = new WeakSet<Network>();

/** Compartments with throughflow that cannot reach any export or respiration along positive flows. */
export function compartmentsWithoutExit(network: Network): string[] {
  const { T, e, r, throughflow } = network;
  const drained = upstreamOf(T, e.map((ei, i) => ei + r[i] > 0));
  return network.ids.filter((_, i) => !drained[i] && throughflow[i] > 0);
}

/**
 * Each number of the web may be finite while their sums are not. The largest sum an analysis forms
 * from them is the development capacity C = T.. · H, with the flow diversity H at most log2 of the
 * count of nonzero fluxes; when that overflows, what fails after is no fault of the web's structure.
 */
function fitsDoublePrecision(network: Network): boolean {
  let total = 0;
  let count = 0;
  for (const f of network.fluxes) {
    total += f.value;
    if (f.value > 0) count++;
  }
  return Number.isFinite(total * Math.max(1, Math.log2(count)));
}

export function tooLarge(network: Network): WebError {
  return new WebError('invalid', [
    `the numbers of "${network.name}" are too large to analyse: their sums pass 1.8e308, the largest number the engine can hold; give the web in a larger unit`,
  ]);
}
