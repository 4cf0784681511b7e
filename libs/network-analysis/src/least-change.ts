import { imbalances, isBalanced } from './balance-check';
import { describeFlux } from './flux-label';
import { OUTSIDE, withFluxValues, type Network } from './network';
import { WebError } from './web-error';

/**
 * Least-change balancing (METHODS.md §7): the balanced web nearest the given one in the weighted
 * least-squares sense, minimise Σ (x_k − x0_k)² / (cv_k x0_k)² subject to every compartment balanced
 * (A x = 0, A holding +1 at a flux's recipient and −1 at its donor), pinned fluxes held and x ≥ 0.
 * Source: the inverse-method lineage of Vézina & Platt 1988, Mar. Ecol. Prog. Ser. 42:269-287.
 *
 * Held fluxes (pinned, cv_k = 0, or x0_k = 0 so that no new link appears) are constants. For the
 * others, with variances v_k = (cv_k x0_k)², the KKT conditions give x_k = max(0, x0_k − v_k a_kᵀλ)
 * for one multiplier λ_j per compartment, so the work is on the n×n normal equations
 * (A W⁻¹ Aᵀ) λ = A x0 − b, never on a fluxes × fluxes matrix. Active set: the fluxes with x_k > 0
 * form the working set of the normal equations; a flux that would go negative is fixed at 0; a fixed
 * flux is released when its bound multiplier μ_k = a_kᵀλ − x0_k / v_k turns negative, i.e. when its
 * would-be value x0_k − v_k a_kᵀλ is positive. Each step of λ ascends the concave dual function
 * (Newton step with Armijo backtracking), which rules out cycling among active sets.
 *
 * Rank deficiency: a group of compartments joined by working-set flows with no working-set import or
 * exit ("floating") makes A W⁻¹ Aᵀ singular along the all-ones vector of the group. If the group's
 * held fluxes already balance it as a whole, one multiplier is grounded; otherwise the dual is linear
 * along that vector and is maximised exactly along it, which releases fixed fluxes across the
 * group's edge; when there are none, no x ≥ 0 balances the group: it is infeasible.
 *
 * Limits of double precision, each refused with a WebError naming the fluxes: a variance that
 * overflows (cv × value beyond about 1e154) cannot weigh its flux; variances of one compartment's
 * fluxes that differ by more than about 1e15 leave its normal equations without a usable pivot.
 * A variance that underflows to 0 holds its flux, as cv 0 does.
 */

/** Flows in such webs are commonly uncertain by 20-30 % (common practice). */
export const DEFAULT_CV = 0.25;

export interface LeastChangeOptions {
  /** Coefficient of variation of a flux that gives none (default 0.25). */
  readonly defaultCv?: number;
  /** Flux indices held exactly. */
  readonly pinned?: ReadonlySet<number>;
}

/** Relative imbalance of a compartment (to the flux it carries) at which the iteration stops. */
const RESIDUAL_TOLERANCE = 1e-11;
const MAX_ITERATIONS = 500;
const ARMIJO = 1e-4;
const MAX_HALVINGS = 40;

/** The free fluxes (in the donor/recipient terms of A) and what the held ones contribute. */
interface Problem {
  readonly network: Network;
  readonly ids: readonly string[];
  /** Flux index of each free flux. */
  readonly flux: number[];
  readonly from: number[];
  readonly to: number[];
  readonly x0: number[];
  /** v_k = (cv_k x0_k)²: W⁻¹ of the normal equations. */
  readonly v: number[];
  /** Inputs − outputs of each compartment over the held fluxes (−b). */
  readonly heldNet: number[];
  /** Flux each compartment carries, in and out, for relative tolerances. */
  readonly scale: number[];
}

interface DualState {
  readonly lambda: number[];
  /** Free flux values x_k(λ). */
  readonly x: number[];
  /** A x: inputs − outputs of each compartment, the dual gradient. */
  readonly g: number[];
  /** Dual function value. */
  readonly q: number;
}

