import fc from 'fast-check';
import cone from '../../../tests/fixtures/cone-spring.json';
import { networkFromJson } from './network';
import { countSimpleCycles, forEachSimpleCycle } from './cycles';

/** Every simple cycle by exhaustive search from each smallest vertex (the reference). */
function bruteForceCycles(successors: readonly (readonly number[])[]): string[] {
  const found: string[] = [];
  const path: number[] = [];
  const onPath = new Set<number>();
  const extend = (s: number, v: number) => {
    for (const w of successors[v]) {
      if (w === s) found.push([...path].join(','));
      else if (w > s && !onPath.has(w)) {
        path.push(w);
        onPath.add(w);
        extend(s, w);
        path.pop();
        onPath.delete(w);
      }
    }
  };
  successors.forEach((_, s) => {
    path.push(s);
    onPath.add(s);
    extend(s, s);
    path.pop();
    onPath.delete(s);
  });
  return found;
}

function enumerate(successors: readonly (readonly number[])[], limits = {}): { cycles: number[][]; count: number; capped: boolean } {
  const cycles: number[][] = [];
  const result = forEachSimpleCycle(successors, (cycle) => cycles.push([...cycle]), limits);
  return { cycles, ...result };
}

function complete(n: number, selfLoops = false): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => j).filter((j) => selfLoops || j !== i));
}

/** Random small digraphs, self-loops included, as successor lists. */
const digraph = fc
  .integer({ min: 1, max: 7 })
  .chain((n) => fc.array(fc.array(fc.boolean(), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }))
  .map((adjacency) => adjacency.map((row) => row.flatMap((linked, j) => (linked ? [j] : []))));

describe('simple cycles (Johnson 1975, SIAM J. Comput. 4:77-84)', () => {
  it('finds the 5 simple cycles of Cone Spring (METHODS.md §5 check), each from its smallest vertex in Johnson order', () => {
    const network = networkFromJson(cone);
    expect(countSimpleCycles(network)).toEqual({ count: 5, capped: false });
    const { cycles } = enumerate(network.T.map((row) => row.flatMap((t, j) => (t > 0 ? [j] : []))));
    const named = cycles.map((c) => c.map((i) => network.ids[i]).join(' → '));
    expect(named).toEqual([
      'detritus → bacteria',
      'detritus → bacteria → detritivores',
      'detritus → bacteria → detritivores → carnivores',
      'detritus → detritivores',
      'detritus → detritivores → carnivores',
    ]);
  });

  it('counts the cycles of complete digraphs: Σ_k C(n,k)(k−1)!, plus n self-loops', () => {
    expect(enumerate(complete(5)).count).toBe(84);
    expect(enumerate(complete(5, true)).count).toBe(89);
    expect(enumerate(complete(8)).count).toBe(16_064);
    // a clock that stands still: on a busy machine the default 5 s time cap must not cut the count short
    expect(forEachSimpleCycle(complete(10), () => {}, { maxCycles: 2_000_000, now: () => 0 })).toEqual({ count: 1_112_073, capped: false });
  });

  it('stops at 1,000,000 cycles by default', () => {
    expect(forEachSimpleCycle(complete(10), () => {}, { now: () => 0 })).toEqual({ count: 1_000_000, capped: true });
  });

  it('reports a self-loop as a cycle of length 1', () => {
    expect(enumerate([[0, 1], [1]]).cycles).toEqual([[0], [1]]);
  });

  it('matches brute-force enumeration on random small digraphs, with self-loops', () => {
    fc.assert(
      fc.property(digraph, (successors) => {
        const { cycles, count, capped } = enumerate(successors);
        const expected = bruteForceCycles(successors);
        expect(capped).toBe(false);
        expect(count).toBe(expected.length);
        expect(cycles.map((c) => c.join(',')).sort()).toEqual([...expected].sort());
        for (const cycle of cycles) expect(Math.min(...cycle)).toBe(cycle[0]);
        const starts = cycles.map((c) => c[0]);
        expect(starts).toEqual([...starts].sort((a, b) => a - b));
      }),
      { numRuns: 300 },
    );
  });

  it('follows a cycle through thousands of vertices without recursion', () => {
    const n = 3000;
    const ring = Array.from({ length: n }, (_, i) => [(i + 1) % n]);
    const { cycles } = enumerate(ring);
    expect(cycles).toHaveLength(1);
    expect(cycles[0]).toHaveLength(n);
  });

  it('hands the visitor one reused array rather than a new one per cycle', () => {
    const seen = new Set<readonly number[]>();
    forEachSimpleCycle(complete(5), (cycle) => seen.add(cycle));
    expect(seen.size).toBe(1);
  });

  it('honours the count cap: count ≤ maxCycles, capped only when cycles remain', () => {
    fc.assert(
      fc.property(digraph, fc.integer({ min: 0, max: 40 }), (successors, maxCycles) => {
        const total = bruteForceCycles(successors).length;
        const { count, capped, cycles } = enumerate(successors, { maxCycles });
        expect(count).toBe(Math.min(total, maxCycles));
        expect(cycles).toHaveLength(count);
        expect(capped).toBe(total > maxCycles);
      }),
    );
  });

  it('honours the time cap with an injected clock', () => {
    const total = 16_064; // complete digraph on 8 vertices
    expect(enumerate(complete(8), { now: () => 0, maxMilliseconds: 0 })).toMatchObject({ count: total, capped: false });
    const slowClock = (msPerRead: number) => {
      let reads = 0;
      return () => msPerRead * reads++;
    };
    const first = enumerate(complete(8), { now: slowClock(1), maxMilliseconds: 5 });
    expect(first.capped).toBe(true);
    expect(first.count).toBeGreaterThan(0);
    expect(first.count).toBeLessThan(total);
    expect(enumerate(complete(8), { now: slowClock(1), maxMilliseconds: 5 }).count).toBe(first.count);
    expect(enumerate(complete(8), { now: slowClock(1), maxMilliseconds: 0 })).toEqual(
      expect.objectContaining({ count: 0, capped: true }),
    );
  });
});
