import fc from 'fast-check';
import { SCALAR_INDICATORS, type Analysis, type Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { analyzeWeb } from './analyze';
import { mulberry32 } from './random';
import { anyStructureWeb, balancedWeb } from './testing/arbitraries';
import { WebError } from './web-error';
import { scaledWeb } from './testing/scaled-web';
import { nonFinite } from './testing/non-finite';
import { catchWebError } from './testing/catch-web-error';

/**
 * The composed analysis (METHODS.md §11) must not depend on how compartments are named or listed,
 * and must scale as its definitions say when every flow of a web is multiplied by one constant.
 */

/** Renames every compartment and lists compartments and flows in a shuffled order. */
function relabelled(web: Web, seed: number): { web: Web; rename: (id: string) => string } {
  const random = mulberry32(seed);
  const shuffle = <T>(items: readonly T[]): T[] => {
    const copy = [...items];
    for (let i = copy.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [copy[i], copy[j]] = [copy[j], copy[i]];
    }
    return copy;
  };
  const order = shuffle(web.compartments.map((c) => c.id));
  const names = new Map(order.map((id, k) => [id, `renamed-${k}`]));
  const rename = (id: string) => names.get(id)!;
  return {
    rename,
    web: {
      ...web,
      compartments: order.map((id) => ({ ...web.compartments.find((c) => c.id === id)!, id: rename(id) })),
      flows: shuffle(web.flows).map((f) => ({ ...f, from: rename(f.from), to: rename(f.to) })),
      imports: shuffle(web.imports).map((f) => ({ ...f, to: rename(f.to) })),
      exports: shuffle(web.exports).map((f) => ({ ...f, from: rename(f.from) })),
      respiration: shuffle(web.respiration).map((f) => ({ ...f, from: rename(f.from) })),
    },
  };
}

function expectClose(actual: number | null, expected: number | null, what: string): void {
  if (expected === null || actual === null) {
    expect(actual, what).toBe(expected);
    return;
  }
  expect(Math.abs(actual - expected), what).toBeLessThanOrEqual(1e-8 * Math.max(1, Math.abs(expected)));
}

const options = { cycles: { maxCycles: 20_000 } } as const;

describe('analyze', () => {
  it('gives the same indices, compartment by compartment, however compartments are named and listed', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 14 }), fc.nat(), (web, seed) => {
        const before = analyzeWeb(web, options);
        const { web: other, rename } = relabelled(web, seed);
        const after = analyzeWeb(other, options);
        for (const key of SCALAR_INDICATORS) expectClose(after[key], before[key], key);
        for (const c of web.compartments) {
          expectClose(after.trophicLevels[rename(c.id)], before.trophicLevels[c.id], `trophic level of ${c.id}`);
          expectClose(after.cycledThroughflow[rename(c.id)], before.cycledThroughflow[c.id], `cycled throughflow of ${c.id}`);
          for (const d of web.compartments) {
            expectClose(after.totalDependency[rename(c.id)][rename(d.id)], before.totalDependency[c.id][d.id], `d(${c.id} → ${d.id})`);
            expectClose(after.mixedTrophicImpact[rename(c.id)][rename(d.id)], before.mixedTrophicImpact[c.id][d.id], `MTI(${c.id} → ${d.id})`);
          }
        }
        expect(after.cycles!.count).toBe(before.cycles!.count);
        expect(Object.keys(after.fleets).sort()).toEqual(Object.keys(before.fleets).sort());
      }),
      { numRuns: 40 },
    );
  });

  it('multiplying every flow by k multiplies the sizes by k and leaves the shares, levels and information ratios alone', () => {
    const scaledBy = ['tst', 'totalSystemThroughflow', 'developmentCapacity', 'ascendency', 'overhead', 'totalCatch', 'primaryProductionRequired'] as const;
    const unchanged = SCALAR_INDICATORS.filter((key) => !(scaledBy as readonly string[]).includes(key));
    fc.assert(
      fc.property(balancedWeb({ max: 14 }), fc.double({ min: 0.01, max: 100, noNaN: true }), (web, k) => {
        const before = analyzeWeb(web, options);
        const after: Analysis = analyzeWeb(scaledWeb(web, k), options);
        for (const key of scaledBy) expectClose(after[key], before[key] * k, key);
        for (const key of unchanged) expectClose(after[key], before[key], key);
        for (const c of web.compartments) {
          expectClose(after.trophicLevels[c.id], before.trophicLevels[c.id], `trophic level of ${c.id}`);
          expectClose(after.primaryProductionIntensity[c.id], before.primaryProductionIntensity[c.id], `intensity of ${c.id}`);
          for (const d of web.compartments) expectClose(after.mixedTrophicImpact[c.id][d.id], before.mixedTrophicImpact[c.id][d.id], `MTI(${c.id} → ${d.id})`);
        }
        after.trophicLadder.levels.forEach((level, i) => expectClose(level.efficiency, before.trophicLadder.levels[i].efficiency, `TE of level ${i + 1}`));
      }),
      { numRuns: 40 },
    );
  });

  it('reports Finn’s secondary form TST_c / (TST − TST_c) beside the index (Cone Spring: 2,815.7 / (30,626 − 2,815.7), Finn 1976)', () => {
    const analysis = analyzeWeb(cone);
    expect(analysis.finnCycledToStraightRatio).toBeCloseTo(2815.7 / (30626 - 2815.7), 4);
    expect(analysis.finnCycledToStraightRatio).toBeCloseTo(analysis.finnCyclingIndex / (1 - analysis.finnCyclingIndex), 12);
  });
});

describe('analyze at the edges of double precision', () => {
  it('numbers whose sums overflow (every value × 1e304, × 3.1e303) are refused as too large, not blamed on the loops', () => {
    for (const k of [1e304, 3.1e303, 1.5e303]) {
      const error = catchWebError(() => analyzeWeb(scaledWeb(cone as Web, k), options));
      expect(error.problems).toEqual([expect.stringMatching(/^the numbers of "Cone Spring.*" are too large to analyse: .*give the web in a larger unit$/)]);
    }
  });

  it('numbers from 1e-300 to 1e300 give a document with no NaN or infinity', () => {
    for (const k of [1e-300, 1e-160, 1e160, 1e300]) expect(nonFinite(analyzeWeb(scaledWeb(cone as Web, k), options))).toEqual([]);
  });
});

/** Either an analysis or a WebError with at least one readable problem: what lets the server answer 4xx, never 500. */
function analyseOrRefuse(web: Web): Analysis | null {
  try {
    return analyzeWeb(web, options);
  } catch (error) {
    expect(error, String(error)).toBeInstanceOf(WebError);
    expect((error as WebError).problems.length).toBeGreaterThan(0);
    return null;
  }
}

describe('analyze on webs of any structure', () => {
  it('never fails with anything but a WebError, whatever the numbers (zeros, subnormals, 1e300)', () => {
    const anyNumber = fc.oneof(fc.constant(0), fc.constant(Number.MIN_VALUE), fc.double({ min: 0, max: 1e300, noNaN: true }));
    fc.assert(fc.property(anyStructureWeb(anyNumber), (web) => void analyseOrRefuse(web)), { numRuns: 300 });
  });

  it('gives only finite numbers (or null), anywhere in the document, for every web it accepts with flows between 1e-6 and 1e6', () => {
    // JSON would print NaN and ±Infinity as null without a word: none may reach the document
    const plausible = fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 1e6, noNaN: true }));
    fc.assert(
      fc.property(anyStructureWeb(plausible), (web) => {
        const analysis = analyseOrRefuse(web);
        if (analysis === null) return;
        expect(nonFinite(analysis)).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });
});
