import fc from 'fast-check';
import { lusolve, multiply, transpose } from 'mathjs';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { isBalanced } from './balance-check';
import { balanceNetwork } from './balancing';
import { DEFAULT_CV, leastChangeBalance } from './least-change';
import { OUTSIDE, createNetwork, networkFromJson, withFluxValues, type Network } from './network';
import { mulberry32 } from './random';
import { generateWeb } from './testing/generated-web';
import { balancedWeb } from './testing/arbitraries';
import { catchWebError } from './testing/catch-web-error';

/** A web unbalanced by multiplying some of its fluxes by factors between 0.5 and 2. */
function perturbed(network: Network, seed: number, chance = 0.4): Network {
  const random = mulberry32(seed);
  return withFluxValues(
    network,
    network.fluxes.map((f) => (random() < chance ? f.value * 2 ** (2 * random() - 1) : f.value)),
  );
}

/** Σ (x_k − x0_k)² / (cv_k x0_k)² over the fluxes that may move. */
function weightedChange(before: Network, after: Network): number {
  return before.fluxes.reduce((sum, f, k) => {
    if (f.value === 0) return sum;
    const sd = (f.cv ?? DEFAULT_CV) * f.value;
    return sum + ((after.fluxes[k].value - f.value) / sd) ** 2;
  }, 0);
}

function values(network: Network): number[] {
  return network.fluxes.map((f) => f.value);
}

function fluxIndices(network: Network, test: (f: Network['fluxes'][number]) => boolean): Set<number> {
  return new Set(network.fluxes.flatMap((f, k) => (test(f) ? [k] : [])));
}

function oneCompartment(importValue: number, exports: { value: number; cv?: number }[], respiration: { value: number; cv?: number }): Network {
  const web: Web = {
    name: 'one compartment',
    unit: 'u',
    compartments: [{ id: 'x', name: 'X', kind: 'producer' }],
    flows: [],
    imports: [{ to: 'x', value: importValue }],
    exports: exports.map((e) => ({ from: 'x', ...e })),
    respiration: [{ from: 'x', ...respiration }],
  };
  return createNetwork(web);
}

