import type { Network } from './network';
import { requireAnalysable } from './balance-check';
import { forEachSimpleCycle, positiveSuccessors, type CycleLimits } from './cycles';
import { zeros } from './linear-algebra';

/**
 * Removal of cycled flow by nexuses (Ulanowicz 1983, Math. Biosci. 65:219-237), METHODS.md §5:
 * each cycle's weak arc is its smallest flow; repeatedly the smallest weak arc among the remaining
 * cycles is taken with its nexus (every remaining cycle through it), its remaining flow is split
 * among the nexus in proportion to each cycle's probability Π T_ij / T_i (original flows and
 * throughflows), and each share is subtracted along its cycle. Subtracting the same amount from
 * every arc of a cycle leaves each compartment's inputs and outputs equal, so the acyclic web
 * (acyclic flows with the original imports, exports and respiration) stays balanced.
 *
 * The smallest weak arc is the smallest flow on any remaining cycle, so every arc of its nexus
 * carries at least that flow and no subtraction can turn a flow negative.
 *
 * Caps: the cycles are enumerated once (Johnson 1975) under the caller's limits and kept for the
 * nexus search up to STORED_ARC_LIMIT arcs in all, so memory stays bounded however many cycles
 * the web holds. When not every cycle could be kept (`capped`), the nexuses of the kept cycles are
 * removed first; the cycles left are then broken one at a time, each a nexus of its own, as a
 * depth-first search meets them. That search needs no memory beyond the web and takes at most one
 * step per arc, so the split is always complete and the acyclic flows never hold a cycle.
 */

export interface Nexus {
  weakArc: { from: number; to: number; value: number };
  /** Vertex lists from their smallest vertex. */
  cycles: number[][];
}

export interface CycleAnalysis {
  /** Simple cycles enumerated (all of them unless capped). */
  count: number;
  /** A cap on count, time or kept cycles was reached: count may fall short and late nexuses are single cycles. */
  capped: boolean;
  nexuses: Nexus[];
  /** T_ij removed as cycled flow; cycledFlow + acyclicFlow = T. */
  cycledFlow: number[][];
  acyclicFlow: number[][];
}

/** Total length of the cycles kept for the nexus search (4 bytes each, twice). */
const STORED_ARC_LIMIT = 4_000_000;
/**
 * An arc left within this fraction of its original flow by a subtraction is exhausted: the
 * shares of a nexus sum to the weak arc's flow only to rounding, and a residue of a few ulps
 * must not survive as a spurious cycle (nor a negative flow).
 */
const EXHAUSTED = 1e-12;

export function cycleAnalysis(network: Network, limits?: CycleLimits): CycleAnalysis {
  requireAnalysable(network);
  const arcs = arcsOf(network);
  const kept = new KeptCycles(arcs);
  const enumeration = forEachSimpleCycle(arcs.successors, (cycle) => kept.add(cycle), limits);
  const flow = arcs.flow.slice();
  const nexuses = removeNexuses(arcs, kept, flow);
  const capped = enumeration.capped || !kept.complete;
  if (capped) nexuses.push(...breakRemainingCycles(arcs, flow));
  const acyclicFlow = zeros(network.n, network.n);
  for (let a = 0; a < arcs.count; a++) acyclicFlow[arcs.from[a]][arcs.to[a]] = flow[a];
  const cycledFlow = network.T.map((row, i) => row.map((t, j) => t - acyclicFlow[i][j]));
  return { count: enumeration.count, capped, nexuses, cycledFlow, acyclicFlow };
}

/** The positive flows as numbered arcs, ordered by donor then recipient. */
interface Arcs {
  readonly n: number;
  readonly count: number;
  readonly from: Int32Array;
  readonly to: Int32Array;
  /** First arc of each donor; arcs of v are start[v] … start[v + 1] − 1. */
  readonly start: Int32Array;
  /** arcIndex[i n + j]: the arc i → j, or −1. */
  readonly arcIndex: Int32Array;
  readonly flow: Float64Array;
  /** log(T_ij / T_i), the arc's term of a cycle's log-probability. */
  readonly logFraction: Float64Array;
  readonly successors: number[][];
}

function arcsOf(network: Network): Arcs {
  const { n, T, throughflow } = network;
  const successors = positiveSuccessors(T);
  const count = successors.reduce((s, row) => s + row.length, 0);
  const from = new Int32Array(count);
  const to = new Int32Array(count);
  const start = new Int32Array(n + 1);
  const arcIndex = new Int32Array(n * n).fill(-1);
  const flow = new Float64Array(count);
  const logFraction = new Float64Array(count);
  let a = 0;
  for (let i = 0; i < n; i++) {
    start[i] = a;
    for (const j of successors[i]) {
      from[a] = i;
      to[a] = j;
      arcIndex[i * n + j] = a;
      flow[a] = T[i][j];
      logFraction[a] = Math.log(T[i][j]) - Math.log(throughflow[i]);
      a++;
    }
  }
  start[n] = a;
  return { n, count, from, to, start, arcIndex, flow, logFraction, successors };
}

