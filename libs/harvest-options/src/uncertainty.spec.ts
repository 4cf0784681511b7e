import fc from 'fast-check';
import type { HarvestOption, Web } from '@seinework/contracts';
import { createNetwork, scalarIndicators, SCALAR_INDICATORS, WebError } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import detritivoreFishery from '../../../tests/fixtures/cone-spring-detritivore-fishery.json';
import { applyOption } from './apply-option';
import { drawSeed, lognormalDraw } from './uncertainty-draw';
import { optionUncertainty, quantile } from './uncertainty';
import { webWithAdjustments } from './testing/option-arbitraries';

const coneWeb = cone as Web;
const newFishery = detritivoreFishery as HarvestOption;

describe('optionUncertainty (Monte Carlo of METHODS.md §8)', () => {
  it('with cv = 0 every band collapses to the deterministic value', async () => {
    await fc.assert(
      fc.asyncProperty(webWithAdjustments({ max: 10 }), async ({ web, adjustments }) => {
        const baseline = createNetwork(web);
        const option = { response: 'bottom-up' as const, adjustments };
        const before = scalarIndicators(baseline);
        const summary = await optionUncertainty(web, option, { draws: 5, cv: 0, seed: 1 });
        let after: ReturnType<typeof scalarIndicators>;
        try {
          after = scalarIndicators(applyOption(baseline, option));
        } catch (error) {
          // an option the engine refuses (e.g. a catch cut to 1e-15 of itself) is refused in every draw alike
          expect(error).toBeInstanceOf(WebError);
          expect(summary.failed).toBe(5);
          expect(summary.failures[0]).toBe(`draw 0: ${(error as WebError).problems[0]}`);
          return;
        }
        expect(summary.failed).toBe(0);
        for (const key of SCALAR_INDICATORS) {
          const u = summary.indicators[key];
          if (before[key] === null) expect(u.baseline).toBeNull();
          else expect(u.baseline).toEqual({ median: before[key], p5: before[key], p95: before[key] });
          if (after[key] !== null) expect(u.option).toEqual({ median: after[key], p5: after[key], p95: after[key] });
          if (before[key] !== null && after[key] !== null) {
            const d = after[key]! - before[key]!;
            expect(u.difference).toEqual({ median: d, p5: d, p95: d });
            expect(u.shareDifferencePositive).toBe(d > 0 ? 1 : 0);
            expect(u.robust).toBe(d !== 0);
          }
        }
        expect(summary.robustDifferences).toEqual(SCALAR_INDICATORS.filter((key) => summary.indicators[key].robust));
      }),
      { numRuns: 10 },
    );
  });

  it('medians approach the deterministic value as cv shrinks', async () => {
    const baseline = createNetwork(coneWeb);
    const exact = scalarIndicators(applyOption(baseline, newFishery)).robustness - scalarIndicators(baseline).robustness;
    const error = async (cv: number) => {
      const s = await optionUncertainty(coneWeb, newFishery, { draws: 41, cv, seed: 11 });
      return Math.abs(s.indicators.robustness.difference!.median - exact);
    };
    const [large, medium, small] = [await error(0.2), await error(0.02), await error(0.0002)];
    expect(medium).toBeLessThan(large);
    expect(small).toBeLessThan(medium);
    expect(small).toBeLessThan(1e-3 * Math.abs(exact));
  });

  it('is identical bit for bit whatever the chunking, and reports progress after each chunk (worker threads: libs/draw-pool)', async () => {
    const settings = { draws: 24, cv: 0.15, seed: 2024 };
    const progress: [number, number][] = [];
    const inChunks = await optionUncertainty(coneWeb, newFishery, settings, { chunkSize: 5, onProgress: (done, total) => progress.push([done, total]) });
    const inProcess = await optionUncertainty(coneWeb, newFishery, settings, { chunkSize: 24 });
    expect(inChunks).toEqual(inProcess);
    expect(inChunks.succeeded).toBe(24);
    expect(progress).toEqual([[5, 24], [10, 24], [15, 24], [20, 24], [24, 24]]);
    const other = await optionUncertainty(coneWeb, newFishery, { ...settings, seed: 2025 });
    expect(other.indicators.tst.baseline!.median).not.toBe(inProcess.indicators.tst.baseline!.median);
  });

  it('counts and reports draws in which the option cannot be met', async () => {
    // carnivores can land at most about 363.6 with everything else fixed; near it, some draws fail
    const option: HarvestOption = { ...newFishery, adjustments: [{ type: 'open-fishery', fleet: 'net', compartment: 'carnivores', amount: 355 }] };
    const summary = await optionUncertainty(coneWeb, option, { draws: 30, cv: 0.1, seed: 3 });
    expect(summary.failed).toBeGreaterThan(0);
    expect(summary.succeeded).toBeGreaterThan(0);
    expect(summary.failed + summary.succeeded).toBe(30);
    expect(summary.failures[0]).toMatch(/^draw \d+: adjustments\[0\] .*cannot supply/);
  });

  it('refuses an invalid option before drawing', async () => {
    await expect(
      optionUncertainty(coneWeb, { adjustments: [{ type: 'close-fleet', fleet: 'nobody' }] }, { draws: 3, cv: 0.1, seed: 1 }),
    ).rejects.toThrow(/adjustments\[0\] \(close-fleet "nobody"\): unknown fleet/);
  });
});

