import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { mixedTrophicImpact } from './mixed-trophic-impact';
import { createNetwork, networkFromJson } from './network';
import { balancedWeb } from './testing/arbitraries';
import { balancedByRespiration } from './testing/balanced-by-respiration';

// Ulanowicz & Puccia 1990, Coenoses 5:7-16; keystoneness: Libralato, Christensen & Pauly 2006, Ecol. Model. 195:153-171

/** plant (import 100) → herbivore 50 → carnivore 10, the rest respired. */
function chain(biomass?: [number, number, number]): Web {
  return {
    name: 'chain',
    unit: 'u',
    compartments: [
      { id: 'plant', name: 'Plant', kind: 'producer' as const },
      { id: 'herbivore', name: 'Herbivore', kind: 'consumer' as const },
      { id: 'carnivore', name: 'Carnivore', kind: 'consumer' as const },
    ].map((c, i) => (biomass === undefined ? c : { ...c, biomass: biomass[i] })),
    flows: [
      { from: 'plant', to: 'herbivore', value: 50 },
      { from: 'herbivore', to: 'carnivore', value: 10 },
    ],
    imports: [{ to: 'plant', value: 100 }],
    exports: [],
    respiration: [
      { from: 'plant', value: 50 },
      { from: 'herbivore', value: 40 },
      { from: 'carnivore', value: 10 },
    ],
  };
}

function expectMatrixClose(actual: number[][], expected: number[][], digits: number): void {
  expect(actual).toHaveLength(expected.length);
  actual.forEach((row, i) => row.forEach((value, j) => expect(value).toBeCloseTo(expected[i][j], digits)));
}