/** Cycles as arc lists in one growing buffer, with the arc → cycles index built when complete. */
class KeptCycles {
  private arcs: Int32Array = new Int32Array(1024);
  private length = 0;
  private readonly starts: number[] = [0];
  complete = true;

  constructor(private readonly graph: Arcs) {}

  get count(): number {
    return this.starts.length - 1;
  }

  add(cycle: readonly number[]): void {
    if (!this.complete) return;
    const k = cycle.length;
    if (this.length + k > STORED_ARC_LIMIT) {
      this.complete = false;
      return;
    }
    if (this.length + k > this.arcs.length) {
      const grown = new Int32Array(Math.min(STORED_ARC_LIMIT, 2 * (this.length + k)));
      grown.set(this.arcs.subarray(0, this.length));
      this.arcs = grown;
    }
    const { n, arcIndex } = this.graph;
    for (let p = 0; p < k; p++) this.arcs[this.length++] = arcIndex[cycle[p] * n + cycle[(p + 1) % k]];
    this.starts.push(this.length);
  }

  arcsOf(c: number): Int32Array {
    return this.arcs.subarray(this.starts[c], this.starts[c + 1]);
  }

  vertices(c: number): number[] {
    return Array.from(this.arcsOf(c), (a) => this.graph.from[a]);
  }

  /** cyclesThrough: for each arc, the kept cycles through it in enumeration order (compressed rows). */
  index(): { first: Int32Array; cycles: Int32Array } {
    const first = new Int32Array(this.graph.count + 1);
    for (let p = 0; p < this.length; p++) first[this.arcs[p] + 1]++;
    for (let a = 0; a < this.graph.count; a++) first[a + 1] += first[a];
    const fill = first.slice(0, this.graph.count);
    const cycles = new Int32Array(this.length);
    for (let c = 0; c < this.count; c++) for (const a of this.arcsOf(c)) cycles[fill[a]++] = c;
    return { first, cycles };
  }
}

/** Ulanowicz's nexus procedure over the kept cycles; lowers `flow` in place. */
function removeNexuses(graph: Arcs, kept: KeptCycles, flow: Float64Array): Nexus[] {
  const { first, cycles: through } = kept.index();
  const remaining = new Uint8Array(kept.count).fill(1);
  const logProbability = new Float64Array(kept.count);
  for (let c = 0; c < kept.count; c++) for (const a of kept.arcsOf(c)) logProbability[c] += graph.logFraction[a];
  /** Remaining cycles through each arc; an arc waits in the heap while it has any. */
  const remainingThrough = new Int32Array(graph.count);
  for (let a = 0; a < graph.count; a++) remainingThrough[a] = first[a + 1] - first[a];
  const heap = new ArcHeap(flow);
  for (let a = 0; a < graph.count; a++) if (remainingThrough[a] > 0) heap.push(a);

  const retire = (c: number) => {
    remaining[c] = 0;
    for (const b of kept.arcsOf(c)) if (--remainingThrough[b] === 0) heap.remove(b);
  };
  const nexuses: Nexus[] = [];
  while (heap.size > 0) {
    const weak = heap.peek();
    const nexus: number[] = [];
    for (let p = first[weak]; p < first[weak + 1]; p++) if (remaining[through[p]] === 1) nexus.push(through[p]);
    if (flow[weak] > 0) {
      nexuses.push(splitNexus(graph, kept, flow, heap, weak, nexus, logProbability));
    }
    nexus.forEach(retire);
  }
  return nexuses;
}

/** Splits the weak arc's flow over its nexus by cycle probability and subtracts each share along its cycle. */
function splitNexus(
  graph: Arcs,
  kept: KeptCycles,
  flow: Float64Array,
  heap: ArcHeap,
  weak: number,
  nexus: readonly number[],
  logProbability: Float64Array,
): Nexus {
  const value = flow[weak];
  // Probabilities of long cycles underflow; their ratios within the nexus do not.
  const largest = nexus.reduce((m, c) => Math.max(m, logProbability[c]), -Infinity);
  const weights = nexus.map((c) => Math.exp(logProbability[c] - largest));
  const total = weights.reduce((s, w) => s + w, 0);
  nexus.forEach((c, k) => {
    const share = (value * weights[k]) / total;
    for (const b of kept.arcsOf(c)) {
      if (b === weak) continue;
      flow[b] = exhaustedOrLeft(graph, b, flow[b] - share);
      heap.decreased(b);
    }
  });
  flow[weak] = 0;
  return {
    weakArc: { from: graph.from[weak], to: graph.to[weak], value },
    cycles: nexus.map((c) => kept.vertices(c)),
  };
}