export function leastChangeBalance(network: Network, options: LeastChangeOptions = {}): Network {
  if (isBalanced(network)) return network;
  const problem = setUp(network, options.defaultCv ?? DEFAULT_CV, options.pinned ?? new Set<number>());
  const state = solveDual(problem);
  const values = network.fluxes.map((f) => f.value);
  problem.flux.forEach((k, m) => {
    values[k] = state.x[m];
  });
  const lost = problem.flux.filter((_, m) => !Number.isFinite(state.x[m]));
  if (lost.length > 0) {
    throw new WebError('infeasible', [
      `least-change balancing lost ${lost.map((k) => describeFlux(network, network.fluxes[k])).join(', ')} to rounding: the flux weights (cv × value) of this web span more than double precision can resolve`,
    ]);
  }
  const balanced = withFluxValues(network, values);
  // The dual converges relative to the flux each compartment carried before; a compartment left
  // carrying a tiny fraction of that (1e-17 of it, say) is balanced to that scale but not to its own.
  const left = imbalances(balanced);
  if (left.length > 0) {
    throw new WebError(
      'infeasible',
      left.map((c) => `least-change balancing cannot resolve compartment "${c.id}": its flows now differ in size from the rest by more than double precision can balance (inputs ${c.inputs}, outputs ${c.outputs})`),
    );
  }
  return balanced;
}

function setUp(network: Network, defaultCv: number, pinned: ReadonlySet<number>): Problem {
  const n = network.n;
  const problem: Problem = {
    network,
    ids: network.ids,
    flux: [],
    from: [],
    to: [],
    x0: [],
    v: [],
    heldNet: new Array<number>(n).fill(0),
    scale: new Array<number>(n).fill(0),
  };
  const unweighable: string[] = [];
  network.fluxes.forEach((f, k) => {
    if (f.to !== OUTSIDE) problem.scale[f.to] += f.value;
    if (f.from !== OUTSIDE) problem.scale[f.from] += f.value;
    const sd = (f.cv ?? defaultCv) * f.value;
    if (!pinned.has(k) && !Number.isFinite(sd * sd)) {
      unweighable.push(`least-change balancing cannot weigh ${describeFlux(network, f)}: cv × value = ${sd} is too large (its square overflows double precision); lower its cv or its value`);
    }
    // a variance that underflows to 0 holds the flux, as cv 0 does
    if (pinned.has(k) || f.value === 0 || !(sd * sd > 0)) {
      if (f.to !== OUTSIDE) problem.heldNet[f.to] += f.value;
      if (f.from !== OUTSIDE) problem.heldNet[f.from] -= f.value;
      return;
    }
    problem.flux.push(k);
    problem.from.push(f.from);
    problem.to.push(f.to);
    problem.x0.push(f.value);
    problem.v.push(sd * sd);
  });
  if (unweighable.length > 0) throw new WebError('infeasible', unweighable);
  return problem;
}

function solveDual(problem: Problem): DualState {
  let state = evaluate(problem, new Array<number>(problem.heldNet.length).fill(0));
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    if (unbalanced(problem, state.g).length === 0) return state;
    const groups = workingGroups(problem, state.x);
    const floating = worstFloatingGroup(problem, state.g, groups);
    state = floating ? rayStep(problem, state, floating) : newtonStep(problem, state, groups);
  }
  throw new WebError(
    'infeasible',
    unbalanced(problem, state.g).map(
      (j) => `least-change balancing did not converge for compartment "${problem.ids[j]}" (inputs − outputs = ${state.g[j]}); ${weightSpread(problem, state, j)}`,
    ),
  );
}

/** a_kᵀλ: λ of the recipient minus λ of the donor (outside counts 0). */
function projected(problem: Problem, lambda: readonly number[], m: number): number {
  const to = problem.to[m];
  const from = problem.from[m];
  return (to === OUTSIDE ? 0 : lambda[to]) - (from === OUTSIDE ? 0 : lambda[from]);
}

function evaluate(problem: Problem, lambda: number[]): DualState {
  const g = problem.heldNet.slice();
  let q = 0;
  for (let j = 0; j < g.length; j++) q += lambda[j] * problem.heldNet[j];
  const x = problem.x0.map((x0, m) => {
    const s = projected(problem, lambda, m);
    const value = Math.max(0, x0 - problem.v[m] * s);
    q += ((value - x0) * (value - x0)) / (2 * problem.v[m]) + s * value;
    if (problem.to[m] !== OUTSIDE) g[problem.to[m]] += value;
    if (problem.from[m] !== OUTSIDE) g[problem.from[m]] -= value;
    return value;
  });
  return { lambda, x, g, q };
}

function unbalanced(problem: Problem, g: readonly number[]): number[] {
  const found: number[] = [];
  g.forEach((gj, j) => {
    if (Math.abs(gj) > RESIDUAL_TOLERANCE * problem.scale[j]) found.push(j);
  });
  return found;
}

interface Group {
  readonly members: number[];
  /** No working-set flux crosses into or out of the web: A W⁻¹ Aᵀ is singular on the group. */
  readonly floating: boolean;
}

