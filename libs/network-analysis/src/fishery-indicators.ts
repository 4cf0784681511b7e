import type { Network } from './network';
import { requireAnalysable, tooLarge } from './balance-check';
import { idMap } from './id-map';
import { identityMinus, solve } from './linear-algebra';
import { WebError } from './web-error';
import { upstreamOf } from './reachability';

/**
 * Fishery indicators (METHODS.md §9): catch, tonnes and value per fleet and in total; mean trophic
 * level of the catch (Pauly et al. 1998, Science 279:860-863); primary production required in
 * network form (Hannon-type intensities) and by the rule of thumb (Pauly & Christensen 1995,
 * Nature 374:255-257); Fishing-in-Balance (Pauly, Christensen & Walters 2000, ICES J. Mar. Sci.
 * 57:697-706).
 */

/** Carbon to wet weight, 1:9 (Pauly & Christensen 1995). */
export const WET_WEIGHT_PER_CARBON = 9;
/** Mean transfer efficiency between trophic levels, about 10 % (Pauly & Christensen 1995). */
export const DEFAULT_TRANSFER_EFFICIENCY = 0.1;

export interface FleetIndicators {
  catch: number;
  tonnes: number | null;
  value: number | null;
  meanTrophicLevelOfCatch: number | null;
  primaryProductionRequired: number;
}

export interface FisheryIndicators {
  totalCatch: number;
  totalTonnes: number | null;
  totalValue: number | null;
  /** Σ Y_i TL_i / Σ Y_i; null with no catch. */
  meanTrophicLevelOfCatch: number | null;
  /** ε_j; null where no output but respiration ever leaves the web from j (see primaryProductionIntensity). */
  primaryProductionIntensity: (number | null)[];
  /** Σ ε_j Y_j over all catches. */
  primaryProductionRequired: number;
  /** PPR / total imports to producers; null with no primary production. */
  primaryProductionRequiredShare: number | null;
  /** Tonnes C per year by the rule of thumb; null unless the web gives areaKm2 and tonnesPerUnit. */
  ruleOfThumbPrimaryProductionRequired: number | null;
  fleets: Record<string, FleetIndicators>;
}

export function fisheryIndicators(network: Network, trophicLevels: readonly number[]): FisheryIndicators {
  requireAnalysable(network);
  const { n, z, kinds, catches, fleets } = network;
  const production = embodiedProduction(network);
  const Y = new Array<number>(n).fill(0);
  for (const row of catches) row.forEach((y, i) => (Y[i] += y));
  const priced = prices(network);
  const total = catchIndicators(network, Y, production, trophicLevels, priced);
  const primaryProduction = z.reduce((sum, w, j) => sum + (kinds[j] === 'producer' ? w : 0), 0);
  const tonnesPerUnit = tonnesPerFlowUnit(network);
  const perFleet = fleets.map((fleet, f): [string, FleetIndicators] => [fleet, catchIndicators(network, catches[f], production, trophicLevels, priced.filter((p) => p.fleet === fleet))]);
  requireFiniteTonnesAndValue(network, [['the total catch', total], ...perFleet.map(([fleet, c]): [string, FleetIndicators] => [`the catch of fleet "${fleet}"`, c])]);
  const ruleOfThumb =
    tonnesPerUnit === null
      ? null
      : ruleOfThumbPrimaryProductionRequired(Y.flatMap((y, i) => (y > 0 ? [{ tonnesWet: y * tonnesPerUnit, trophicLevel: trophicLevels[i] }] : [])));
  if (ruleOfThumb !== null && !Number.isFinite(ruleOfThumb)) {
    throw new WebError('invalid', ['the rule-of-thumb primary production required of the catch in tonnes is too large to compute (beyond 1.8e308): check areaKm2 and tonnesPerUnit']);
  }
  return {
    totalCatch: total.catch,
    totalTonnes: total.tonnes,
    totalValue: total.value,
    meanTrophicLevelOfCatch: total.meanTrophicLevelOfCatch,
    primaryProductionIntensity: intensities(production),
    primaryProductionRequired: total.primaryProductionRequired,
    primaryProductionRequiredShare: primaryProduction > 0 ? total.primaryProductionRequired / primaryProduction : null,
    ruleOfThumbPrimaryProductionRequired: ruleOfThumb,
    fleets: idMap(perFleet),
  };
}

/**
 * Tonnes and value multiply the web's own factors (area × tonnes per unit × catch × price): an
 * overflow would print as null in JSON, which reads as "not given". Refused, naming the factors.
 */