function exhaustedOrLeft(graph: Arcs, arc: number, left: number): number {
  return left <= EXHAUSTED * graph.flow[arc] ? 0 : left;
}

/**
 * Breaks every cycle still carrying flow, one at a time in depth-first order: the cycle's weak arc
 * is its smallest flow and the cycle is its own nexus. Vertices whose every way on is exhausted or
 * finished are finished for good, since flows only fall.
 */
function breakRemainingCycles(graph: Arcs, flow: Float64Array): Nexus[] {
  const { n, start, to } = graph;
  const NEW = 0;
  const ON_PATH = 1;
  const FINISHED = 2;
  const state = new Uint8Array(n);
  const next = start.slice(0, n);
  const path = new Int32Array(n);
  const depth = new Int32Array(n);
  const nexuses: Nexus[] = [];
  const search = (root: number) => {
    let top = 0;
    const enter = (v: number) => {
      state[v] = ON_PATH;
      depth[v] = top;
      path[top++] = v;
    };
    enter(root);
    while (top > 0) {
      const v = path[top - 1];
      while (next[v] < start[v + 1] && (flow[next[v]] === 0 || state[to[next[v]]] === FINISHED)) next[v]++;
      if (next[v] === start[v + 1]) {
        state[v] = FINISHED;
        top--;
        continue;
      }
      const w = to[next[v]];
      if (state[w] === NEW) {
        enter(w);
        continue;
      }
      const arcs = Array.from(path.subarray(depth[w], top), (u) => next[u]);
      nexuses.push(breakCycle(graph, flow, arcs));
      const firstBroken = arcs.findIndex((a) => flow[a] === 0);
      for (let k = depth[w] + firstBroken + 1; k < top; k++) state[path[k]] = NEW;
      top = depth[w] + firstBroken + 1;
    }
  };
  let unfinished = true;
  while (unfinished) {
    unfinished = false;
    for (let v = 0; v < n; v++) {
      if (state[v] === NEW) {
        search(v);
        unfinished = true;
      }
    }
  }
  return nexuses;
}

/** Removes the flow of a cycle's weak arc from every arc of the cycle (arcs in cycle order). */
function breakCycle(graph: Arcs, flow: Float64Array, arcs: readonly number[]): Nexus {
  let weak = arcs[0];
  for (const a of arcs) if (flow[a] < flow[weak]) weak = a;
  const value = flow[weak];
  for (const a of arcs) flow[a] = a === weak ? 0 : exhaustedOrLeft(graph, a, flow[a] - value);
  const vertices = arcs.map((a) => graph.from[a]);
  const smallest = vertices.indexOf(vertices.reduce((m, v) => Math.min(m, v)));
  return {
    weakArc: { from: graph.from[weak], to: graph.to[weak], value },
    cycles: [[...vertices.slice(smallest), ...vertices.slice(0, smallest)]],
  };
}

/** Binary min-heap of arcs keyed by their current flow (ties: lower arc number), with decrease-key. */
class ArcHeap {
  private readonly items: number[] = [];
  private readonly position: Int32Array;

  constructor(private readonly flow: Float64Array) {
    this.position = new Int32Array(flow.length).fill(-1);
  }

  get size(): number {
    return this.items.length;
  }

  peek(): number {
    return this.items[0];
  }

  push(arc: number): void {
    this.items.push(arc);
    this.position[arc] = this.items.length - 1;
    this.up(this.items.length - 1);
  }

  /** The arc's flow fell: move it up if it is in the heap. */
  decreased(arc: number): void {
    if (this.position[arc] >= 0) this.up(this.position[arc]);
  }

  remove(arc: number): void {
    const p = this.position[arc];
    const last = this.items.pop()!;
    this.position[arc] = -1;
    if (last === arc) return;
    this.place(last, p);
    this.up(p);
    this.down(this.position[last]);
  }

  private before(a: number, b: number): boolean {
    return this.flow[a] < this.flow[b] || (this.flow[a] === this.flow[b] && a < b);
  }

  private place(arc: number, p: number): void {
    this.items[p] = arc;
    this.position[arc] = p;
  }

  private up(p: number): void {
    const arc = this.items[p];
    while (p > 0) {
      const parent = (p - 1) >> 1;
      if (!this.before(arc, this.items[parent])) break;
      this.place(this.items[parent], p);
      p = parent;
    }
    this.place(arc, p);
  }

  private down(p: number): void {
    const arc = this.items[p];
    const size = this.items.length;
    for (;;) {
      const left = 2 * p + 1;
      if (left >= size) break;
      const right = left + 1;
      const child = right < size && this.before(this.items[right], this.items[left]) ? right : left;
      if (!this.before(this.items[child], arc)) break;
      this.place(this.items[child], p);
      p = child;
    }
    this.place(arc, p);
  }
}
