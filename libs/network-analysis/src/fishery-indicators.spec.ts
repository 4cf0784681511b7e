import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson, type Network } from './network';
import {
  fisheryIndicators,
  fishingInBalance,
  primaryProductionIntensity,
  ruleOfThumbPrimaryProductionRequired,
} from './fishery-indicators';
import { trophicLevels } from './trophic-levels';
import { balancedWeb } from './testing/arbitraries';
import { WebError } from './web-error';
import { balancedByRespiration } from './testing/balanced-by-respiration';
import { catchWebError } from './testing/catch-web-error';

const TOLERANCE = 1e-9;
const sum = (values: readonly number[]) => values.reduce((s, v) => s + v, 0);

/**
 * Cone Spring with two fisheries, still balanced: a priced trap fishery takes 100 of the carnivores'
 * 167 returned to detritus, an unpriced net fishery 100 of bacteria's 255 export; detritus exports
 * 100 less to make up for the smaller return.
 */
function fishedConeSpring(): Web {
  const web = structuredClone(cone) as Web;
  web.areaKm2 = 2;
  web.tonnesPerUnit = 0.045;
  web.flows.find((f) => f.from === 'carnivores')!.value = 67;
  web.exports = [
    { from: 'plants', value: 300 },
    { from: 'detritus', value: 760 },
    { from: 'bacteria', value: 155 },
    { from: 'bacteria', value: 100, fleet: 'net' },
    { from: 'carnivores', value: 100, fleet: 'trap', price: 3000 },
  ];
  return web;
}

function indicatorsOf(network: Network) {
  return fisheryIndicators(network, trophicLevels(network).levels);
}

describe('primaryProductionIntensity', () => {
  const network = networkFromJson(cone);
  const epsilon = primaryProductionIntensity(network);
  const at = (id: string) => epsilon[network.index.get(id)!]!;

  // [check] METHODS.md §9 — regression targets computed from the published Cone Spring table
  // (Tilly 1968; Finn 1976, J. theor. Biol. 56:363-380), not published results.
  it('Cone Spring: plants 1.218, detritus 6.990, bacteria 18.85, detritivores 30.80, carnivores 68.23 (computed from the table)', () => {
    expect(at('plants')).toBeCloseTo(1.218, 3);
    expect(at('detritus')).toBeCloseTo(6.99, 3);
    expect(at('bacteria')).toBeCloseTo(18.85, 2);
    expect(at('detritivores')).toBeCloseTo(30.8, 2);
    expect(at('carnivores')).toBeCloseTo(68.23, 2);
  });

  it('Cone Spring: the exports embody all primary production, Σ ε_j e_j = Σ w = 11,184', () => {
    expect(sum(network.e.map((e, j) => e * epsilon[j]!))).toBeCloseTo(11184, 9);
  });

  it('gives null to a respiration-only compartment and to a group from which only respiration leaves', () => {
    const web = structuredClone(cone) as Web;
    web.compartments.push(
      { id: 'sink', name: 'Sink', kind: 'consumer' },
      { id: 'x', name: 'X', kind: 'consumer' },
      { id: 'y', name: 'Y', kind: 'consumer' },
    );
    // plants' 300 export goes instead to sink (respires all) and to x ⇄ y (respire, never export)
    web.exports = web.exports.filter((e) => e.from !== 'plants');
    web.flows.push(
      { from: 'plants', to: 'sink', value: 100 },
      { from: 'plants', to: 'x', value: 200 },
      { from: 'x', to: 'y', value: 150 },
      { from: 'y', to: 'x', value: 50 },
    );
    web.respiration.push({ from: 'sink', value: 100 }, { from: 'x', value: 100 }, { from: 'y', value: 100 });
    const changed = createNetwork(web);
    const intensities = primaryProductionIntensity(changed);
    expect(intensities.slice(5)).toEqual([null, null, null]);
    const plants = intensities[0]!;
    // plants now embody 11,184 over a non-respired output of 9,181 still
    expect(plants).toBeCloseTo(11184 / 9181, 12);
    const exported = sum(changed.e.map((e, j) => (e > 0 ? e * intensities[j]! : 0)));
    expect(exported + 300 * plants).toBeCloseTo(11184, 9);
  });
});