/** Compartments joined by working-set flows (union–find). */
function workingGroups(problem: Problem, x: readonly number[]): Group[] {
  const n = problem.heldNet.length;
  const parent = Array.from({ length: n }, (_, j) => j);
  const root = (j: number): number => {
    while (parent[j] !== j) {
      parent[j] = parent[parent[j]];
      j = parent[j];
    }
    return j;
  };
  const anchored = new Array<boolean>(n).fill(false);
  x.forEach((value, m) => {
    if (value <= 0) return;
    const from = problem.from[m];
    const to = problem.to[m];
    if (from !== OUTSIDE && to !== OUTSIDE) parent[root(from)] = root(to);
  });
  x.forEach((value, m) => {
    if (value <= 0) return;
    const inside = problem.from[m] === OUTSIDE ? problem.to[m] : problem.to[m] === OUTSIDE ? problem.from[m] : OUTSIDE;
    if (inside !== OUTSIDE) anchored[root(inside)] = true;
  });
  const byRoot = new Map<number, number[]>();
  for (let j = 0; j < n; j++) {
    const r = root(j);
    const members = byRoot.get(r);
    if (members) members.push(j);
    else byRoot.set(r, [j]);
  }
  return [...byRoot].map(([r, members]) => ({ members, floating: !anchored[r] }));
}

/** The floating group whose held fluxes leave it most out of balance, if any is out of balance. */
function worstFloatingGroup(problem: Problem, g: readonly number[], groups: readonly Group[]): Group | undefined {
  let worst: Group | undefined;
  let worstShare = 0;
  for (const group of groups) {
    if (!group.floating) continue;
    const net = Math.abs(sumOver(group.members, g));
    const scale = sumOver(group.members, problem.scale);
    const share = net / scale;
    if (net > RESIDUAL_TOLERANCE * scale && share > worstShare) {
      worst = group;
      worstShare = share;
    }
  }
  return worst;
}

function sumOver(members: readonly number[], values: readonly number[]): number {
  return members.reduce((sum, j) => sum + values[j], 0);
}

/**
 * Exact maximisation of the dual along the group's all-ones vector. The group's net imbalance
 * g_C falls by v_k (s − s_k) for each fixed flux across its edge released beyond s_k.
 */
function rayStep(problem: Problem, state: DualState, group: Group): DualState {
  const inGroup = new Set(group.members);
  const gC = sumOver(group.members, state.g);
  const direction = Math.sign(gC);
  const releases: { s: number; v: number }[] = [];
  state.x.forEach((value, m) => {
    if (value > 0) return;
    const crossing = (inGroup.has(problem.to[m]) ? 1 : 0) - (inGroup.has(problem.from[m]) ? 1 : 0);
    if (direction * crossing >= 0) return;
    const wouldBe = problem.x0[m] - problem.v[m] * projected(problem, state.lambda, m);
    releases.push({ s: -wouldBe / problem.v[m], v: problem.v[m] });
  });
  if (releases.length === 0) throw infeasibleGroup(problem, group.members, gC);
  releases.sort((a, b) => a.s - b.s);
  let slope = 0;
  let offset = 0;
  let s = 0;
  for (let i = 0; i < releases.length; i++) {
    slope += releases[i].v;
    offset += releases[i].v * releases[i].s;
    s = (Math.abs(gC) + offset) / slope;
    if (i + 1 === releases.length || s <= releases[i + 1].s) break;
  }
  const lambda = state.lambda.slice();
  for (const j of group.members) lambda[j] += direction * s;
  return evaluate(problem, lambda);
}

function infeasibleGroup(problem: Problem, members: readonly number[], gC: number): WebError {
  const names = members.map((j) => `"${problem.ids[j]}"`).join(', ');
  const what =
    gC > 0
      ? `take in ${gC} more than they give out and no free flux can carry it away`
      : `give out ${-gC} more than they take in and no free flux can supply it`;
  return new WebError('infeasible', [
    `cannot balance ${names} with the held fluxes (pinned, zero, or with cv 0 or a cv × value too small to weigh) and every flux ≥ 0: together they ${what}`,
  ]);
}

