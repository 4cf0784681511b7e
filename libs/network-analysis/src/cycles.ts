import type { Network } from './network';

/**
 * Simple cycles (elementary circuits) among compartments, METHODS.md §5, by Johnson's algorithm
 * (Johnson 1975, SIAM J. Comput. 4:77-84): every simple cycle exactly once, starting at its
 * smallest vertex s, for s = 0, 1, … in turn, searching only the strong component of s in the
 * subgraph of vertices ≥ s, with Johnson's blocked set and B lists so that no dead end is searched
 * twice between two cycles.
 *
 * A food web can hold astronomically many cycles, hence the caps on count and time. The search is
 * iterative (a cycle may be as long as the web, far deeper than a safe call stack) and allocates
 * nothing per cycle: the visitor is handed the search's own path, valid only during the call.
 */

export interface CycleLimits {
  /** Stop after this many cycles (default 1,000,000). */
  maxCycles?: number;
  /** Stop after this much time (default 5,000 ms). */
  maxMilliseconds?: number;
  /** Clock in milliseconds (default performance.now); inject one to test the time cap. */
  now?: () => number;
}

export interface EnumerationResult {
  /** Cycles visited. */
  count: number;
  /** A cap stopped the search while cycles may remain unvisited. */
  capped: boolean;
}

const DEFAULT_MAX_CYCLES = 1_000_000;
const DEFAULT_MAX_MILLISECONDS = 5_000;
/** The clock is read once per this many search steps (a power of two), not once per step. */
const STEPS_PER_CLOCK_READ = 1024;

/**
 * Calls `visit` with each simple cycle of the digraph given by `successors` (each successor listed
 * once; `successors[i]` may contain i itself: a self-loop is a cycle of length 1). The cycle is the
 * vertex list from its smallest vertex, in Johnson's order; the array is reused after `visit`
 * returns, so copy it to keep it.
 */
export function forEachSimpleCycle(
  successors: readonly (readonly number[])[],
  visit: (cycle: readonly number[]) => void,
  limits: CycleLimits = {},
): EnumerationResult {
  const maxCycles = limits.maxCycles ?? DEFAULT_MAX_CYCLES;
  const maxMilliseconds = limits.maxMilliseconds ?? DEFAULT_MAX_MILLISECONDS;
  const now = limits.now ?? (() => performance.now());
  const started = now();
  const outOfTime = () => now() - started > maxMilliseconds;
  const search = new JohnsonSearch(successors);
  let count = 0;
  for (let s = 0; s < successors.length; s++) {
    if (outOfTime()) return { count, capped: true };
    if (!search.restrictToComponentOf(s)) continue;
    const found = search.circuits(s, visit, maxCycles - count, outOfTime);
    count += found.count;
    if (found.capped) return { count, capped: true };
    search.reset();
  }
  return { count, capped: false };
}

/** Counts the simple cycles among the compartments of a web along its positive flows T_ij. */
export function countSimpleCycles(network: Network, limits?: CycleLimits): EnumerationResult {
  return forEachSimpleCycle(positiveSuccessors(network.T), () => {}, limits);
}

/** successors[i]: every j with T_ij > 0, ascending. */
export function positiveSuccessors(T: readonly (readonly number[])[]): number[][] {
  return T.map((row) => row.flatMap((value, j) => (value > 0 ? [j] : [])));
}

/** Buffers of one enumeration, allocated once per graph and reused for every start vertex s. */
class JohnsonSearch {
  private readonly n: number;
  /** The whole graph, compressed rows. */
  private readonly succStart: Int32Array;
  private readonly succ: Int32Array;
  private readonly predStart: Int32Array;
  private readonly pred: Int32Array;
  /** A_K of Johnson: adjacency within the current component, compressed rows. */
  private readonly adjStart: Int32Array;
  private readonly adjEnd: Int32Array;
  private readonly adj: Int32Array;
  private readonly component: Int32Array;
  private componentSize = 0;
  /** Stamps: vertex v is in the current component when inComponent[v] === stamp. */
  private readonly inComponent: Int32Array;
  private readonly forward: Int32Array;
  private readonly visited: Int32Array;
  private stamp = 0;
  private readonly queue: Int32Array;
  private readonly blocked: Uint8Array;
  /** Johnson's B(w) as lists with a membership table (inB[w n + v]) to keep each v once. */
  private readonly B: number[][];
  private readonly inB: Uint8Array;
  private readonly unblockStack: Int32Array;
  /** The current path; handed to the visitor as the cycle when it closes back on s. */
  private readonly path: number[] = [];
  /** Next position in adj for each vertex on the path, and whether a cycle was found beyond it. */
  private readonly next: Int32Array;
  private readonly foundCycle: Uint8Array;

  constructor(successors: readonly (readonly number[])[]) {
    const n = successors.length;
    this.n = n;
    [this.succStart, this.succ] = compressed(successors.length, (emit) =>
      successors.forEach((row, v) => row.forEach((w) => emit(v, w))),
    );
    [this.predStart, this.pred] = compressed(successors.length, (emit) =>
      successors.forEach((row, v) => row.forEach((w) => emit(w, v))),
    );
    this.adjStart = new Int32Array(n);
    this.adjEnd = new Int32Array(n);
    this.adj = new Int32Array(this.succ.length);
    this.component = new Int32Array(n);
    this.inComponent = new Int32Array(n);
    this.forward = new Int32Array(n);
    this.visited = new Int32Array(n);
    this.queue = new Int32Array(n);
    this.blocked = new Uint8Array(n);
    this.B = Array.from({ length: n }, () => []);
    this.inB = new Uint8Array(n * n);
    this.unblockStack = new Int32Array(n);
    this.next = new Int32Array(n);
    this.foundCycle = new Uint8Array(n);
  }

