import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import { createNetwork, isBalanced, WebError } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { Matrix, solve } from 'ml-matrix';
import { catchWebError } from '../../network-analysis/src/testing/catch-web-error';
import { generateWeb } from '../../network-analysis/src/testing/generated-web';
import { bottomUpResponse, catchFractions } from './bottom-up';
import { planOption } from './option-web';

const coneSpring = () => createNetwork(cone as Web);

describe('bottomUpResponse (donor control; Hannon 1973, Fath & Patten 1999)', () => {
  it('Cone Spring, new fishery on detritivores at 100 — regression targets computed from the published table (Tilly 1968 via Finn 1976)', () => {
    const baseline = coneSpring();
    const option = bottomUpResponse(planOption(baseline, [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]));
    const detritivores = baseline.index.get('detritivores')!;
    const carnivores = baseline.index.get('carnivores')!;
    expect(catchFractions(option)[detritivores]).toBeCloseTo(0.042014, 6);
    expect(baseline.throughflow[carnivores] - option.throughflow[carnivores]).toBeCloseTo(16.119, 3);
    expect(option.T[detritivores][carnivores]).toBeCloseTo(353.881, 3);
    expect(option.catches[0][detritivores]).toBe(100);
    expect(isBalanced(option, 1e-12)).toBe(true);
  });

  it('keeps imports and the proportions of each compartment’s non-harvest outputs', () => {
    const baseline = coneSpring();
    const option = bottomUpResponse(planOption(baseline, [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]));
    expect(option.z).toEqual(baseline.z);
    const d = baseline.index.get('detritivores')!;
    const c = baseline.index.get('carnivores')!;
    const detritus = baseline.index.get('detritus')!;
    expect(option.T[d][c] / option.r[d]).toBeCloseTo(baseline.T[d][c] / baseline.r[d], 12);
    expect(option.T[d][detritus] / option.T[d][c]).toBeCloseTo(baseline.T[d][detritus] / baseline.T[d][c], 12);
  });

  it('is the fixed point of the catch-fraction iteration: one more step x = (I − F′ᵀ)⁻¹ z returns the same web', () => {
    const baseline = coneSpring();
    const plan = planOption(baseline, [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]);
    const option = bottomUpResponse(plan);
    const c = catchFractions(option);
    const n = baseline.n;
    const Y = baseline.T.map((_, i) => option.catches.reduce((sum, row) => sum + row[i], 0));
    const nonHarvest = baseline.throughflow.map((t, i) => t - baseline.catches.reduce((sum, row) => sum + row[i], 0));
    // F'_ij = (T_ij / N_i) (1 − c_i): the baseline's non-harvest proportions sharing what the catch leaves
    const A = new Matrix(n, n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) A.set(j, i, (i === j ? 1 : 0) - (baseline.T[i][j] / nonHarvest[i]) * (1 - c[i]));
    const x = solve(A, Matrix.columnVector(baseline.z)).getColumn(0);
    x.forEach((xi, i) => {
      expect(xi).toBeCloseTo(option.throughflow[i], 9);
      expect(c[i] * xi).toBeCloseTo(Y[i], 9);
    });
  });

  it('refuses a catch the compartment cannot supply, naming the adjustment and the most it can land', () => {
    const baseline = coneSpring();
    const adjustments = [{ type: 'open-fishery' as const, fleet: 'net', compartment: 'carnivores', amount: 500 }];
    let error: unknown;
    try {
      bottomUpResponse(planOption(baseline, adjustments));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(WebError);
    expect((error as WebError).kind).toBe('infeasible');
    const message = (error as WebError).problems[0];
    expect(message).toMatch(/^adjustments\[0\] \(open-fishery fleet "net" on "carnivores" at 500\): "carnivores" cannot supply a catch of 500/);
    const most = Number(/the most it can land with the other catches held is ([0-9.e+-]+)/.exec(message)![1]);
    // below the 370 carnivores now take in: landing all of it ends their return to detritus, which feeds detritivores
    expect(most).toBeGreaterThan(300);
    expect(most).toBeLessThan(370);
    expect(() => bottomUpResponse(planOption(baseline, [{ ...adjustments[0], amount: most * (1 - 1e-12) }]))).not.toThrow();
    expect(() => bottomUpResponse(planOption(baseline, [{ ...adjustments[0], amount: most * (1 + 1e-6) }]))).toThrow(/cannot supply/);
  });

  it('an impossible catch increase is refused naming its adjustment first, not the compartments downstream it starves', () => {
    // carnivore listed first: its throughflow goes negative too, but it has no catch to blame
    const web: Web = {
      name: 'chain',
      unit: 'u',
      compartments: [
        { id: 'carnivore', name: 'Carnivore', kind: 'consumer' },
        { id: 'herbivore', name: 'Herbivore', kind: 'consumer' },
        { id: 'plant', name: 'Plant', kind: 'producer' },
      ],
      flows: [
        { from: 'plant', to: 'herbivore', value: 50 },
        { from: 'herbivore', to: 'carnivore', value: 10 },
      ],
      imports: [{ to: 'plant', value: 100 }],
      exports: [{ from: 'herbivore', value: 5, fleet: 'net' }],
      respiration: [
        { from: 'plant', value: 50 },
        { from: 'herbivore', value: 35 },
        { from: 'carnivore', value: 10 },
      ],
    };
    const error = catchWebError(() => bottomUpResponse(planOption(createNetwork(web), [{ type: 'scale-catch', fleet: 'net', compartment: 'herbivore', percent: 1000 }])));
    expect(error.kind).toBe('infeasible');
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toMatch(/^adjustments\[0\] \(scale-catch fleet "net" on "herbivore" by 1000 %\): "herbivore" cannot supply a catch of 55 /);
  });

  it('a closed catch that leaves a compartment nothing to do with its production names the closing adjustment', () => {
    const web: Web = {
      name: 'landed whole',
      unit: 'u',
      compartments: [
        { id: 'plant', name: 'Plant', kind: 'producer' },
        { id: 'fish', name: 'Fish', kind: 'consumer' },
      ],
      flows: [{ from: 'plant', to: 'fish', value: 10 }],
      imports: [{ to: 'plant', value: 30 }],
      exports: [{ from: 'fish', value: 10, fleet: 'net' }],
      respiration: [{ from: 'plant', value: 20 }],
    };
    const error = catchWebError(() => bottomUpResponse(planOption(createNetwork(web), [{ type: 'close-fleet', fleet: 'net' }])));
    expect(error.problems).toEqual([expect.stringMatching(/^adjustments\[0\] \(close-fleet "net"\): "fish" has no output but its catch/)]);
  });

  it('a production cut to almost nothing still gives a balanced web (fuzz counterexample)', () => {
    const web: Web = {
      name: 'one producer',
      unit: 'u',
      compartments: [{ id: 'p', name: 'P', kind: 'producer' }],
      flows: [],
      imports: [{ to: 'p', value: 0.001 }],
      exports: [],
      respiration: [{ from: 'p', value: 0.001 }],
    };
    const option = bottomUpResponse(planOption(createNetwork(web), [{ type: 'scale-production', compartment: 'p', percent: -99.99999999426967 }]));
    expect(option.z[0]).toBeGreaterThan(0);
    expect(isBalanced(option, 1e-12)).toBe(true);
  });

  it('a production change alone scales every flux of a single-producer web linearly', () => {
    fc.assert(
      fc.property(
        // up to 9 compartments generate one producer; a web with no fleet and no detritus import is fed by it alone
        fc.record({ compartments: fc.integer({ min: 3, max: 9 }), seed: fc.nat(), density: fc.double({ min: 0.1, max: 0.8, noNaN: true }) })
          .map((o) => generateWeb({ ...o, fleets: 0 }))
          .filter((web) => web.imports.length === 1),
        fc.double({ min: -90, max: 200, noNaN: true }),
        (web, percent) => {
          const baseline = createNetwork(web);
          expect(baseline.kinds[baseline.index.get(web.imports[0].to)!]).toBe('producer');
          const option = bottomUpResponse(planOption(baseline, [{ type: 'scale-production', compartment: web.imports[0].to, percent }]));
          const factor = 1 + percent / 100;
          option.fluxes.forEach((f, k) => {
            expect(Math.abs(f.value - factor * baseline.fluxes[k].value)).toBeLessThanOrEqual(1e-9 * Math.max(1, baseline.fluxes[k].value));
          });
        },
      ),
      { numRuns: 40 },
    );
  });
});
