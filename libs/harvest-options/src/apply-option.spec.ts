import fc from 'fast-check';
import { createNetwork, isBalanced, requireAnalysable, WebError, type Network } from '@seinework/network-analysis';
import { anyStructureWeb } from '../../network-analysis/src/testing/arbitraries';
import { nonFinite } from '../../network-analysis/src/testing/non-finite';
import { runOption } from './run-option';
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

describe('applyOption on webs of any structure and any adjustments', () => {
  // Fleets A and B and compartments c0…c6 exist in some webs and not in others, so unknown names,
  // contradictions, impossible catches and structural dead ends all come up.
  const adjustment: fc.Arbitrary<Adjustment> = fc.oneof(
    fc.record({ type: fc.constant('scale-catch' as const), fleet: fc.constantFrom('A', 'B', 'C'), compartment: fc.constantFrom('c0', 'c1', 'c2', 'c6'), percent: fc.double({ min: -100, max: 500, noNaN: true }) }),
    fc.record({ type: fc.constant('set-catch' as const), fleet: fc.constantFrom('A', 'B'), compartment: fc.constantFrom('c0', 'c1', 'c3'), amount: fc.double({ min: 0, max: 1e4, noNaN: true }) }),
    fc.record({ type: fc.constant('close-fleet' as const), fleet: fc.constantFrom('A', 'B', 'C') }),
    fc.record({ type: fc.constant('open-fishery' as const), fleet: fc.constantFrom('A', 'N'), compartment: fc.constantFrom('c0', 'c1', 'c4'), amount: fc.double({ min: 0, max: 1e3, noNaN: true }) }),
    fc.record({ type: fc.constant('scale-production' as const), compartment: fc.constantFrom('c0', 'c2'), percent: fc.double({ min: -100, max: 300, noNaN: true }) }),
  );
  const plausible = fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 1e4, noNaN: true }));

  it.each(['bottom-up', 'least-change'] as const)('%s: a balanced, non-negative web meeting every target, or a WebError naming the problem', (response) => {
    fc.assert(
      fc.property(anyStructureWeb(plausible), fc.array(adjustment, { maxLength: 4 }), (web, adjustments) => {
        let baseline: Network;
        try {
          baseline = createNetwork(web);
          requireAnalysable(baseline);
        } catch {
          return; // the analysis engine's own refusals are tested there
        }
        try {
          checkOption(baseline, adjustments, response);
          // and the whole run document (baseline, option, difference, web) holds no NaN or infinity
          expect(nonFinite(runOption(web, { name: 'fuzz', response, adjustments }, { cycles: { maxCycles: 2_000 } }))).toEqual([]);
        } catch (error) {
          expect(error, String(error)).toBeInstanceOf(WebError);
          expect((error as WebError).problems.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 300 },
    );
  });
});