function requireFiniteTonnesAndValue(network: Network, catches: readonly [what: string, indicators: FleetIndicators][]): void {
  const factors = () => `areaKm2 ${network.areaKm2} × tonnesPerUnit ${network.tonnesPerUnit}`;
  const problems = catches.flatMap(([what, c]) => [
    ...(c.tonnes !== null && !Number.isFinite(c.tonnes) ? [`${what} in tonnes (${factors()} × catch ${c.catch}) is too large to compute (beyond 1.8e308): check areaKm2 and tonnesPerUnit`] : []),
    ...(c.value !== null && !Number.isFinite(c.value) ? [`the value of ${what} (tonnes × price) is too large to compute (beyond 1.8e308): check the prices, areaKm2 and tonnesPerUnit`] : []),
  ]);
  if (problems.length > 0) throw new WebError('invalid', problems);
}

/**
 * Primary production embodied per unit of non-respired output: ε_j (T_j − r_j) = Σ_i ε_i T_ij + w_j,
 * w_j the imports to producers. T_j − r_j is taken on the output side (e_j + Σ_k T_jk) so that
 * Σ ε_j e_j = Σ w holds to machine precision even within the balance tolerance.
 *
 * Where nothing but respiration ever leaves the web from j — T_j = r_j, or j reaches no export along
 * flows — all primary production reaching j is dissipated, ε_j would be infinite and the system
 * singular: ε_j is null and j is left out. Conservation then reads
 * Σ ε_j e_j + (primary production flowing into those compartments) = Σ w.
 */
export function primaryProductionIntensity(network: Network): (number | null)[] {
  return intensities(embodiedProduction(network));
}

function intensities({ embodied, output }: ReturnType<typeof embodiedProduction>): (number | null)[] {
  // a finite intensity can still overflow when a compartment's output is a vanishing fraction of
  // what reaches it; JSON has no infinity, so it is reported as missing
  return embodied.map((x, j) => (x === null || !Number.isFinite(x / output[j]) ? null : x / output[j]));
}

/**
 * x_j = ε_j (T_j − r_j), the primary production embodied in j's non-respired output, and that
 * output. The catch's requirement ε_j Y_j is taken as x_j (Y_j / output_j): a share of a finite
 * quantity, finite however small the output.
 */
function embodiedProduction(network: Network): { embodied: (number | null)[]; output: number[] } {
  const { n, T, z, e, kinds } = network;
  const exporting = upstreamOf(T, e.map((ej) => ej > 0));
  const kept = Array.from({ length: n }, (_, j) => j).filter((j) => exporting[j]);
  const output = kept.map((j) => e[j] + T[j].reduce((sum, t) => sum + t, 0));
  // x_j = ε_j (T_j − r_j) solves x = (I − F'ᵀ)⁻¹ w with F'_ij = T_ij / (T_i − r_i).
  const FT = kept.map((j) => kept.map((i, a) => T[i][j] / output[a]));
  const w = kept.map((j) => (kinds[j] === 'producer' ? z[j] : 0));
  const x = kept.length > 0 ? solveOrExplain(network, FT, w) : [];
  const embodied = new Array<number | null>(n).fill(null);
  const outputs = new Array<number>(n).fill(0);
  kept.forEach((j, a) => {
    embodied[j] = x[a];
    outputs[j] = output[a];
  });
  return { embodied, output: outputs };
}

/**
 * Near-closed webs: when the only exports reached from a loop are a vanishing fraction of what it
 * carries (a catch cut to almost nothing, say), all the loop's production is attributed to them,
 * passing round the loop countless times. I − F'ᵀ is then singular, or so ill-conditioned that the
 * embodied flows (which count every pass) exceed the production by orders of magnitude and their
 * digits are lost. Refused, naming the exports responsible.
 */
function solveOrExplain(network: Network, FT: number[][], w: number[]): number[] {
  const production = w.reduce((sum, v) => sum + v, 0);
  let x: number[] | null;
  try {
    x = solve(identityMinus(FT), w, 'primary production intensities');
  } catch (error) {
    if (!(error instanceof WebError)) throw error;
    x = null;
  }
  if (x !== null && x.every((v) => v <= MAX_PASSES * production)) return x;
  if (fitsAtUnitScale(FT, w, production)) throw tooLarge(network);
  const { e, ids, throughflow } = network;
  const vanishing = ids.flatMap((id, j) =>
    e[j] > 0 && e[j] < VANISHING_EXPORT * throughflow[j] ? [`"${id}" (exports ${e[j]} of a throughflow of ${throughflow[j]})`] : [],
  );
  const why =
    vanishing.length > 0
      ? `the exports of ${vanishing.join(', ')} are too small to resolve in double precision (close such a catch rather than cut it to almost nothing)`
      : `material passes round its loops more than ${MAX_PASSES.toExponential(0)} times before it is exported`;
  throw new WebError('infeasible', [`primary production required cannot be apportioned: almost nothing but respiration leaves the web; ${why}`]);
}