describe('fisheryIndicators', () => {
  it('Cone Spring has no catch: no mean trophic level, nothing required, no tonnes', () => {
    const result = indicatorsOf(networkFromJson(cone));
    expect(result.totalCatch).toBe(0);
    expect(result.meanTrophicLevelOfCatch).toBeNull();
    expect(result.primaryProductionRequired).toBe(0);
    expect(result.primaryProductionRequiredShare).toBe(0);
    expect(result.totalTonnes).toBeNull();
    expect(result.totalValue).toBeNull();
    expect(result.ruleOfThumbPrimaryProductionRequired).toBeNull();
    expect(result.fleets).toEqual({});
  });

  describe('fished Cone Spring', () => {
    const network = createNetwork(fishedConeSpring());
    const TL = trophicLevels(network).levels;
    const epsilon = primaryProductionIntensity(network);
    const result = fisheryIndicators(network, TL);
    const [bacteria, carnivores] = [2, 4];

    it('catch and mean trophic level per fleet and in total (Pauly et al. 1998, Science 279:860-863)', () => {
      expect(result.totalCatch).toBe(200);
      expect(result.fleets.trap.catch).toBe(100);
      expect(result.fleets.trap.meanTrophicLevelOfCatch).toBeCloseTo(3.0315, 4);
      expect(result.fleets.net.meanTrophicLevelOfCatch).toBeCloseTo(2, 12);
      expect(result.meanTrophicLevelOfCatch).toBeCloseTo((TL[bacteria] + TL[carnivores]) / 2, 12);
    });

    it('tonnes = catch × tonnesPerUnit × areaKm2; value only where prices are given', () => {
      expect(result.fleets.trap.tonnes).toBeCloseTo(100 * 0.045 * 2, 12);
      expect(result.totalTonnes).toBeCloseTo(200 * 0.045 * 2, 12);
      expect(result.fleets.trap.value).toBeCloseTo(9 * 3000, 9);
      expect(result.fleets.net.value).toBeNull();
      expect(result.totalValue).toBeCloseTo(9 * 3000, 9);
    });

    it('primary production required Σ ε_j Y_j, per fleet, in total and as a share of primary production', () => {
      expect(result.fleets.trap.primaryProductionRequired).toBeCloseTo(100 * epsilon[carnivores]!, 9);
      expect(result.fleets.net.primaryProductionRequired).toBeCloseTo(100 * epsilon[bacteria]!, 9);
      expect(result.primaryProductionRequired).toBeCloseTo(100 * (epsilon[carnivores]! + epsilon[bacteria]!), 9);
      expect(result.primaryProductionRequiredShare).toBeCloseTo(result.primaryProductionRequired / 11184, 12);
      expect(result.primaryProductionIntensity).toEqual(epsilon);
    });

    it('rule-of-thumb PPR from the tonnes wet weight caught (Pauly & Christensen 1995, Nature 374:255-257)', () => {
      const expected = (9 / 9) * 10 ** (TL[carnivores] - 1) + (9 / 9) * 10 ** (TL[bacteria] - 1);
      expect(result.ruleOfThumbPrimaryProductionRequired).toBeCloseTo(expected, 9);
    });
  });

  it('refuses tonnes or a value that overflow rather than print them as null ("not given")', () => {
    const tonnes = catchWebError(() => indicatorsOf(createNetwork({ ...fishedConeSpring(), tonnesPerUnit: 1e307 })));
    expect(tonnes.problems[0]).toMatch(/^the total catch in tonnes \(areaKm2 2 × tonnesPerUnit 1e\+307 × catch 200\) is too large to compute/);
    const web = fishedConeSpring();
    web.exports.find((e) => e.fleet === 'trap')!.price = 1e308;
    const value = catchWebError(() => indicatorsOf(createNetwork(web)));
    expect(value.problems).toEqual([
      expect.stringMatching(/^the value of the total catch \(tonnes × price\) is too large to compute/),
      expect.stringMatching(/^the value of the catch of fleet "trap" \(tonnes × price\) is too large to compute/),
    ]);
    const unpriced = { ...fishedConeSpring(), tonnesPerUnit: 1e305 };
    unpriced.exports = unpriced.exports.map(({ price: _, ...e }) => e);
    const ruleOfThumb = catchWebError(() => indicatorsOf(createNetwork(unpriced)));
    expect(ruleOfThumb.problems).toEqual([expect.stringMatching(/^the rule-of-thumb primary production required .* is too large to compute/)]);
  });

  it('share is null with no primary production', () => {
    const web: Web = {
      name: 'detritus only',
      unit: 'u',
      compartments: [
        { id: 'd', name: 'D', kind: 'detritus' },
        { id: 'c', name: 'C', kind: 'consumer' },
      ],
      flows: [{ from: 'd', to: 'c', value: 10 }],
      imports: [{ to: 'd', value: 10 }],
      exports: [{ from: 'c', value: 2, fleet: 'f' }],
      respiration: [{ from: 'c', value: 8 }],
    };
    const result = indicatorsOf(createNetwork(web));
    expect(result.primaryProductionRequiredShare).toBeNull();
    expect(result.primaryProductionRequired).toBe(0);
    expect(result.meanTrophicLevelOfCatch).toBe(2);
  });

  describe('on generated webs', () => {
    const property = (check: (network: Network) => void) =>
      // acyclic generated webs often hold compartments that only respire
      fc.assert(
        fc.property(fc.oneof(balancedWeb({ max: 25 }), balancedWeb({ max: 25, cycles: false })), (web) =>
          check(createNetwork(web)),
        ),
      );

    it('conserves embodied primary production: exports plus what reaches null compartments = Σ w', () => {
      property((network) => {
        const { T, z, e, kinds } = network;
        const epsilon = primaryProductionIntensity(network);
        const w = z.map((zj, j) => (kinds[j] === 'producer' ? zj : 0));
        let embodied = 0;
        epsilon.forEach((ej, j) => {
          if (ej !== null) embodied += ej * e[j];
          else embodied += w[j] + sum(T.map((row, i) => (epsilon[i] === null ? 0 : epsilon[i]! * row[j])));
        });
        expect(Math.abs(embodied - sum(w))).toBeLessThan(TOLERANCE * Math.max(1, sum(w)));
      });
    });

    it('every intensity solves ε_j (T_j − r_j) = Σ_i ε_i T_ij + w_j', () => {
      property((network) => {
        const { T, z, r, kinds, throughflow } = network;
        const epsilon = primaryProductionIntensity(network);
        epsilon.forEach((ej, j) => {
          if (ej === null) return;
          const inflow = sum(T.map((row, i) => (epsilon[i] ?? 0) * row[j])) + (kinds[j] === 'producer' ? z[j] : 0);
          expect(Math.abs(ej * (throughflow[j] - r[j]) - inflow)).toBeLessThan(1e-6 * Math.max(1, inflow));
        });
      });
    });

    it('mean trophic level of the catch lies between the lowest and highest level caught', () => {
      property((network) => {
        const TL = trophicLevels(network).levels;
        const result = fisheryIndicators(network, TL);
        const caught = TL.filter((_, i) => network.catches.some((row) => row[i] > 0));
        if (caught.length === 0) expect(result.meanTrophicLevelOfCatch).toBeNull();
        else {
          expect(result.meanTrophicLevelOfCatch!).toBeGreaterThanOrEqual(Math.min(...caught) - TOLERANCE);
          expect(result.meanTrophicLevelOfCatch!).toBeLessThanOrEqual(Math.max(...caught) + TOLERANCE);
        }
      });
    });

    it('fleets add up to the totals of catch and primary production required', () => {
      property((network) => {
        const result = indicatorsOf(network);
        const fleets = Object.values(result.fleets);
        expect(sum(fleets.map((f) => f.catch))).toBeCloseTo(result.totalCatch, 9);
        expect(Math.abs(sum(fleets.map((f) => f.primaryProductionRequired)) - result.primaryProductionRequired)).toBeLessThan(
          TOLERANCE * Math.max(1, result.primaryProductionRequired),
        );
      });
    });
  });
});

