import { identityMinusTransposed, luSolve, OUTSIDE, WebError, withFluxValues, type Network } from '@seinework/network-analysis';
import type { CatchTarget, OptionPlan } from './option-web';

/**
 * Bottom-up (donor-controlled) response of METHODS.md §8 (Hannon 1973, J. theor. Biol. 41:535-546;
 * Fath & Patten 1999, Ecosystems 2:167-179). Imports are fixed (scaled producers excepted); each
 * compartment's non-harvest outputs (flows to other compartments, other exports, respiration) keep
 * their baseline proportions φ_ik = value_k / N_i, N_i its baseline non-harvest output, and together
 * take what its catches leave: with catch fractions c_i, x = (I − F'ᵀ)⁻¹ z where
 * F'_ij = φ_ij (1 − c_i).
 *
 * "Iterated on the catch fractions until every target catch is met" has a closed-form fixed point:
 * at c_i = Y_i / x_i the non-harvest output of i is φ_i (x_i − Y_i), so the balance reads
 * x = z' + Φᵀ (x − Y), i.e. x = (I − Φᵀ)⁻¹ (z' − Φᵀ Y). One linear solve meets every catch exactly,
 * with no iteration to cap or fail to converge; the catch fractions are then c_i = Y_i / x_i.
 * A compartment whose throughflow would fall below its catch cannot supply it: refused, naming the
 * catch and the most it could land with every other target held.
 */

/** Relative shortfall below which a compartment's leftover output counts as exactly zero. */
const SUPPLY_TOLERANCE = 1e-9;

interface Donor {
  /** Φ_ij = T_ij / N_i over internal flows. */
  readonly Phi: number[][];
  /** Y_i: total target catch from i. */
  readonly Y: number[];
  /** z'_j: imports after production changes. */
  readonly z: number[];
}

export function bottomUpResponse(plan: OptionPlan): Network {
  const { network } = plan;
  const donor = donorFractions(plan);
  const x = throughflows(network, donor);
  const leftover = x.map((xi, i) => xi - donor.Y[i]);
  const short = leftover.flatMap((rest, i) => (rest < -SUPPLY_TOLERANCE * Math.max(x[i], donor.Y[i]) ? [i] : []));
  if (short.length > 0) throw new WebError('infeasible', shortfalls(plan, donor, x, short));
  const nonHarvest = nonHarvestOutput(network);
  const stranded = leftover.flatMap((rest, i) => (nonHarvest[i] === 0 && rest > SUPPLY_TOLERANCE * x[i] ? [i] : []));
  if (stranded.length > 0) {
    throw new WebError(
      'infeasible',
      stranded.map(
        (i) =>
          `${labelsOn(plan, i)}: "${network.ids[i]}" has no output but its catch in the baseline, so nothing can take up the ${leftover[i]} its catch would leave`,
      ),
    );
  }

  const values = network.fluxes.map((f, k) => {
    if (f.kind === 'import') return plan.imports.get(k) ?? f.value;
    if (f.fleet !== undefined) return f.value;
    return nonHarvest[f.from] > 0 ? (f.value / nonHarvest[f.from]) * Math.max(0, leftover[f.from]) : 0;
  });
  for (const c of plan.catches) values[c.flux] = c.amount;
  return withFluxValues(network, values);
}

/** Catch fractions c_i = Y_i / x_i of the option web (the fractions the fixed point settles on). */
export function catchFractions(optionNetwork: Network): number[] {
  return optionNetwork.throughflow.map((x, i) => {
    const Y = optionNetwork.catches.reduce((sum, row) => sum + row[i], 0);
    return x > 0 ? Y / x : 0;
  });
}

function donorFractions(plan: OptionPlan): Donor {
  const { network } = plan;
  const n = network.n;
  const nonHarvest = nonHarvestOutput(network);
  const Phi = network.T.map((row, i) => row.map((t) => (nonHarvest[i] > 0 ? t / nonHarvest[i] : 0)));
  const Y = new Array<number>(n).fill(0);
  for (const c of plan.catches) Y[c.compartment] += c.amount;
  // summed afresh from the new import values: adding (new − old) to z loses every digit of a cut to
  // almost nothing (−99.99999999 %) and leaves the option web unbalanced
  const z = new Array<number>(n).fill(0);
  network.fluxes.forEach((f, k) => {
    if (f.kind === 'import') z[f.to] += plan.imports.get(k) ?? f.value;
  });
  return { Phi, Y, z };
}

/** x = (I − Φᵀ)⁻¹ (z' − Φᵀ Y). */
function throughflows(network: Network, { Phi, Y, z }: Donor): number[] {
  const n = network.n;
  const b = z.slice();
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) b[j] -= Phi[i][j] * Y[i];
  const x = luSolve(identityMinusTransposed(Phi), b);
  if (x === null || !x.every(Number.isFinite)) {
    throw new WebError('infeasible', [
      'bottom-up response: some compartments have no exit but their catches, so donor control cannot settle their throughflow',
    ]);
  }
  return x;
}

/** N_i: baseline output of i other than catches (flows, other exports, respiration). */
function nonHarvestOutput(network: Network): number[] {
  const N = new Array<number>(network.n).fill(0);
  for (const f of network.fluxes) if (f.from !== OUTSIDE && f.fleet === undefined) N[f.from] += f.value;
  return N;
}

/** The adjustments that set i's catches (those still landing first), else its catches kept at baseline. */
function labelsOn(plan: OptionPlan, i: number): string {
  const onI = plan.catches.filter((c) => c.compartment === i);
  const adjusted = onI.filter((c) => c.label.startsWith('adjustments['));
  const landing = (catches: readonly CatchTarget[]) => catches.filter((c) => c.amount > 0);
  const named = [landing(adjusted), adjusted, landing(onI)].find((catches) => catches.length > 0) ?? [];
  return named.length > 0 ? named.map((c) => c.label).join(' and ') : "the option's catches";
}

/**
 * A catch beyond supply drives what the compartment passes on below zero, and with it the
 * throughflow of everything downstream: only compartments with a catch are at fault, those whose
 * catch an adjustment sets first.
 */
function shortfalls(plan: OptionPlan, donor: Donor, x: readonly number[], short: readonly number[]): string[] {
  const caught = short.filter((i) => donor.Y[i] > 0);
  const adjusted = (i: number) => plan.catches.some((c) => c.compartment === i && c.amount > 0 && c.label.startsWith('adjustments['));
  const atFault = caught.length > 0 ? [...caught.filter(adjusted), ...caught.filter((i) => !adjusted(i))] : short;
  return atFault.map((i) => shortfall(plan, donor, x, i));
}

/** The most i can land with every other target held: its throughflow when nothing but catch leaves it. */
function shortfall(plan: OptionPlan, donor: Donor, x: readonly number[], i: number): string {
  const id = plan.network.ids[i];
  if (donor.Y[i] === 0) return `${labelsOn(plan, i)}: the catches upstream leave "${id}" a throughflow of ${x[i]} under the bottom-up response`;
  const Phi = donor.Phi.map((row, r) => (r === i ? row.map(() => 0) : row));
  const Y = donor.Y.map((y, r) => (r === i ? 0 : y));
  const most = throughflows(plan.network, { Phi, Y, z: donor.z })[i];
  return `${labelsOn(plan, i)}: "${id}" cannot supply a catch of ${donor.Y[i]} under the bottom-up response (its throughflow would be ${x[i]}; the most it can land with the other catches held is ${Math.max(0, most)})`;
}
