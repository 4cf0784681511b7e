import { isBalanced } from './balance-check';
import { identityMinus, solve, transpose } from './linear-algebra';
import { leastChangeBalance } from './least-change';
import { describeFlux } from './flux-label';
import { withFluxValues, type Network } from './network';
import { WebError } from './web-error';
import { downstreamOf, upstreamOf } from './reachability';

/**
 * Balancing an unbalanced web (METHODS.md §7; Allesina & Bondavalli 2003, Ecol. Model. 165:221-229).
 *
 * - Input-based: imports and each compartment's output fractions are kept; x = (I − Fᵀ)⁻¹ z with
 *   F_ij = T_ij / outflow_i, and every outgoing flux of i becomes its fraction × x_i.
 * - Output-based: exports, respiration and each compartment's input fractions are kept;
 *   x = (I − G)⁻¹ (e + r) with G_ij = T_ij / inputs_j, and every incoming flux of j becomes its
 *   fraction × x_j.
 * - Average: the element-wise mean of the two. It is balanced because balance is a set of
 *   homogeneous linear equations in the flux values (inputs − outputs = 0 for every compartment):
 *   both results satisfy them, so does any convex combination; it is also ≥ 0 and keeps zeros.
 * - Least change: see least-change.ts.
 *
 * Every method returns a balanced web unchanged. The input and output methods need every compartment
 * that carries flow to lie on a path from an import to an export or respiration: otherwise the system
 * is singular (material trapped in a closed set) or the compartment would be emptied.
 */

export const BALANCING_METHODS = ['input', 'output', 'average', 'least-change'] as const;

export type BalancingMethod = (typeof BALANCING_METHODS)[number];

export interface BalanceOptions {
  readonly method: BalancingMethod;
  /** Least change: cv of a flux that gives none. */
  readonly defaultCv?: number;
  /** Flux indices held exactly; the input, output and average methods refuse pins they would move. */
  readonly pinned?: ReadonlySet<number>;
}

/** Relative change below which a pinned flux counts as held by the input, output or average method. */
const PIN_TOLERANCE = 1e-9;

export function balanceNetwork(network: Network, options: BalanceOptions): Network {
  if (options.method === 'least-change') {
    return leastChangeBalance(network, { defaultCv: options.defaultCv, pinned: options.pinned });
  }
  if (isBalanced(network)) return network;
  requireImportToExitPaths(network);
  const values = fractionBalance(network, options.method);
  requirePinsHeld(network, values, options.pinned, options.method);
  return withFluxValues(network, values);
}

function fractionBalance(network: Network, method: 'input' | 'output' | 'average'): number[] {
  if (method === 'input') return inputBased(network);
  if (method === 'output') return outputBased(network);
  const input = inputBased(network);
  const output = outputBased(network);
  return input.map((value, k) => (value + output[k]) / 2);
}

function share(value: number, total: number): number {
  return total > 0 ? value / total : 0;
}

function inputBased(network: Network): number[] {
  const { T, z, outflow } = network;
  const F = T.map((row, i) => row.map((t) => share(t, outflow[i])));
  const x = solveOrRefuse(network, () => solve(identityMinus(transpose(F)), z.slice()));
  return network.fluxes.map((f) => (f.kind === 'import' ? f.value : share(f.value, outflow[f.from]) * x[f.from]));
}

function outputBased(network: Network): number[] {
  const { T, e, r, throughflow } = network;
  const G = T.map((row) => row.map((t, j) => share(t, throughflow[j])));
  const x = solveOrRefuse(network, () => solve(identityMinus(G), e.map((ei, i) => ei + r[i])));
  return network.fluxes.map((f) =>
    f.kind === 'import' || f.kind === 'flow' ? share(f.value, throughflow[f.to]) * x[f.to] : f.value,
  );
}

function solveOrRefuse(network: Network, solveSystem: () => number[]): number[] {
  try {
    return solveSystem();
  } catch {
    throw new WebError('infeasible', [`the balancing system of "${network.name}" is singular: balance it by least change`]);
  }
}

/**
 * Every compartment carrying flow must be reached from an import and reach an export or respiration
 * along positive fluxes; names each one that is not.
 */
function requireImportToExitPaths(network: Network): void {
  const { n, T, z, e, r, throughflow, outflow, ids } = network;
  const fed = downstreamOf(T, z.map((zi) => zi > 0));
  const drained = upstreamOf(T, e.map((ei, i) => ei + r[i] > 0));
  const problems: string[] = [];
  for (let i = 0; i < n; i++) {
    if (throughflow[i] === 0 && outflow[i] === 0) continue;
    const id = ids[i];
    if (throughflow[i] === 0) problems.push(`compartment "${id}" has no inputs (import or flow in) to supply its outputs`);
    else if (outflow[i] === 0) problems.push(`compartment "${id}" has no outputs (export, respiration or flow out) to carry its inputs`);
    else if (!fed[i]) problems.push(`compartment "${id}" is not reached from any import`);
    else if (!drained[i]) problems.push(`compartment "${id}" has no path to an export or respiration`);
  }
  if (problems.length > 0) throw new WebError('infeasible', problems);
}

const METHOD_NAMES = { input: 'input-based method', output: 'output-based method', average: 'average of the two' } as const;

function requirePinsHeld(
  network: Network,
  values: readonly number[],
  pinned: ReadonlySet<number> | undefined,
  method: keyof typeof METHOD_NAMES,
): void {
  const problems: string[] = [];
  for (const k of pinned ?? []) {
    const before = network.fluxes[k].value;
    if (Math.abs(values[k] - before) > PIN_TOLERANCE * Math.abs(before)) {
      problems.push(
        `the ${METHOD_NAMES[method]} cannot hold the pinned ${describeFlux(network, network.fluxes[k])} at ${before} (it would become ${values[k]}): balance by least change`,
      );
    }
  }
  if (problems.length > 0) throw new WebError('infeasible', problems);
}
