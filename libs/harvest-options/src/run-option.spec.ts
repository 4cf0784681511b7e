import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import type { HarvestOption, Web } from '@seinework/contracts';
import { createNetwork, isBalanced, WebError } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { scaledWeb } from '../../network-analysis/src/testing/scaled-web';
import { runOption } from './run-option';
import { webWithAdjustments } from './testing/option-arbitraries';

const option = (adjustments: HarvestOption['adjustments'], response: HarvestOption['response'] = 'bottom-up'): HarvestOption => ({
  name: 'test',
  response,
  adjustments,
});

describe('runOption', () => {
  it('Cone Spring, new fishery on detritivores at 100 (regression target computed from the published table)', () => {
    const run = runOption(cone as Web, option([{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]), { cycles: false });
    expect(run.option.fleets.net.catch).toBe(100);
    expect(run.difference.totalCatch).toBe(100);
    expect(run.baseline.tst - run.option.tst).toBeGreaterThan(0);
    expect(run.difference.tst).toBeCloseTo(run.option.tst - run.baseline.tst, 9);
    expect((run.difference.fleets as Record<string, { catch: number }>).net.catch).toBe(100);
    const flow = run.web.flows.find((f) => f.from === 'detritivores' && f.to === 'carnivores')!;
    expect(flow.value).toBeCloseTo(353.881, 3);
    expect(run.web.exports.at(-1)).toEqual({ from: 'detritivores', value: 100, fleet: 'net' });
    expect(isBalanced(createNetwork(run.web))).toBe(true);
  });

  it('adds Fishing-in-Balance of the option against the baseline, for the whole catch and per fleet (Pauly, Christensen & Walters 2000)', () => {
    const bay = JSON.parse(readFileSync(new URL('../../../seeds/brannock-bay.json', import.meta.url), 'utf8')) as Web;
    const run = runOption(bay, option([{ type: 'scale-catch', fleet: 'Purse seine', compartment: 'forage-fish', percent: -40 }]), { cycles: false });
    const expected = (y: number, tl: number, y0: number, tl0: number) => Math.log10(y) + tl - (Math.log10(y0) + tl0); // TE = 0.1: log10(1/TE) = 1
    expect(run.difference.fishingInBalance).toBeCloseTo(
      expected(run.option.totalCatch, run.option.meanTrophicLevelOfCatch!, run.baseline.totalCatch, run.baseline.meanTrophicLevelOfCatch!),
      12,
    );
    // a cut lands less of a low-level stock: catch falls by more than the rise in mean level makes up for
    expect(run.difference.fishingInBalance).toBeLessThan(0);
    const fleets = run.difference.fleets as Record<string, { fishingInBalance: number | null }>;
    for (const [name, after] of Object.entries(run.option.fleets)) {
      const before = run.baseline.fleets[name];
      expect(fleets[name].fishingInBalance).toBeCloseTo(expected(after.catch, after.meanTrophicLevelOfCatch!, before.catch, before.meanTrophicLevelOfCatch!), 12);
    }
    // the purse seine lands 60 % of its catch, of forage fish whose level shifts only slightly
    expect(fleets['Purse seine'].fishingInBalance).toBeCloseTo(Math.log10(0.6), 2);
    // a fleet that lands nothing on one side has no FiB
    const closed = runOption(bay, option([{ type: 'close-fleet', fleet: 'Set gillnet' }]), { cycles: false });
    expect((closed.difference.fleets as Record<string, { fishingInBalance: number | null }>)['Set gillnet'].fishingInBalance).toBeNull();
  });

  it('an option with no adjustments returns the baseline web unchanged and a zero difference', () => {
    fc.assert(
      fc.property(webWithAdjustments({ max: 8 }), ({ web }) => {
        const run = runOption(web, option([]), { cycles: false });
        expect(run.web).toEqual(web);
        expect(run.option).toEqual(run.baseline);
        expect(run.difference.tst).toBe(0);
        expect(run.difference.robustness).toBe(0);
      }),
      { numRuns: 10 },
    );
  });

  it('the option web round-trips: analysing it again gives the option analysis', () => {
    fc.assert(
      fc.property(webWithAdjustments({ max: 10 }), ({ web, adjustments }) => {
        const run = runOption(web, option(adjustments), { cycles: false });
        const again = runOption(run.web, option([]), { cycles: false });
        expect(again.baseline.totalCatch).toBeCloseTo(run.option.totalCatch, 9);
        expect(again.baseline.ascendency).toBeCloseTo(run.option.ascendency, 6);
      }),
      { numRuns: 20 },
    );
  });

  it('a web whose sums overflow (every value × 1e304) is refused as too large, not blamed on its loops', () => {
    const huge = scaledWeb(cone as Web, 1e304);
    expect(() => runOption(huge, option([{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]))).toThrow(
      /^the numbers of "Cone Spring.*" are too large to analyse/,
    );
  });

  it('refuses an unbalanced web before anything else', () => {
    const web = structuredClone(cone) as Web;
    web.imports[0].value = 11000;
    expect(() => runOption(web, option([]))).toThrow(WebError);
  });
});