/**
 * Whether the same system with the production scaled to 1 has a finite solution within MAX_PASSES:
 * if so, what failed at full size was the size of the numbers, not the loops.
 */
function fitsAtUnitScale(FT: number[][], w: number[], production: number): boolean {
  try {
    return solve(identityMinus(FT), w.map((v) => v / production), 'primary production intensities').every((v) => Number.isFinite(v) && v <= MAX_PASSES);
  } catch (error) {
    if (error instanceof WebError) return false;
    throw error;
  }
}

/**
 * Embodied flow above this multiple of the primary production means loops passed this many times
 * on average; the relative error grows about as passes × 1e-16, so beyond it fewer than seven
 * significant digits of the answer survive.
 */
const MAX_PASSES = 1e9;
/** An export below this share of its compartment's throughflow is vanishing for the message above. */
const VANISHING_EXPORT = 1e-9;

/** Price per tonne of each compartment's harvest by each fleet, in flux order. */
function prices(network: Network): { compartment: number; fleet: string; price: number }[] {
  const priced: { compartment: number; fleet: string; price: number }[] = [];
  for (const f of network.fluxes) {
    if (f.kind === 'export' && f.fleet !== undefined && f.price !== undefined) priced.push({ compartment: f.from, fleet: f.fleet, price: f.price });
  }
  return priced;
}

function catchIndicators(
  network: Network,
  Y: readonly number[],
  production: ReturnType<typeof embodiedProduction>,
  TL: readonly number[],
  priced: ReturnType<typeof prices>,
): FleetIndicators {
  const tonnesPerUnit = tonnesPerFlowUnit(network);
  let total = 0;
  let weightedLevel = 0;
  let required = 0;
  Y.forEach((y, i) => {
    if (y === 0) return;
    total += y;
    weightedLevel += y * TL[i];
    // a compartment with a catch has an export, so it is never left out of the system
    required += production.embodied[i]! * (y / production.output[i]);
  });
  const catchOf = (p: (typeof priced)[number]) => network.catches[network.fleets.indexOf(p.fleet)][p.compartment];
  return {
    catch: total,
    tonnes: tonnesPerUnit === null ? null : total * tonnesPerUnit,
    value:
      tonnesPerUnit === null || priced.length === 0
        ? null
        : priced.reduce((sum, p) => sum + catchOf(p) * tonnesPerUnit * p.price, 0),
    meanTrophicLevelOfCatch: total > 0 ? weightedLevel / total : null,
    primaryProductionRequired: required,
  };
}

/** Tonnes wet weight per year in one flow unit over the whole area; null unless both are given. */
function tonnesPerFlowUnit(network: Network): number | null {
  return network.areaKm2 === undefined || network.tonnesPerUnit === undefined ? null : network.areaKm2 * network.tonnesPerUnit;
}

/**
 * FiB = log10(Y (1/TE)^TL) − log10(Y0 (1/TE)^TL0): 0 when a change in catch is what the change in
 * mean trophic level of the catch would yield at efficiency TE. Defined for positive catches only.
 */
export function fishingInBalance(
  catchNow: number,
  trophicLevelNow: number,
  catchReference: number,
  trophicLevelReference: number,
  transferEfficiency = DEFAULT_TRANSFER_EFFICIENCY,
): number {
  const problems = [
    ...(catchNow > 0 ? [] : [`Fishing-in-Balance needs a positive catch, not ${catchNow}`]),
    ...(catchReference > 0 ? [] : [`Fishing-in-Balance needs a positive reference catch, not ${catchReference}`]),
    ...(transferEfficiency > 0 && transferEfficiency < 1
      ? []
      : [`the transfer efficiency must lie between 0 and 1, not ${transferEfficiency}`]),
  ];
  if (problems.length > 0) throw new WebError('invalid', problems);
  const perLevel = Math.log10(1 / transferEfficiency);
  return Math.log10(catchNow) + trophicLevelNow * perLevel - (Math.log10(catchReference) + trophicLevelReference * perLevel);
}

/** Σ (Y_i / 9) · 10^(TL_i − 1): tonnes of carbon of primary production for catches in tonnes wet weight. */
export function ruleOfThumbPrimaryProductionRequired(catches: readonly { tonnesWet: number; trophicLevel: number }[]): number {
  return catches.reduce(
    (sum, c) => sum + (c.tonnesWet / WET_WEIGHT_PER_CARBON) * (1 / DEFAULT_TRANSFER_EFFICIENCY) ** (c.trophicLevel - 1),
    0,
  );
}