describe('least-change balancing (weighted least squares, Vézina & Platt 1988, Mar. Ecol. Prog. Ser. 42:269-287)', () => {
  it('splits an imbalance in proportion to the variances (worked by hand)', () => {
    // import 100, respiration 80, cv 0.25: v = 625 and 400; z = r = (400·100 + 625·80) / 1025
    const network = oneCompartment(100, [], { value: 80 });
    const balanced = leastChangeBalance(network);
    expect(balanced.z[0]).toBeCloseTo(90000 / 1025, 10);
    expect(balanced.r[0]).toBeCloseTo(90000 / 1025, 10);
    expect(weightedChange(network, balanced)).toBeCloseTo((100 - 90000 / 1025) ** 2 / 625 + (80 - 90000 / 1025) ** 2 / 400, 10);
  });

  it('holds pinned fluxes and cv = 0 fluxes exactly', () => {
    const network = oneCompartment(100, [], { value: 80 });
    const pinned = leastChangeBalance(network, { pinned: new Set([0]) });
    expect(pinned.z[0]).toBe(100);
    expect(pinned.r[0]).toBeCloseTo(100, 10);
    const exact = leastChangeBalance(oneCompartment(100, [], { value: 80, cv: 0 }));
    expect(exact.r[0]).toBe(80);
    expect(exact.z[0]).toBeCloseTo(80, 10);
  });

  it('fixes at zero a flux that would go negative (worked by hand)', () => {
    // import 100 pinned; respiration 150 (cv 0.25, v = 1406.25) and export 5 (cv 10, v = 2500).
    // Unbounded, the export would absorb 55·2500/3906.25 = 35.2 and go negative; fixed at 0, respiration
    // takes the whole cut. Its bound multiplier stays ≥ 0: the would-be export 5 − 2500·50/1406.25 < 0.
    const network = oneCompartment(100, [{ value: 5, cv: 10 }], { value: 150 });
    const balanced = leastChangeBalance(network, { pinned: new Set([0]) });
    expect(balanced.e[0]).toBe(0);
    expect(balanced.r[0]).toBeCloseTo(100, 10);
  });

  it('refuses pins that no non-negative balance can meet, naming the compartments', () => {
    const alone = oneCompartment(100, [], { value: 150 });
    const error = catchWebError(() => leastChangeBalance(alone, { pinned: new Set([0, 1]) }));
    expect(error.kind).toBe('infeasible');
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toMatch(/"x".*give out 50 more than they take in/);

    // j's import pins 100 into the j → k flow, k's respiration pins 10 out of it
    const chain = createNetwork({
      name: 'chain',
      unit: 'u',
      compartments: [
        { id: 'j', name: 'J', kind: 'producer' },
        { id: 'k', name: 'K', kind: 'consumer' },
      ],
      flows: [{ from: 'j', to: 'k', value: 50 }],
      imports: [{ to: 'j', value: 100 }],
      exports: [],
      respiration: [{ from: 'k', value: 10 }],
    });
    const chainError = catchWebError(() => leastChangeBalance(chain, { pinned: new Set([1, 2]) }));
    expect(chainError.kind).toBe('infeasible');
    expect(chainError.problems[0]).toMatch(/"j", "k".*take in 90 more/);
  });

  it('copes with a compartment whose every flux is held while others move', () => {
    const network = networkFromJson(cone);
    const carnivores = network.index.get('carnivores')!;
    const touching = fluxIndices(network, (f) => f.from === carnivores || f.to === carnivores);
    const plants = network.index.get('plants')!;
    const unbalanced = withFluxValues(
      network,
      network.fluxes.map((f) => (f.kind === 'import' && f.to === plants ? 1.1 * f.value : f.value)),
    );
    const balanced = leastChangeBalance(unbalanced, { pinned: touching });
    expect(isBalanced(balanced)).toBe(true);
    for (const k of touching) expect(balanced.fluxes[k].value).toBe(network.fluxes[k].value);
  });

  it('returns a balanced web unchanged', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const network = createNetwork(web);
        expect(values(leastChangeBalance(network))).toEqual(values(network));
      }),
    );
  });

  it('balances perturbed webs, keeps zeros at zero, holds pins exactly and moves nothing negative', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const network = perturbed(createNetwork(web), seed);
        const pinned = fluxIndices(network, (f) => f.kind === 'import' || f.fleet !== undefined);
        const balanced = leastChangeBalance(network, { pinned });
        expect(isBalanced(balanced)).toBe(true);
        balanced.fluxes.forEach((f, k) => {
          expect(f.value).toBeGreaterThanOrEqual(0);
          if (network.fluxes[k].value === 0 || pinned.has(k)) expect(f.value).toBe(network.fluxes[k].value);
        });
      }),
    );
  });

  it('moves no more than needed: a web unbalanced in one flux comes back closer than the original balance', () => {
    fc.assert(
      fc.property(
        balancedWeb({ max: 20 }),
        fc.nat(),
        fc.double({ min: 0.5, max: 2, noNaN: true }).filter((factor) => Math.abs(factor - 1) > 1e-3),
        (web, pick, factor) => {
          const original = createNetwork(web);
          const k = pick % original.fluxes.length;
          const unbalanced = withFluxValues(original, values(original).map((v, m) => (m === k ? v * factor : v)));
          const balanced = leastChangeBalance(unbalanced);
          // the original balanced web is one admissible answer; its weighted change is ((f − 1) / (cv f))²
          const bound = ((factor - 1) / (DEFAULT_CV * factor)) ** 2;
          expect(weightedChange(unbalanced, balanced)).toBeLessThanOrEqual(bound * (1 + 1e-9));
        },
      ),
    );
  });

  it('has a lower weighted change than the input, output and average methods under the same pins', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const network = perturbed(createNetwork(web), seed);
        const cases = [
          { method: 'input' as const, pinned: fluxIndices(network, (f) => f.kind === 'import') },
          { method: 'output' as const, pinned: fluxIndices(network, (f) => f.kind === 'export' || f.kind === 'respiration') },
          { method: 'average' as const, pinned: new Set<number>() },
        ];
        for (const { method, pinned } of cases) {
          const other = weightedChange(network, balanceNetwork(network, { method, pinned }));
          const least = weightedChange(network, leastChangeBalance(network, { pinned }));
          expect(least).toBeLessThanOrEqual(other * (1 + 1e-9) + 1e-12);
        }
      }),
    );
  });

  it('where no flux reaches its zero bound, equals the closed-form weighted least-squares solution computed with mathjs', () => {
    // x = x0 − V Aᵀ (A V Aᵀ)⁻¹ A x0 with V = diag((cv x0)²): the textbook solution of the equality-
    // constrained problem (Vézina & Platt 1988), computed independently of the engine's dual iteration.
    let compared = 0;
    fc.assert(
      fc.property(balancedWeb({ max: 12 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const network = perturbed(createNetwork(web), seed, 0.3);
        const free = network.fluxes.flatMap((f, k) => (f.value > 0 ? [k] : []));
        const A = Array.from({ length: network.n }, () => free.map(() => 0));
        free.forEach((k, m) => {
          const f = network.fluxes[k];
          if (f.to !== OUTSIDE) A[f.to][m] += 1;
          if (f.from !== OUTSIDE) A[f.from][m] -= 1;
        });
        const x0 = free.map((k) => network.fluxes[k].value);
        const V = x0.map((x) => (DEFAULT_CV * x) ** 2);
        const AV = A.map((row) => row.map((a, m) => a * V[m]));
        const lambda = lusolve(multiply(AV, transpose(A)), multiply(A, x0)) as unknown as number[][];
        const correction = multiply(transpose(AV), lambda.map((row) => row[0])) as number[];
        const expected = x0.map((x, m) => x - correction[m]);
        if (expected.some((x) => x <= 0)) return; // a bound is active: the closed form does not apply
        compared++;
        const balanced = leastChangeBalance(network);
        free.forEach((k, m) => expect(Math.abs(balanced.fluxes[k].value - expected[m])).toBeLessThanOrEqual(1e-7 * Math.max(1, expected[m])));
      }),
      { numRuns: 60 },
    );
    expect(compared).toBeGreaterThan(20);
  });

  it('balances perturbed 50-compartment webs (speed is measured in npm run bench)', () => {
    const webs = Array.from({ length: 20 }, (_, seed) => perturbed(createNetwork(generateWeb({ compartments: 50, seed })), seed));
    for (const network of webs) expect(isBalanced(leastChangeBalance(network))).toBe(true);
  });
});
