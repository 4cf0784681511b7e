import fc from 'fast-check';
import type { HarvestOption, Web } from '@seinework/contracts';
import { createNetwork, isBalanced, WebError } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
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

  it('refuses an unbalanced web before anything else', () => {
    const web = structuredClone(cone) as Web;
    web.imports[0].value = 11000;
    expect(() => runOption(web, option([]))).toThrow(WebError);
  });
});