  /**
   * Makes A_K the strong component of s in the subgraph of vertices ≥ s (the vertices reached from
   * s that also reach s). False when no cycle can pass through s there.
   */
  restrictToComponentOf(s: number): boolean {
    const stamp = ++this.stamp;
    this.reach(s, this.succStart, this.succ, (v) => {
      this.forward[v] = stamp;
      return true;
    });
    this.componentSize = 0;
    this.reach(s, this.predStart, this.pred, (v) => {
      if (this.forward[v] !== stamp) return false;
      this.inComponent[v] = stamp;
      this.component[this.componentSize++] = v;
      return true;
    });
    let k = 0;
    for (let c = 0; c < this.componentSize; c++) {
      const v = this.component[c];
      this.adjStart[v] = k;
      for (let p = this.succStart[v]; p < this.succStart[v + 1]; p++) {
        const w = this.succ[p];
        if (this.inComponent[w] === stamp) this.adj[k++] = w;
      }
      this.adjEnd[v] = k;
    }
    return this.adjEnd[s] > this.adjStart[s];
  }

  /** Breadth-first from s over vertices ≥ s along the given rows; `enter` says whether to go on from v. */
  private reach(s: number, start: Int32Array, to: Int32Array, enter: (v: number) => boolean): void {
    const seen = ++this.stamp;
    const mark = this.visited;
    let head = 0;
    let tail = 0;
    mark[s] = seen;
    if (enter(s)) this.queue[tail++] = s;
    while (head < tail) {
      const v = this.queue[head++];
      for (let p = start[v]; p < start[v + 1]; p++) {
        const w = to[p];
        if (w < s || mark[w] === seen) continue;
        mark[w] = seen;
        if (enter(w)) this.queue[tail++] = w;
      }
    }
  }

  /** Johnson's CIRCUIT(s), iterative; stops after `budget` cycles or when `outOfTime`. */
  circuits(
    s: number,
    visit: (cycle: readonly number[]) => void,
    budget: number,
    outOfTime: () => boolean,
  ): EnumerationResult {
    const { path, blocked, next, foundCycle, adj, adjStart, adjEnd } = this;
    let count = 0;
    let steps = 0;
    this.enter(s);
    while (path.length > 0) {
      if ((++steps & (STEPS_PER_CLOCK_READ - 1)) === 0 && outOfTime()) return this.abandon(count);
      const v = path[path.length - 1];
      if (next[v] < adjEnd[v]) {
        const w = adj[next[v]++];
        if (w === s) {
          if (count === budget) return this.abandon(count);
          count++;
          visit(path);
          foundCycle[v] = 1;
        } else if (blocked[w] === 0) {
          this.enter(w);
        }
        continue;
      }
      if (foundCycle[v] === 1) this.unblock(v);
      else this.blockBehind(v, adjStart[v], adjEnd[v]);
      path.pop();
      if (foundCycle[v] === 1 && path.length > 0) foundCycle[path[path.length - 1]] = 1;
    }
    return { count, capped: false };
  }

  private enter(v: number): void {
    this.path.push(v);
    this.blocked[v] = 1;
    this.next[v] = this.adjStart[v];
    this.foundCycle[v] = 0;
  }

  private abandon(count: number): EnumerationResult {
    this.path.length = 0;
    return { count, capped: true };
  }

  /** v stays blocked until one of its successors w is unblocked: v joins B(w). */
  private blockBehind(v: number, from: number, to: number): void {
    const { n, adj, inB, B } = this;
    for (let p = from; p < to; p++) {
      const w = adj[p];
      if (inB[w * n + v] === 0) {
        inB[w * n + v] = 1;
        B[w].push(v);
      }
    }
  }

  /** Johnson's UNBLOCK(u), with an explicit stack; each vertex is pushed while blocked, so once. */
  private unblock(u: number): void {
    const { n, blocked, inB, B, unblockStack } = this;
    let top = 0;
    blocked[u] = 0;
    unblockStack[top++] = u;
    while (top > 0) {
      const x = unblockStack[--top];
      const list = B[x];
      for (let k = 0; k < list.length; k++) {
        const y = list[k];
        inB[x * n + y] = 0;
        if (blocked[y] === 1) {
          blocked[y] = 0;
          unblockStack[top++] = y;
        }
      }
      list.length = 0;
    }
  }

  /** Clears blocked and B for the component just searched, ready for the next s. */
  reset(): void {
    const { n, blocked, inB, B } = this;
    for (let c = 0; c < this.componentSize; c++) {
      const v = this.component[c];
      blocked[v] = 0;
      for (const y of B[v]) inB[v * n + y] = 0;
      B[v].length = 0;
    }
  }
}

/** Compressed rows (start offsets, targets) of the pairs (v, w) that `each` emits, in emission order per row. */
function compressed(n: number, each: (emit: (v: number, w: number) => void) => void): [Int32Array, Int32Array] {
  const start = new Int32Array(n + 1);
  each((v) => start[v + 1]++);
  for (let v = 0; v < n; v++) start[v + 1] += start[v];
  const fill = start.slice(0, n);
  const to = new Int32Array(start[n]);
  each((v, w) => (to[fill[v]++] = w));
  return [start, to];
}