describe('fishingInBalance (Pauly, Christensen & Walters 2000, ICES J. Mar. Sci. 57:697-706)', () => {
  it('[check] catch 100 → 1000 with TL 3.5 → 2.5 gives FiB = 0', () => {
    expect(fishingInBalance(1000, 2.5, 100, 3.5)).toBeCloseTo(0, 12);
  });

  it('rises by log10(1/TE) per level at equal catch, and by log10 of the catch ratio at equal level', () => {
    expect(fishingInBalance(100, 3, 100, 2)).toBeCloseTo(1, 12);
    expect(fishingInBalance(100, 3, 100, 2, 0.2)).toBeCloseTo(Math.log10(5), 12);
    expect(fishingInBalance(50, 3, 100, 3)).toBeCloseTo(Math.log10(0.5), 12);
  });

  it('refuses a catch of zero and an efficiency outside (0, 1)', () => {
    expect(() => fishingInBalance(0, 3, 100, 3)).toThrow(WebError);
    expect(() => fishingInBalance(10, 3, 100, 3, 1)).toThrow(/transfer efficiency/);
  });
});

describe('ruleOfThumbPrimaryProductionRequired (Pauly & Christensen 1995, Nature 374:255-257)', () => {
  it('[check] 9 t wet weight at TL 3 requires 100 t C', () => {
    expect(ruleOfThumbPrimaryProductionRequired([{ tonnesWet: 9, trophicLevel: 3 }])).toBeCloseTo(100, 12);
  });

  it('adds catches and is 0 with none', () => {
    expect(
      ruleOfThumbPrimaryProductionRequired([
        { tonnesWet: 9, trophicLevel: 3 },
        { tonnesWet: 18, trophicLevel: 2 },
      ]),
    ).toBeCloseTo(120, 12);
    expect(ruleOfThumbPrimaryProductionRequired([])).toBe(0);
  });
});