describe('mixed trophic impact (Ulanowicz & Puccia 1990)', () => {
  it('a three-compartment chain, worked by hand', () => {
    const impact = mixedTrophicImpact(createNetwork(chain()));
    expect(impact.ids).toEqual(['plant', 'herbivore', 'carnivore']);
    // q_PH = G_PH = 50/50; q_HP = −f_PH = −50/100; q_HC = 10/10; q_CH = −10/50
    expectMatrixClose(impact.direct, [[0, 1, 0], [-0.5, 0, 1], [0, -0.2, 0]], 12);
    // I − Q has determinant 1.7; (I − Q)⁻¹ = adj / 1.7, less I
    expectMatrixClose(
      impact.total,
      [
        [1.2 / 1.7 - 1, 1 / 1.7, 1 / 1.7],
        [-0.5 / 1.7, 1 / 1.7 - 1, 1 / 1.7],
        [0.1 / 1.7, -0.2 / 1.7, 1.5 / 1.7 - 1],
      ],
      12,
    );
    expect(impact.keystoneness).toBeNull();
  });

  it('keystoneness of the chain, worked by hand', () => {
    const { keystoneness } = mixedTrophicImpact(createNetwork(chain([10, 5, 1])));
    // ε_plant = sqrt(m_PH² + m_PC²) = sqrt(2)/1.7, p_plant = 10/16
    expect(keystoneness![0]).toBeCloseTo(Math.log10((Math.SQRT2 / 1.7) * (6 / 16)), 12);
    // ε_carnivore = sqrt(0.1² + 0.2²)/1.7, p = 1/16
    expect(keystoneness![2]).toBeCloseTo(Math.log10((Math.sqrt(0.05) / 1.7) * (15 / 16)), 12);
  });

  it('keystoneness of a web with detritus and a detritus loop, worked by hand from METHODS.md §6', () => {
    // plant (import 100) → herbivore 40, → detritus 30; herbivore → carnivore 10, → detritus 10;
    // carnivore → detritus 2; detritus → herbivore 10; throughflows 100, 50, 10, 42
    const web = balancedByRespiration(
      'loop',
      { plant: 'producer', herbivore: 'consumer', carnivore: 'consumer', detritus: 'detritus' },
      [['plant', 'herbivore', 40], ['plant', 'detritus', 30], ['herbivore', 'carnivore', 10], ['herbivore', 'detritus', 10], ['carnivore', 'detritus', 2], ['detritus', 'herbivore', 10]],
      { plant: 100 },
    );
    const biomass: Record<string, number> = { plant: 20, herbivore: 5, carnivore: 1, detritus: 100 };
    const { direct, total, keystoneness } = mixedTrophicImpact(
      createNetwork({ ...web, compartments: web.compartments.map((c) => ({ ...c, biomass: biomass[c.id] })) }),
    );
    // q_ij = T_ij / T_j − T_ji / T_j (no second term for the detritus row)
    expectMatrixClose(direct, [[0, 4 / 5, 0, 30 / 42], [-2 / 5, 0, 1, 0], [0, -1 / 5, 0, 2 / 42], [0, 1 / 5, 0, 0]], 12);
    // (I − Q)⁻¹ − I by Gauss–Jordan elimination in exact fractions (python3 fractions): every entry over 823
    expectMatrixClose(
      total,
      [[-198, 495, 495, 470], [-210, -298, 525, -125], [40, -100, -100, 63], [-42, 105, 105, -25]].map((row) => row.map((m) => m / 823)),
      12,
    );
    // ε_i over the living compartments only, and p_i the share of the living biomass 26 (detritus's 100 left out)
    expect(keystoneness![0]).toBeCloseTo(Math.log10((Math.hypot(495, 495) / 823) * (1 - 20 / 26)), 12); // −0.707102
    expect(keystoneness![1]).toBeCloseTo(Math.log10((Math.hypot(210, 525) / 823) * (1 - 5 / 26)), 12); // −0.255766
    expect(keystoneness![2]).toBeCloseTo(Math.log10((Math.hypot(40, 100) / 823) * (1 - 1 / 26)), 12); // −0.900204
    expect(keystoneness![3]).toBeNull();
  });

  it('gives no keystoneness to detritus or to a compartment without biomass', () => {
    const network = networkFromJson({
      ...cone,
      compartments: cone.compartments.map((c) => (c.id === 'bacteria' ? c : { ...c, biomass: 10 })),
    });
    const keystoneness = mixedTrophicImpact(network).keystoneness!;
    expect(keystoneness[network.index.get('detritus')!]).toBeNull();
    expect(keystoneness[network.index.get('bacteria')!]).toBeNull();
    expect(keystoneness[network.index.get('carnivores')!]).toEqual(expect.any(Number));
  });

  it('Cone Spring: carnivores harm detritivores, detritus helps bacteria (Tilly 1968 web as used by Finn 1976)', () => {
    const network = networkFromJson(cone);
    const { total, keystoneness } = mixedTrophicImpact(network);
    const at = (id: string) => network.index.get(id)!;
    expect(total[at('carnivores')][at('detritivores')]).toBeLessThan(0);
    expect(total[at('detritus')][at('bacteria')]).toBeGreaterThan(0);
    expect(keystoneness).toBeNull();
  });

  it('fleets are extra nodes: negative on their prey, fed by their catch shares, eaten by nothing', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        const { ids, direct } = mixedTrophicImpact(network);
        const n = network.n;
        expect(ids).toEqual([...network.ids, ...network.fleets]);
        network.catches.forEach((caught, f) => {
          const landed = caught.reduce((sum, y) => sum + y, 0);
          caught.forEach((y, i) => {
            expect(direct[n + f][i]).toBeCloseTo(-y / network.throughflow[i], 12);
            if (y > 0) expect(direct[n + f][i]).toBeLessThan(0);
            expect(direct[i][n + f]).toBeCloseTo(y / landed, 12);
          });
          network.fleets.forEach((_, g) => expect(direct[n + g][n + f]).toBe(0));
        });
      }),
    );
  });

  it('detritus rows carry no negative predation terms, and M = Q + Q M', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        const { direct, total } = mixedTrophicImpact(network);
        network.kinds.forEach((kind, i) => {
          if (kind === 'detritus') direct[i].forEach((q) => expect(q).toBeGreaterThanOrEqual(0));
        });
        // (I − Q)⁻¹ − I = Q (I − Q)⁻¹: total impact is the direct impact followed by every path
        total.forEach((row, i) =>
          row.forEach((m, j) => {
            const viaPaths = direct[i].reduce((sum, q, k) => sum + q * total[k][j], direct[i][j]);
            expect(m).toBeCloseTo(viaPaths, 8);
          }),
        );
      }),
    );
  });
});
