import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { isBalanced } from './balance-check';
import { BALANCING_METHODS, balanceNetwork } from './balancing';
import { leastChangeBalance } from './least-change';
import { createNetwork, networkFromJson, withFluxValues, type Network } from './network';
import { mulberry32 } from './random';
import { balancedWeb } from './testing/arbitraries';
import { catchWebError } from './testing/catch-web-error';

// Allesina & Bondavalli 2003, Ecol. Model. 165:221-229

/** A web unbalanced by multiplying some of its fluxes by factors between 0.5 and 2. */
function perturbed(network: Network, seed: number): Network {
  const random = mulberry32(seed);
  return withFluxValues(
    network,
    network.fluxes.map((f) => (random() < 0.4 ? f.value * 2 ** (2 * random() - 1) : f.value)),
  );
}

function values(network: Network): number[] {
  return network.fluxes.map((f) => f.value);
}

/** a: import 100, a → b 60, respiration 30 (takes in 100, gives out 90); b: respiration 50 (takes in 60). */
const twoCompartments: Web = {
  name: 'two compartments',
  unit: 'u',
  compartments: [
    { id: 'a', name: 'A', kind: 'producer' },
    { id: 'b', name: 'B', kind: 'consumer' },
  ],
  flows: [{ from: 'a', to: 'b', value: 60 }],
  imports: [{ to: 'a', value: 100 }],
  exports: [],
  respiration: [
    { from: 'a', value: 30 },
    { from: 'b', value: 50 },
  ],
};
// flux order: a → b, import into a, respiration of a, respiration of b

describe('balancing (Allesina & Bondavalli 2003)', () => {
  it('input-based: keeps the import and a’s output fractions 2/3 and 1/3 (worked by hand)', () => {
    const balanced = balanceNetwork(createNetwork(twoCompartments), { method: 'input' });
    const [ab, importA, respirationA, respirationB] = values(balanced);
    expect(importA).toBe(100);
    expect(ab).toBeCloseTo(200 / 3, 12);
    expect(respirationA).toBeCloseTo(100 / 3, 12);
    expect(respirationB).toBeCloseTo(200 / 3, 12);
  });

  it('output-based: keeps respiration and the input fractions, b takes 50 from a, a takes in 80 (worked by hand)', () => {
    const balanced = balanceNetwork(createNetwork(twoCompartments), { method: 'output' });
    expect(values(balanced)).toEqual([50, 80, 30, 50]);
  });

  it('average: the element-wise mean of the two, itself balanced (worked by hand)', () => {
    const balanced = balanceNetwork(createNetwork(twoCompartments), { method: 'average' });
    const expected = [(200 / 3 + 50) / 2, 90, (100 / 3 + 30) / 2, (200 / 3 + 50) / 2];
    values(balanced).forEach((v, k) => expect(v).toBeCloseTo(expected[k], 12));
    expect(isBalanced(balanced)).toBe(true);
  });

  it('least change delegates to leastChangeBalance with the same options', () => {
    const network = createNetwork(twoCompartments);
    const options = { defaultCv: 0.3, pinned: new Set([1]) };
    expect(values(balanceNetwork(network, { method: 'least-change', ...options }))).toEqual(values(leastChangeBalance(network, options)));
  });

  it('returns balanced Cone Spring (Finn 1976, J. theor. Biol. 56:363-380) unchanged by every method', () => {
    const network = networkFromJson(cone);
    for (const method of BALANCING_METHODS) expect(values(balanceNetwork(network, { method }))).toEqual(values(network));
  });

  it('returns any balanced web unchanged', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        for (const method of BALANCING_METHODS) expect(values(balanceNetwork(network, { method }))).toEqual(values(network));
      }),
    );
  });

  it('every method balances a perturbed web without negative fluxes or new links', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const network = perturbed(createNetwork(web), seed);
        for (const method of BALANCING_METHODS) {
          const balanced = balanceNetwork(network, { method });
          expect(isBalanced(balanced)).toBe(true);
          balanced.fluxes.forEach((f, k) => {
            expect(f.value).toBeGreaterThanOrEqual(0);
            if (network.fluxes[k].value === 0) expect(f.value).toBe(0);
          });
        }
      }),
    );
  });

  it('input keeps imports, output keeps exports and respiration, average is their mean', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const network = perturbed(createNetwork(web), seed);
        const input = values(balanceNetwork(network, { method: 'input' }));
        const output = values(balanceNetwork(network, { method: 'output' }));
        const average = values(balanceNetwork(network, { method: 'average' }));
        network.fluxes.forEach((f, k) => {
          if (f.kind === 'import') expect(input[k]).toBe(f.value);
          if (f.kind === 'export' || f.kind === 'respiration') expect(output[k]).toBe(f.value);
          expect(average[k]).toBeCloseTo((input[k] + output[k]) / 2, 9);
        });
      }),
    );
  });

  it('holds pins it keeps and refuses pins it would move, naming the flux', () => {
    const network = createNetwork(twoCompartments);
    expect(balanceNetwork(network, { method: 'input', pinned: new Set([1]) }).z[0]).toBe(100);
    const error = catchWebError(() => balanceNetwork(network, { method: 'input', pinned: new Set([0]) }));
    expect(error.kind).toBe('infeasible');
    expect(error.problems).toEqual([expect.stringMatching(/input-based method cannot hold the pinned flow "a" → "b" at 60/)]);
  });

  it('refuses a compartment without outputs, one without inputs and a closed loop, naming each', () => {
    const web: Web = {
      name: 'broken',
      unit: 'u',
      compartments: ['p', 'sink', 'source', 'l1', 'l2'].map((id) => ({ id, name: id, kind: 'consumer' as const })),
      flows: [
        { from: 'p', to: 'sink', value: 5 },
        { from: 'source', to: 'p', value: 5 },
        { from: 'p', to: 'l1', value: 5 },
        { from: 'l1', to: 'l2', value: 5 },
        { from: 'l2', to: 'l1', value: 4 },
      ],
      imports: [{ to: 'p', value: 100 }],
      exports: [],
      respiration: [{ from: 'p', value: 80 }, { from: 'source', value: 1 }],
    };
    for (const method of ['input', 'output', 'average'] as const) {
      const error = catchWebError(() => balanceNetwork(createNetwork(web), { method }));
      expect(error.kind).toBe('infeasible');
      expect(error.problems).toEqual([
        'compartment "sink" has no outputs (export, respiration or flow out) to carry its inputs',
        'compartment "source" has no inputs (import or flow in) to supply its outputs',
        'compartment "l1" has no path to an export or respiration',
        'compartment "l2" has no path to an export or respiration',
      ]);
    }
  });

  it('refuses a compartment that no import reaches', () => {
    const web: Web = {
      name: 'unfed loop',
      unit: 'u',
      compartments: ['p', 'l1', 'l2'].map((id) => ({ id, name: id, kind: 'consumer' as const })),
      flows: [
        { from: 'l1', to: 'l2', value: 5 },
        { from: 'l2', to: 'l1', value: 4 },
      ],
      imports: [{ to: 'p', value: 10 }],
      exports: [],
      respiration: [{ from: 'p', value: 9 }, { from: 'l2', value: 1 }],
    };
    expect(catchWebError(() => balanceNetwork(createNetwork(web), { method: 'output' })).problems).toEqual([
      'compartment "l1" is not reached from any import',
      'compartment "l2" is not reached from any import',
    ]);
  });
});
