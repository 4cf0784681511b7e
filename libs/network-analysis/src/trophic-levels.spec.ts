import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson } from './network';
import { internalDiet, trophicLevels } from './trophic-levels';
import { balancedWeb } from './testing/arbitraries';
import { balancedByRespiration } from './testing/balanced-by-respiration';
import { catchWebError } from './testing/catch-web-error';

const TOLERANCE = 1e-9;

/** Producer p (import 100) feeding consumer a; consumer b eats a and also takes an import of 30. */
function withConsumerImport(): Web {
  return balancedByRespiration('consumer import', { p: 'producer', a: 'consumer', b: 'consumer' }, [['p', 'a', 40], ['a', 'b', 10]], { p: 100, b: 30 });
}

describe('internalDiet', () => {
  it('renormalises a consumer diet over internal intake, leaving imports out', () => {
    const network = createNetwork(withConsumerImport());
    const g = internalDiet(network);
    // b takes 10 from a and 30 imported: its internal diet is all a
    expect(g[1][2]).toBe(1);
    expect(g[0][1]).toBe(1);
    expect(g.map((row) => row[0])).toEqual([0, 0, 0]);
  });

  it('Cone Spring: detritivores eat detritus 2309 and bacteria 75 of 2384; detritus has no diet', () => {
    const network = networkFromJson(cone);
    const g = internalDiet(network);
    expect(g[1][3]).toBeCloseTo(2309 / 2384, 15);
    expect(g[2][3]).toBeCloseTo(75 / 2384, 15);
    expect(g.map((row) => row[1])).toEqual([0, 0, 0, 0, 0]);
  });
});

describe('trophicLevels', () => {
  // [check] METHODS.md §3: Levine 1980 (J. theor. Biol. 83:195-207) applied to the Cone Spring table
  // (Tilly 1968; Finn 1976, J. theor. Biol. 56:363-380).
  it('Cone Spring: plants and detritus 1, bacteria 2, detritivores 2.0315, carnivores 3.0315', () => {
    const network = networkFromJson(cone);
    const { levels, warnings } = trophicLevels(network);
    const at = (id: string) => levels[network.index.get(id)!];
    expect(at('plants')).toBe(1);
    expect(at('detritus')).toBe(1);
    expect(at('bacteria')).toBeCloseTo(2, 4);
    expect(at('detritivores')).toBeCloseTo(2.0315, 4);
    expect(at('carnivores')).toBeCloseTo(3.0315, 4);
    expect(warnings).toEqual([]);
  });

  it('ignores imports to a consumer: b sits one level above its only internal prey', () => {
    expect(trophicLevels(createNetwork(withConsumerImport())).levels).toEqual([1, 2, 3]);
  });

  it('puts a consumer fed only by imports at level 2 and names it in a warning', () => {
    const web = withConsumerImport();
    web.flows = [{ from: 'p', to: 'a', value: 40 }];
    web.respiration[1].value = 40;
    web.imports[1].value = 40;
    const { levels, warnings } = trophicLevels(createNetwork(web));
    expect(levels).toEqual([1, 2, 2]);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(/"b".*level is set to 2/);
  });

  it('solves consumer cycles exactly: a eats p and b, b eats a', () => {
    // a: 50 from p, 50 from b → TL_a = 1 + (1 + TL_b)/2, TL_b = 1 + TL_a → TL_a = 4, TL_b = 5
    const web = balancedByRespiration('cycle', { p: 'producer', a: 'consumer', b: 'consumer' }, [['p', 'a', 50], ['a', 'b', 60], ['b', 'a', 50]], { p: 100 });
    const { levels } = trophicLevels(createNetwork(web));
    expect(levels[1]).toBeCloseTo(4, 12);
    expect(levels[2]).toBeCloseTo(5, 12);
  });

  it('refuses consumers that feed only on one another, naming them', () => {
    const web = withConsumerImport();
    // b eats only a and a eats only b: no food path from the producer
    web.flows = [
      { from: 'a', to: 'b', value: 10 },
      { from: 'b', to: 'a', value: 10 },
    ];
    web.imports = [{ to: 'p', value: 60 }, { to: 'a', value: 30 }, { to: 'b', value: 40 }];
    const error = catchWebError(() => trophicLevels(createNetwork(web)));
    expect(error.kind).toBe('invalid');
    expect(error.problems[0]).toMatch(/"a", "b"/);
  });

  it('refuses an unbalanced web', () => {
    const web = structuredClone(cone) as Web;
    web.imports[0].value = 20000;
    expect(catchWebError(() => trophicLevels(createNetwork(web))).kind).toBe('unbalanced');
  });

  it('satisfies TL_j = 1 + Σ_i g\'_ij TL_i for consumers, level 1 elsewhere, on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25 }), (web) => {
        const network = createNetwork(web);
        const g = internalDiet(network);
        const { levels } = trophicLevels(network);
        network.kinds.forEach((kind, j) => {
          if (kind !== 'consumer') expect(levels[j]).toBe(1);
          else expect(levels[j]).toBeCloseTo(1 + g.reduce((s, row, i) => s + row[j] * levels[i], 0), 9);
        });
      }),
    );
  });

  it('puts every consumer at level 2 or above, since every prey is at level 1 or above', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25 }), (web) => {
        const network = createNetwork(web);
        const { levels } = trophicLevels(network);
        network.kinds.forEach((kind, j) => {
          if (kind === 'consumer') expect(levels[j]).toBeGreaterThanOrEqual(2 - TOLERANCE);
        });
      }),
    );
  });
});
