import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson } from './network';
import { extendedMatrix, informationIndices, type InformationIndices } from './information-indices';
import { balancedWeb } from './testing/arbitraries';
import { mulberry32 } from './random';
import { scaledWeb } from './testing/scaled-web';

const sumParts = (i: InformationIndices) =>
  i.overheadParts.imports + i.overheadParts.exports + i.overheadParts.respiration + i.overheadParts.redundancy;

describe('extendedMatrix', () => {
  it('lays out imports in row 0, exports in column n+1 and respiration in column n+2', () => {
    const network = networkFromJson(cone);
    const X = extendedMatrix(network);
    const [plants, detritus] = [1, 2];
    expect(X).toHaveLength(8);
    expect(X.every((row) => row.length === 8)).toBe(true);
    expect(X[0][plants]).toBe(11184);
    expect(X[0][detritus]).toBe(635);
    expect(X[plants][detritus]).toBe(8881);
    expect(X[plants][6]).toBe(300);
    expect(X[plants][7]).toBe(2003);
    expect(X.map((row) => row[0])).toEqual(new Array(8).fill(0));
    expect(X[6]).toEqual(new Array(8).fill(0));
    expect(X[7]).toEqual(new Array(8).fill(0));
  });

  it('counts harvest in the export column', () => {
    const web = structuredClone(cone) as Web;
    web.exports[2] = { from: 'bacteria', value: 200 };
    web.exports.push({ from: 'bacteria', value: 55, fleet: 'trawl' });
    expect(extendedMatrix(createNetwork(web))[3][6]).toBe(255);
  });
});

describe('informationIndices', () => {
  const indices = informationIndices(networkFromJson(cone));

  it('Cone Spring: T.. = 42,445 and sum of throughflows 30,626 (Finn 1976, J. theor. Biol. 56:363-380)', () => {
    expect(indices.tst).toBeCloseTo(42445, 6);
    expect(networkFromJson(cone).throughflow.reduce((s, t) => s + t, 0)).toBeCloseTo(30626, 6);
  });

  // Regression targets computed from the published Cone Spring table (METHODS.md §10), not published results.
  it('Cone Spring: C, A, Φ, a, F, effective roles and connectance (computed from the table of Finn 1976)', () => {
    expect(indices.developmentCapacity).toBeCloseTo(135864.7, 1);
    expect(indices.ascendency).toBeCloseTo(56725.5, 1);
    expect(indices.overhead).toBeCloseTo(79139.2, 1);
    expect(indices.relativeAscendency).toBeCloseTo(0.41751, 5);
    expect(indices.robustness).toBeCloseTo(0.36467, 5);
    expect(indices.effectiveRoles).toBeCloseTo(2.525, 3);
    expect(indices.effectiveConnectance).toBeCloseTo(1.908, 3);
  });

  it('derives AMI, H and a from A, C and T..', () => {
    expect(indices.averageMutualInformation).toBeCloseTo(indices.ascendency / indices.tst, 12);
    expect(indices.flowDiversity).toBeCloseTo(indices.developmentCapacity / indices.tst, 12);
    expect(indices.relativeAscendency).toBeCloseTo(indices.ascendency / indices.developmentCapacity, 12);
  });

  it('Cone Spring: the four overhead parts sum to Φ and are each positive', () => {
    expect(sumParts(indices)).toBeCloseTo(indices.overhead, 6);
    expect(Object.values(indices.overheadParts).every((part) => part > 0)).toBe(true);
  });

  // Regression targets computed from the table of METHODS.md §10, not published values: each entry x of X
  // contributes −x log2(x² / (T_i. T_.j)) to the part of its row (imports) or column (exports, respiration,
  // else redundancy), summed directly in python3 over the 18 nonzero entries.
  it('Cone Spring: the overhead parts on imports, exports, respiration and redundancy (computed from the table)', () => {
    expect(indices.overheadParts.imports).toBeCloseTo(6221.750696, 4);
    expect(indices.overheadParts.exports).toBeCloseTo(7810.812423, 4);
    expect(indices.overheadParts.respiration).toBeCloseTo(35274.218943, 4);
    expect(indices.overheadParts.redundancy).toBeCloseTo(29832.464324, 4);
  });

  it('works on an unbalanced web', () => {
    const web = structuredClone(cone) as Web;
    web.imports[0].value = 20000;
    const unbalanced = informationIndices(createNetwork(web));
    expect(unbalanced.tst).toBeCloseTo(42445 + 20000 - 11184, 6);
    expect(unbalanced.relativeAscendency).toBeGreaterThan(0);
    expect(unbalanced.relativeAscendency).toBeLessThan(1);
  });

  it('gives zeros rather than NaN for a web with a single flux', () => {
    const web: Web = {
      name: 'one flux',
      unit: 'u',
      compartments: [{ id: 'a', name: 'A', kind: 'producer' }],
      flows: [],
      imports: [{ to: 'a', value: 5 }],
      exports: [],
      respiration: [],
    };
    const single = informationIndices(createNetwork(web));
    expect(single.developmentCapacity).toBe(0);
    expect(single.relativeAscendency).toBe(0);
    expect(single.robustness).toBe(0);
    expect(single.effectiveRoles).toBe(1);
    expect(single.effectiveConnectance).toBe(1);
  });

  it('A ≤ C, 0 ≤ a ≤ 1, Φ ≥ 0, F ≤ 1/e and the overhead parts sum to Φ on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25 }), (web) => {
        const i = informationIndices(createNetwork(web));
        const slack = 1e-9 * i.developmentCapacity;
        expect(i.ascendency).toBeLessThanOrEqual(i.developmentCapacity + slack);
        expect(i.relativeAscendency).toBeGreaterThanOrEqual(0);
        expect(i.relativeAscendency).toBeLessThanOrEqual(1);
        expect(i.overhead).toBeGreaterThanOrEqual(-slack);
        expect(i.robustness).toBeLessThanOrEqual(1 / Math.E + 1e-12);
        expect(Math.abs(sumParts(i) - i.overhead)).toBeLessThanOrEqual(slack);
      }),
    );
  });

  it('a, AMI, H, roles and connectance do not depend on the order of compartments', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 15 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (web, seed) => {
        const shuffled: Web = { ...web, compartments: shuffle(web.compartments, seed) };
        const before = informationIndices(createNetwork(web));
        const after = informationIndices(createNetwork(shuffled));
        expect(after.relativeAscendency).toBeCloseTo(before.relativeAscendency, 10);
        expect(after.averageMutualInformation).toBeCloseTo(before.averageMutualInformation, 10);
        expect(after.flowDiversity).toBeCloseTo(before.flowDiversity, 10);
        expect(after.effectiveRoles).toBeCloseTo(before.effectiveRoles, 10);
        expect(after.effectiveConnectance).toBeCloseTo(before.effectiveConnectance, 10);
      }),
    );
  });

  it('scaling every flow by k keeps a and multiplies C and A by k', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 15 }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (web, k) => {
        const before = informationIndices(createNetwork(web));
        const after = informationIndices(createNetwork(scaledWeb(web, k)));
        expect(after.relativeAscendency).toBeCloseTo(before.relativeAscendency, 10);
        expect(after.developmentCapacity / (k * before.developmentCapacity)).toBeCloseTo(1, 10);
        expect(after.ascendency / (k * before.ascendency)).toBeCloseTo(1, 10);
      }),
    );
  });
});

function shuffle<T>(items: readonly T[], seed: number): T[] {
  const result = items.slice();
  const random = mulberry32(seed);
  for (let i = result.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [result[i], result[j]] = [result[j], result[i]];
  }
  return result;
}