describe('draws', () => {
  it('lognormal factors have mean 1 and log-spread σ² = ln(1 + cv²), μ = −σ²/2, to within sampling error', () => {
    const network = createNetwork({
      name: 'spread',
      unit: 'u',
      compartments: [{ id: 'a', name: 'A', kind: 'producer' }, { id: 'b', name: 'B', kind: 'consumer' }],
      flows: [{ from: 'a', to: 'b', value: 1, cv: 1 }],
      imports: [{ to: 'a', value: 2, cv: 0.5 }],
      exports: [],
      respiration: [{ from: 'a', value: 1 }, { from: 'b', value: 1, cv: 2 }],
    });
    const defaultCv = 0.1;
    const draws = 20000;
    const logFactors = Array.from({ length: draws }, (_, k) =>
      lognormalDraw(network, defaultCv, drawSeed(9, k)).map((x, i) => Math.log(x / network.fluxes[i].value)),
    );
    network.fluxes.forEach((flux, i) => {
      const cv = flux.cv ?? defaultCv;
      const sigma2 = Math.log1p(cv * cv);
      const logs = logFactors.map((draw) => draw[i]);
      const logMean = logs.reduce((s, x) => s + x, 0) / draws;
      const logVariance = logs.reduce((s, x) => s + (x - logMean) ** 2, 0) / (draws - 1);
      // five standard errors of a normal sample's mean (σ/√n) and variance (σ²·√(2/(n−1))): a spread of
      // cv² instead of ln(1 + cv²) is off by 12 or more of them for cv ≥ 0.5
      expect(Math.abs(logVariance - sigma2)).toBeLessThan(5 * sigma2 * Math.sqrt(2 / (draws - 1)));
      expect(Math.abs(logMean + sigma2 / 2)).toBeLessThan(5 * Math.sqrt(sigma2 / draws));
      // the factor itself has standard deviation cv, so its sample mean lies within 5 cv/√n of 1
      const mean = logs.reduce((s, x) => s + Math.exp(x), 0) / draws;
      expect(Math.abs(mean - 1)).toBeLessThan((5 * cv) / Math.sqrt(draws));
    });
  });

  it('draw seeds depend on the seed and the draw index only', () => {
    expect(drawSeed(7, 3)).toBe(drawSeed(7, 3));
    const seeds = new Set(Array.from({ length: 1000 }, (_, k) => drawSeed(7, k)));
    expect(seeds.size).toBe(1000);
    expect(drawSeed(7, 0)).not.toBe(drawSeed(8, 0));
    expect(drawSeed(7, 0)).not.toBe(drawSeed(7 + 2 ** 32, 0));
  });

  it('quantiles interpolate between order statistics', () => {
    expect(quantile([1, 2, 3, 4, 5], 0.5)).toBe(3);
    expect(quantile([0, 10], 0.05)).toBeCloseTo(0.5, 12);
    expect(quantile([4], 0.95)).toBe(4);
    expect(quantile([1, Infinity, Infinity], 0.95)).toBe(Infinity);
  });
});
