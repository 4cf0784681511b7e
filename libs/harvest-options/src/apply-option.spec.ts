import fc from 'fast-check';
import { createNetwork, isBalanced, WebError, type Network } from '@seinework/network-analysis';
import type { Adjustment, ResponseRule } from '@seinework/contracts';
import { applyOption } from './apply-option';
import { planOption } from './option-web';
import { webWithAdjustments } from './testing/option-arbitraries';

/** The invariants of METHODS.md §8 on random webs and random valid options, under both response rules. */

function checkOption(baseline: Network, adjustments: Adjustment[], response: ResponseRule): Network {
  const option = applyOption(baseline, { response, adjustments });
  expect(isBalanced(option)).toBe(true);
  for (const f of option.fluxes) expect(f.value).toBeGreaterThanOrEqual(0);
  for (const target of planOption(baseline, adjustments).catches) {
    const landed = option.fluxes[target.flux].value;
    expect(Math.abs(landed - target.amount)).toBeLessThanOrEqual(1e-9 * target.amount);
  }
  return option;
}

describe('applyOption', () => {
  it('bottom-up: option webs are balanced, never negative, and meet every catch target exactly', () => {
    fc.assert(
      fc.property(webWithAdjustments(), ({ web, adjustments }) => {
        checkOption(createNetwork(web), adjustments, 'bottom-up');
      }),
      { numRuns: 40 },
    );
  });

  it('least change: the same, and no new link appears', () => {
    let solved = 0;
    fc.assert(
      fc.property(webWithAdjustments({ max: 12 }), ({ web, adjustments }) => {
        const baseline = createNetwork(web);
        let option: Network;
        try {
          option = checkOption(baseline, adjustments, 'least-change');
        } catch (error) {
          // a large cut with every producer import pinned can leave no balanced non-negative web
          if (error instanceof WebError && error.kind === 'infeasible') return;
          throw error;
        }
        solved++;
        const targets = new Set(planOption(baseline, adjustments).catches.map((c) => c.flux));
        baseline.fluxes.forEach((f, k) => {
          if (f.value === 0 && !targets.has(k)) expect(option.fluxes[k].value).toBe(0);
        });
        const imports = option.fluxes.filter((f) => f.kind === 'import' && option.kinds[f.to] === 'producer');
        const scaled = adjustments.some((a) => a.type === 'scale-production');
        if (!scaled) expect(imports).toEqual(baseline.fluxes.filter((f) => f.kind === 'import' && baseline.kinds[f.to] === 'producer'));
      }),
      { numRuns: 30 },
    );
    expect(solved).toBeGreaterThan(15);
  });

  it('with no adjustments returns the baseline itself', () => {
    fc.assert(
      fc.property(webWithAdjustments({ max: 8 }), ({ web }) => {
        const baseline = createNetwork(web);
        expect(applyOption(baseline, { adjustments: [] })).toBe(baseline);
        expect(applyOption(baseline, { response: 'least-change', adjustments: [] })).toBe(baseline);
      }),
      { numRuns: 10 },
    );
  });
});