describe('primary production required at the edge of double precision', () => {
  it('a catch that is the whole, vanishing output of a producer requires all of its production, finitely', () => {
    // found by fuzzing: 0.001 of production, all but 5e-324 of it respired; the intensity
    // 0.001 / 5e-324 overflows, but the requirement of the catch is the whole 0.001
    const network = createNetwork({
      name: 'edge',
      unit: 'u',
      compartments: [{ id: 'p', name: 'P', kind: 'producer' }],
      flows: [],
      imports: [{ to: 'p', value: 0.001 }],
      exports: [{ from: 'p', value: 5e-324, fleet: 'A' }],
      respiration: [{ from: 'p', value: 0.001 }],
    });
    const result = indicatorsOf(network);
    expect(result.primaryProductionIntensity).toEqual([null]);
    expect(result.primaryProductionRequired).toBe(0.001);
    expect(result.primaryProductionRequiredShare).toBe(1);
    expect(result.fleets['A'].primaryProductionRequired).toBe(0.001);
  });
});

describe('primary production required of a near-closed web', () => {
  // p feeds a; a and detritus d pass material back and forth; a's catch is the web's only export
  function nearClosed(catchAmount: number): Network {
    const web = balancedByRespiration('near-closed', { p: 'producer', a: 'consumer', d: 'detritus' }, [['p', 'a', 50], ['a', 'd', 40], ['d', 'a', 30]], { p: 100 });
    web.exports.push({ from: 'a', value: catchAmount, fleet: 'net' });
    web.respiration.find((r) => r.from === 'a')!.value -= catchAmount;
    return createNetwork(web);
  }

  it('attributes all primary production to the only export, however small (conservation, Σ ε e = Σ w)', () => {
    expect(indicatorsOf(nearClosed(1e-3)).primaryProductionRequired).toBeCloseTo(100, 7);
    expect(indicatorsOf(nearClosed(1)).primaryProductionRequired).toBeCloseTo(100, 9);
  });

  it('refuses, naming the export, when the export is too small for double precision to apportion (found by fuzzing)', () => {
    for (const tiny of [1e-15, 1e-12]) {
      const error = catchWebError(() => indicatorsOf(nearClosed(tiny)));
      expect(error.kind).toBe('infeasible');
      expect(error.problems).toEqual([expect.stringMatching(/^primary production required cannot be apportioned: .*"a" \(exports 1e-1\d of a throughflow of 80\)/)]);
    }
  });
});
