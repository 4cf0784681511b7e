import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson, withFluxValues, type Network } from './network';
import { isBalanced } from './balance-check';
import { countSimpleCycles } from './cycles';
import { cycleAnalysis, type CycleAnalysis } from './cycle-removal';
import { WebError } from './web-error';
import { balancedWeb } from './testing/arbitraries';
import { generateWeb } from './testing/generated-web';

/** The web with its internal flows replaced by the acyclic flows (imports, exports, respiration kept). */
function acyclicWeb(network: Network, analysis: CycleAnalysis): Network {
  return withFluxValues(
    network,
    network.fluxes.map((f) => (f.kind === 'flow' ? analysis.acyclicFlow[f.from][f.to] : f.value)),
  );
}

function expectConsistentSplit(network: Network, analysis: CycleAnalysis): void {
  const { T } = network;
  T.forEach((row, i) =>
    row.forEach((t, j) => {
      expect(analysis.acyclicFlow[i][j]).toBeGreaterThanOrEqual(0);
      expect(analysis.cycledFlow[i][j]).toBeGreaterThanOrEqual(-1e-9 * t);
      expect(Math.abs(analysis.cycledFlow[i][j] + analysis.acyclicFlow[i][j] - t)).toBeLessThanOrEqual(1e-12 * t);
    }),
  );
  const acyclic = acyclicWeb(network, analysis);
  expect(isBalanced(acyclic)).toBe(true);
  expect(countSimpleCycles(acyclic)).toEqual({ count: 0, capped: false });
}

const at = (network: Network, from: string, to: string) => [network.index.get(from)!, network.index.get(to)!] as const;

describe('cycle removal by nexuses (Ulanowicz 1983, Math. Biosci. 65:219-237)', () => {
  const network = networkFromJson(cone);
  const analysis = cycleAnalysis(network);

  it('Cone Spring: 5 simple cycles, acyclic flows and cycled arc flow of METHODS.md §5 (regression targets computed from the published table, not published results)', () => {
    expect(analysis.count).toBe(5);
    expect(analysis.capped).toBe(false);
    const acyclic = (from: string, to: string) => {
      const [i, j] = at(network, from, to);
      return analysis.acyclicFlow[i][j];
    };
    // the removal ends in whole numbers here: only rounding (about 1e-13) separates the results from them
    expect(acyclic('plants', 'detritus')).toBeCloseTo(8881, 9);
    expect(acyclic('detritus', 'bacteria')).toBeCloseTo(3530, 9);
    expect(acyclic('detritus', 'detritivores')).toBeCloseTo(2017, 9);
    expect(acyclic('detritivores', 'carnivores')).toBeCloseTo(203, 9);
    const cycled = analysis.cycledFlow.flat().reduce((s, c) => s + c, 0);
    expect(cycled).toBeCloseTo(4176, 9);
    expectConsistentSplit(network, analysis);
  });

  it('Cone Spring: the first nexus is the weak arc bacteria → detritivores (75) with both cycles through it', () => {
    const [bacteria, detritivores] = at(network, 'bacteria', 'detritivores');
    expect(analysis.nexuses[0].weakArc).toEqual({ from: bacteria, to: detritivores, value: 75 });
    const names = analysis.nexuses[0].cycles.map((c) => c.map((i) => network.ids[i]));
    expect(names).toEqual([
      ['detritus', 'bacteria', 'detritivores'],
      ['detritus', 'bacteria', 'detritivores', 'carnivores'],
    ]);
    // Probabilities Π T_ij / T_i differ only after detritivores: 200/T_3 against (370/T_3)(167/370),
    // so the 75 splits 200 : 167; each later weak arc carries what its cycle has left.
    const share = (w: number) => (75 * w) / 367;
    const values = analysis.nexuses.map((x) => x.weakArc.value);
    expect(values).toHaveLength(4);
    expect(values[0]).toBe(75);
    expect(values[1]).toBeCloseTo(167 - share(167), 9);
    expect(values[2]).toBeCloseTo(200 - share(200), 9);
    expect(values[3]).toBe(1600);
  });

  it('splits a flow with a self-loop: T_ii is a cycle of length 1', () => {
    const web: Web = {
      name: 'self-loop',
      unit: 'u',
      compartments: [
        { id: 'a', name: 'A', kind: 'producer' },
        { id: 'd', name: 'D', kind: 'detritus' },
      ],
      flows: [
        { from: 'a', to: 'd', value: 10 },
        { from: 'd', to: 'd', value: 4 },
      ],
      imports: [{ to: 'a', value: 10 }],
      exports: [],
      respiration: [{ from: 'd', value: 10 }],
    };
    const loop = createNetwork(web);
    const result = cycleAnalysis(loop);
    expect(result.count).toBe(1);
    expect(result.nexuses).toEqual([{ weakArc: { from: 1, to: 1, value: 4 }, cycles: [[1]] }]);
    expect(result.acyclicFlow).toEqual([[0, 10], [0, 0]]);
    expectConsistentSplit(loop, result);
  });

  it('cycled + acyclic = original, the acyclic web balanced and cycle-free, on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb(), (web) => {
        const generated = createNetwork(web);
        const result = cycleAnalysis(generated);
        expect(result.capped).toBe(false);
        expect(result.count).toBe(countSimpleCycles(generated).count);
        expect(result.nexuses.length === 0).toBe(result.count === 0);
        expectConsistentSplit(generated, result);
      }),
      { numRuns: 60 },
    );
  });

  it('leaves acyclic webs untouched', () => {
    fc.assert(
      fc.property(balancedWeb({ cycles: false }), (web) => {
        const generated = createNetwork(web);
        const result = cycleAnalysis(generated);
        expect(result).toMatchObject({ count: 0, capped: false, nexuses: [] });
        expect(result.acyclicFlow).toEqual(generated.T);
        expect(result.cycledFlow.flat().every((c) => c === 0)).toBe(true);
      }),
      { numRuns: 30 },
    );
  });

  it('when the count cap is reached, says so and still returns a complete, consistent split', () => {
    fc.assert(
      fc.property(balancedWeb({ min: 6, max: 14 }), fc.integer({ min: 0, max: 5 }), (web, maxCycles) => {
        const generated = createNetwork(web);
        const total = countSimpleCycles(generated).count;
        const result = cycleAnalysis(generated, { maxCycles });
        expect(result.count).toBe(Math.min(total, maxCycles));
        expect(result.capped).toBe(total > maxCycles);
        expectConsistentSplit(generated, result);
      }),
      { numRuns: 60 },
    );
  });

  it('when the time cap is reached (injected clock), says so and still returns a consistent split', () => {
    const dense = createNetwork(generateWeb({ compartments: 40, seed: 7, density: 0.6 }));
    let reads = 0;
    const result = cycleAnalysis(dense, { now: () => reads++, maxMilliseconds: 3 });
    expect(result.capped).toBe(true);
    expect(result.count).toBeLessThan(countSimpleCycles(dense, { maxCycles: 100_000 }).count);
    expectConsistentSplit(dense, result);
  });

  it('refuses an unbalanced web', () => {
    const web = structuredClone(cone) as typeof cone;
    web.imports[0].value += 100;
    expect(() => cycleAnalysis(networkFromJson(web))).toThrow(WebError);
  });
});
