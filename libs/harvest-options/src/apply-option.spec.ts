import fc from 'fast-check';
import { createNetwork, isBalanced, requireAnalysable, WebError, type Network } from '@seinework/network-analysis';
import { anyStructureWeb } from '../../network-analysis/src/testing/arbitraries';
import { nonFinite } from '../../network-analysis/src/testing/non-finite';
import { runOption } from './run-option';
import type { Adjustment, ResponseRule, Web } from '@seinework/contracts';
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
  /**
   * One to three adjustments: three times in four of a kind the web has something for, on its own
   * fleets, catches and producers, one per fleet and producer; otherwise of any kind, also on fleet "C"
   * or compartment "c6" it may lack, repeats allowed. Unknown names, contradictions, impossible catches
   * and structural dead ends all come up, while most options can still be met.
   */
  const adjustmentsOn = (web: Web): fc.Arbitrary<Adjustment[]> => {
    const catches = web.exports.flatMap((e) => (e.fleet === undefined ? [] : [{ fleet: e.fleet, compartment: e.from }]));
    const fleets = [...new Set(catches.map((c) => c.fleet))];
    const ids = web.compartments.map((c) => c.id);
    const producers = web.compartments.filter((c) => c.kind === 'producer' && web.imports.some((f) => f.to === c.id && f.value > 0)).map((c) => c.id);
    const adjustment = (knownOnly: boolean): fc.Arbitrary<Adjustment> => {
      const pick = <T>(known: readonly T[], unknown: T): fc.Arbitrary<T> =>
        known.length === 0 ? fc.constant(unknown) : knownOnly ? fc.constantFrom(...known) : fc.constantFrom(...known, unknown);
      const onCatch = pick(catches, { fleet: 'C', compartment: 'c6' });
      const kinds: [available: boolean, fc.Arbitrary<Adjustment>][] = [
        [catches.length > 0, fc.record({ on: onCatch, percent: fc.double({ min: -100, max: 500, noNaN: true }) }).map(({ on, percent }): Adjustment => ({ type: 'scale-catch', ...on, percent }))],
        [catches.length > 0, fc.record({ on: onCatch, amount: fc.double({ min: 0, max: 1e4, noNaN: true }) }).map(({ on, amount }): Adjustment => ({ type: 'set-catch', ...on, amount }))],
        [fleets.length > 0, pick(fleets, 'C').map((fleet): Adjustment => ({ type: 'close-fleet', fleet }))],
        [
          true,
          fc
            .record({ fleet: fc.constantFrom(...fleets, 'N'), compartment: pick(ids, 'c6'), amount: fc.double({ min: 0, max: 1e3, noNaN: true }) })
            .map((a): Adjustment => ({ type: 'open-fishery', ...a })),
        ],
        [producers.length > 0, fc.record({ compartment: pick(producers, 'c6'), percent: fc.double({ min: -100, max: 300, noNaN: true }) }).map((a): Adjustment => ({ type: 'scale-production', ...a }))],
      ];
      return fc.oneof(...kinds.filter(([available]) => available || !knownOnly).map(([, arbitrary]) => arbitrary));
    };
    // one adjustment per fleet and per producer cannot contradict another; no adjustments at all is
    // the baseline itself (tested above). A new fleet "N" is one fleet too.
    const target = (a: Adjustment) => (a.type === 'scale-production' ? `production of ${a.compartment}` : `fleet ${a.fleet}`);
    return fc.oneof(
      { weight: 3, arbitrary: fc.uniqueArray(adjustment(true), { minLength: 1, maxLength: 3, selector: target }) },
      { weight: 1, arbitrary: fc.array(adjustment(false), { minLength: 1, maxLength: 3 }) },
    );
  };
  // zero flows are common enough to give isolated compartments and dead ends, rare enough that most webs carry flow
  const plausible = fc.oneof({ weight: 1, arbitrary: fc.constant(0) }, { weight: 3, arbitrary: fc.double({ min: 1e-3, max: 1e4, noNaN: true }) });
  const runs = 300;

  it.each(['bottom-up', 'least-change'] as const)('%s: a balanced, non-negative web meeting every target, or a WebError naming the problem', (response) => {
    let met = 0;
    fc.assert(
      fc.property(anyStructureWeb(plausible).chain((web) => fc.tuple(fc.constant(web), adjustmentsOn(web))), ([web, adjustments]) => {
        let baseline: Network;
        try {
          baseline = createNetwork(web);
          requireAnalysable(baseline);
        } catch (error) {
          // the analysis engine's own refusals are tested there; anything else is a crash
          if (error instanceof WebError) return;
          throw error;
        }
        try {
          checkOption(baseline, adjustments, response);
          // and the whole run document (baseline, option, difference, web) holds no NaN or infinity
          expect(nonFinite(runOption(web, { name: 'fuzz', response, adjustments }, { cycles: { maxCycles: 2_000 } }))).toEqual([]);
        } catch (error) {
          expect(error, String(error)).toBeInstanceOf(WebError);
          expect((error as WebError).problems.length).toBeGreaterThan(0);
          return;
        }
        met++;
      }),
      { numRuns: runs },
    );
    // the property must not pass by refusing nearly everything
    expect(met).toBeGreaterThan(runs / 3);
  });
});