/** Newton step on the working set's normal equations, then Armijo backtracking on the dual. */
function newtonStep(problem: Problem, state: DualState, groups: readonly Group[]): DualState {
  const d = newtonDirection(problem, state, groups);
  let slope = 0;
  d.forEach((dj, j) => {
    slope += dj * state.g[j];
  });
  let t = 1;
  for (let halving = 0; halving < MAX_HALVINGS; halving++, t /= 2) {
    const trial = evaluate(problem, state.lambda.map((l, j) => l + t * d[j]));
    if (trial.q >= state.q + ARMIJO * t * slope) return trial;
  }
  return evaluate(problem, state.lambda.map((l, j) => l + d[j]));
}

/** d with (A_P W⁻¹ A_Pᵀ) d = g, group by group; one multiplier grounded in a floating group. */
function newtonDirection(problem: Problem, state: DualState, groups: readonly Group[]): number[] {
  const n = state.g.length;
  const H = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  state.x.forEach((value, m) => {
    if (value <= 0) return;
    const from = problem.from[m];
    const to = problem.to[m];
    const v = problem.v[m];
    if (to !== OUTSIDE) H[to][to] += v;
    if (from !== OUTSIDE) H[from][from] += v;
    if (to !== OUTSIDE && from !== OUTSIDE) {
      H[to][from] -= v;
      H[from][to] -= v;
    }
  });
  const d = new Array<number>(n).fill(0);
  for (const group of groups) {
    const free = group.floating ? group.members.slice(1) : group.members;
    if (free.length === 0) continue;
    const dGroup = solveSymmetricPositive(
      free.map((i) => free.map((j) => H[i][j])),
      free.map((j) => state.g[j]),
    );
    if (!Array.isArray(dGroup)) throw unresolvableWeights(problem, state, free[dGroup.notPositiveAt]);
    free.forEach((j, i) => {
      d[j] = dGroup[i];
    });
  }
  return d;
}

/**
 * Cholesky solve after symmetric diagonal scaling: variances of fluxes in one web can span many
 * orders of magnitude, and the scaling keeps the pivots of order one.
 */
function solveSymmetricPositive(H: number[][], rhs: number[]): number[] | { notPositiveAt: number } {
  const size = rhs.length;
  const s = H.map((row, i) => 1 / Math.sqrt(row[i]));
  const L = H.map((row, i) => row.map((h, j) => h * s[i] * s[j]));
  for (let j = 0; j < size; j++) {
    let pivot = L[j][j];
    for (let k = 0; k < j; k++) pivot -= L[j][k] * L[j][k];
    if (!(pivot > 0)) return { notPositiveAt: j };
    L[j][j] = Math.sqrt(pivot);
    for (let i = j + 1; i < size; i++) {
      let sum = L[i][j];
      for (let k = 0; k < j; k++) sum -= L[i][k] * L[j][k];
      L[i][j] = sum / L[j][j];
    }
  }
  const y = rhs.map((b, i) => b * s[i]);
  for (let i = 0; i < size; i++) {
    for (let k = 0; k < i; k++) y[i] -= L[i][k] * y[k];
    y[i] /= L[i][i];
  }
  for (let i = size - 1; i >= 0; i--) {
    for (let k = i + 1; k < size; k++) y[i] -= L[k][i] * y[k];
    y[i] /= L[i][i];
  }
  return y.map((yi, i) => yi * s[i]);
}

/**
 * The normal equations lost their pivot at compartment j: its working-set fluxes' variances differ
 * by more than double precision resolves.
 */
function unresolvableWeights(problem: Problem, state: DualState, j: number): WebError {
  return new WebError('infeasible', [
    `least-change balancing cannot solve for compartment "${problem.ids[j]}": ${weightSpread(problem, state, j)}, wider than double precision can resolve; bring their cvs closer together, or hold a flux exactly with cv 0`,
  ]);
}

/** The standard deviations of compartment j's free fluxes, largest and smallest, for messages. */
function weightSpread(problem: Problem, state: DualState, j: number): string {
  const touching = problem.flux
    .map((k, m) => ({ k, m }))
    .filter(({ m }) => state.x[m] > 0 && (problem.from[m] === j || problem.to[m] === j))
    .sort((a, b) => problem.v[b.m] - problem.v[a.m]);
  const describe = ({ k, m }: { k: number; m: number }) => {
    const f = problem.network.fluxes[k];
    return `${Math.sqrt(problem.v[m]).toPrecision(3)} (${describeFlux(problem.network, f)}, value ${f.value})`;
  };
  if (touching.length === 0) return 'none of its fluxes is free to change';
  const range = touching.length === 1 ? describe(touching[0]) : `${describe(touching[0])} to ${describe(touching[touching.length - 1])}`;
  return `the standard deviations (cv × value) of its fluxes range from ${range}`;
}
