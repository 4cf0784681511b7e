import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import { createNetwork, scalarIndicators, SCALAR_INDICATORS } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { generateWeb } from '../../network-analysis/src/testing/generated-web';
import { applyOption } from './apply-option';
import { harvestSensitivity } from './harvest-sensitivity';

/** Cone Spring with priced catches of bacteria and detritivores, over 2 km² at 9 t per unit. */
function fishedCone(): Web {
  const web = structuredClone(cone) as Web;
  web.areaKm2 = 2;
  web.tonnesPerUnit = 9;
  web.exports = web.exports.map((e) => (e.from === 'bacteria' ? { ...e, fleet: 'sieve', price: 10 } : e));
  web.respiration = web.respiration.map((r) => (r.from === 'detritivores' ? { ...r, value: 1714 } : r));
  web.exports.push({ from: 'detritivores', value: 100, fleet: 'trap', price: 1000 });
  return web;
}

describe('harvestSensitivity (balanced finite difference per +1 % of each catch)', () => {
  it('is option − baseline of a +1 % scale-catch option, for every catch', () => {
    const network = createNetwork(fishedCone());
    const table = harvestSensitivity(network);
    expect(table.rows.map((r) => `${r.fleet}/${r.compartment}`)).toEqual(['sieve/bacteria', 'trap/detritivores']);
    const before = scalarIndicators(network);
    const after = scalarIndicators(applyOption(network, { adjustments: [{ type: 'scale-catch', fleet: 'trap', compartment: 'detritivores', percent: 1 }] }));
    const trap = table.rows[1];
    for (const key of SCALAR_INDICATORS) {
      if (before[key] !== null) expect(trap.perPercent![key]).toBe(after[key]! - before[key]!);
    }
    expect(trap.perPercent!.totalCatch).toBeCloseTo(1, 12);
    // value = catch × area × tonnes per unit × price (METHODS.md §9): +1 × 2 × 9 × 1000
    expect(trap.catchValueChange).toBeCloseTo(18000, 6);
    expect(table.rows[0].catchValueChange).toBeCloseTo(2.55 * 2 * 9 * 10, 6);
  });

  it('sorts toward the fitness peak and by catch value', () => {
    const table = harvestSensitivity(createNetwork(fishedCone()), 'least-change');
    const distances = table.byRobustness.map((r) => r.distanceFromPeakChange!);
    expect(distances).toEqual([...distances].sort((a, b) => a - b));
    expect(table.byCatchValue[0].fleet).toBe('trap');
    expect(table.response).toBe('least-change');
  });

  it('the distance from the peak changes as |a − 1/e| does', () => {
    fc.assert(
      fc.property(fc.nat(), (seed) => {
        const network = createNetwork(generateWeb({ compartments: 10, seed, fleets: 2 }));
        const base = scalarIndicators(network).relativeAscendency;
        for (const row of harvestSensitivity(network).rows) {
          if (row.refused) continue;
          const after = base + row.perPercent!.relativeAscendency!;
          expect(row.distanceFromPeakChange!).toBeCloseTo(Math.abs(after - 1 / Math.E) - Math.abs(base - 1 / Math.E), 12);
        }
      }),
      { numRuns: 15 },
    );
  });

  it('reports a catch that cannot grow by 1 % instead of failing the table', () => {
    // the consumer's whole output is landed: under donor control nothing is left to give up for more
    const web: Web = {
      name: 'all landed',
      unit: 'u',
      compartments: [{ id: 'p', name: 'P', kind: 'producer' }, { id: 'c', name: 'C', kind: 'consumer' }],
      flows: [{ from: 'p', to: 'c', value: 10 }],
      imports: [{ to: 'p', value: 12 }],
      exports: [{ from: 'c', value: 10, fleet: 'trap' }],
      respiration: [{ from: 'p', value: 2 }],
    };
    const network = createNetwork(web);
    const row = harvestSensitivity(network).rows.find((r) => r.fleet === 'trap')!;
    expect(row.refused).toMatch(/cannot supply/);
    expect(row.perPercent).toBeNull();
  });
});
