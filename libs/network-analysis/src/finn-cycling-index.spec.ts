import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson } from './network';
import { countSimpleCycles } from './cycles';
import { finnCycling } from './finn-cycling-index';
import { dependencies } from './total-dependency';
import { WebError } from './web-error';
import { balancedWeb } from './testing/arbitraries';

describe('Finn cycling index (Finn 1976, J. theor. Biol. 56:363-380; Finn 1980)', () => {
  it('Cone Spring: FCI = 0.0919, cycled throughflow 2,815.7 of 30,626 (Finn 1976)', () => {
    const network = networkFromJson(cone);
    const result = finnCycling(network);
    expect(network.throughflow.reduce((s, t) => s + t, 0)).toBe(30626);
    expect(result.finnCyclingIndex).toBeCloseTo(0.0919, 4);
    expect(result.totalCycledThroughflow).toBeCloseTo(2815.7, 1);
    expect(result.cycledThroughflow.reduce((s, c) => s + c, 0)).toBe(result.totalCycledThroughflow);
    expect(result.cycledToStraightRatio).toBeCloseTo(2815.7 / (30626 - 2815.7), 4);
    // plants lie on no cycle
    expect(result.cycledThroughflow[network.index.get('plants')!]).toBe(0);
  });

  it('matches the closed form of a two-compartment loop: cycled share of T_a is p q', () => {
    // a passes p of its throughflow to b, b returns q of its own to a: M_aa = 1 / (1 − p q)
    const [z, p, q] = [100, 0.6, 0.5];
    const Ta = z / (1 - p * q);
    const Tb = p * Ta;
    const web: Web = {
      name: 'loop',
      unit: 'u',
      compartments: [
        { id: 'a', name: 'A', kind: 'producer' },
        { id: 'b', name: 'B', kind: 'consumer' },
      ],
      flows: [
        { from: 'a', to: 'b', value: p * Ta },
        { from: 'b', to: 'a', value: q * Tb },
      ],
      imports: [{ to: 'a', value: z }],
      exports: [],
      respiration: [
        { from: 'a', value: (1 - p) * Ta },
        { from: 'b', value: (1 - q) * Tb },
      ],
    };
    const result = finnCycling(createNetwork(web));
    expect(result.cycledThroughflow[0]).toBeCloseTo(Ta * p * q, 9);
    expect(result.cycledThroughflow[1]).toBeCloseTo(Tb * p * q, 9);
    expect(result.finnCyclingIndex).toBeCloseTo((p * q * (Ta + Tb)) / (Ta + Tb), 12);
  });

  it('0 ≤ FCI < 1 on generated webs, positive exactly when the web has a cycle', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        const result = finnCycling(network);
        expect(result.finnCyclingIndex).toBeGreaterThanOrEqual(0);
        expect(result.finnCyclingIndex).toBeLessThan(1);
        result.cycledThroughflow.forEach((c, i) => {
          expect(c).toBeGreaterThanOrEqual(-1e-9 * network.throughflow[i]);
          expect(c).toBeLessThan(network.throughflow[i] + 1e-9);
        });
        const tst = network.throughflow.reduce((s, t) => s + t, 0);
        expect(result.cycledToStraightRatio).toBeCloseTo(result.totalCycledThroughflow / (tst - result.totalCycledThroughflow), 12);
        if (countSimpleCycles(network).count > 0) expect(result.finnCyclingIndex).toBeGreaterThan(1e-12);
      }),
      { numRuns: 80 },
    );
  });

  it('gives the same cycled throughflow from the diagonal of N (as the full analysis does) as from M', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        const fromM = finnCycling(network);
        const fromN = finnCycling(network, dependencies(network).passesThrough);
        fromN.cycledThroughflow.forEach((c, i) => expect(c).toBeCloseTo(fromM.cycledThroughflow[i], 9));
      }),
      { numRuns: 50 },
    );
  });

  it('FCI = 0 on acyclic webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20, cycles: false }), (web) => {
        const result = finnCycling(createNetwork(web));
        expect(result.finnCyclingIndex).toBeCloseTo(0, 12);
        expect(result.cycledToStraightRatio).toBeCloseTo(0, 12);
      }),
      { numRuns: 50 },
    );
  });

  it('refuses an unbalanced web', () => {
    const web = structuredClone(cone) as typeof cone;
    web.respiration[0].value += 10;
    expect(() => finnCycling(networkFromJson(web))).toThrow(WebError);
  });
});
