import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson } from './network';
import { dependencies, dietMatrix, donorMatrix } from './total-dependency';
import { inverseOfIdentityMinus } from './linear-algebra';
import { balancedWeb } from './testing/arbitraries';
import { WebError } from './web-error';

const TOLERANCE = 1e-9;

describe('dietMatrix and donorMatrix', () => {
  const network = networkFromJson(cone);
  const at = (id: string) => network.index.get(id)!;

  it('Cone Spring: G divides by the recipient throughflow (imports included), F by the donor throughflow', () => {
    const G = dietMatrix(network);
    const F = donorMatrix(network);
    // detritus throughflow: 635 imported + 8881 + 1600 + 200 + 167 returned = 11,483
    expect(G[at('plants')][at('detritus')]).toBeCloseTo(8881 / 11483, 15);
    expect(G[at('detritus')][at('bacteria')]).toBe(1);
    expect(F[at('detritus')][at('bacteria')]).toBeCloseTo(5205 / 11483, 15);
    expect(F[at('plants')][at('detritus')]).toBeCloseTo(8881 / 11184, 15);
    expect(G[at('bacteria')][at('plants')]).toBe(0);
  });

  it('columns of G and rows of F sum to at most 1 on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const n = createNetwork(web);
        const G = dietMatrix(n);
        const F = donorMatrix(n);
        for (let j = 0; j < n.n; j++) {
          expect(G.reduce((s, row) => s + row[j], 0)).toBeLessThanOrEqual(1 + TOLERANCE);
          expect(F[j].reduce((s, f) => s + f, 0)).toBeLessThanOrEqual(1 + TOLERANCE);
        }
      }),
    );
  });

  it('leaves 0 for a compartment with no throughflow', () => {
    const web = structuredClone(cone) as Web;
    web.compartments.push({ id: 'idle', name: 'Idle', kind: 'consumer' });
    const n = createNetwork(web);
    const idle = n.index.get('idle')!;
    expect(dietMatrix(n).map((row) => row[idle])).toEqual(new Array(6).fill(0));
    expect(donorMatrix(n)[idle]).toEqual(new Array(6).fill(0));
    expect(dependencies(n).total[at('plants')][at('bacteria')]).toBeCloseTo(0.93327, 5);
  });
});

describe('dependencies', () => {
  const network = networkFromJson(cone);
  const at = (id: string) => network.index.get(id)!;
  const { allPathway, total, totalContribution } = dependencies(network);
  const consumers = ['bacteria', 'detritivores', 'carnivores'];

  // Regression targets computed from the published Cone Spring table (METHODS.md §10; Szyrmer &
  // Ulanowicz 1987, Ecol. Model. 35:123-136), not published results.
  it('Cone Spring: d(plants → any consumer) = 0.93327 (computed from the table)', () => {
    for (const c of consumers) expect(total[at('plants')][at(c)]).toBeCloseTo(0.93327, 5);
  });

  it('Cone Spring: d(detritus → any consumer) = 1 (computed from the table)', () => {
    for (const c of consumers) expect(total[at('detritus')][at(c)]).toBeCloseTo(1, 5);
  });

  it('Cone Spring: d(bacteria → detritivores) = 0.17173 (computed from the table)', () => {
    expect(total[at('bacteria')][at('detritivores')]).toBeCloseTo(0.17173, 5);
  });

  it('Cone Spring: N = I + all-pathway dependency inverts I − G', () => {
    const G = dietMatrix(network);
    for (let i = 0; i < 5; i++) {
      for (let j = 0; j < 5; j++) {
        // ((I − G) N)_ij = N_ij − Σ_k G_ik N_kj
        const N = (a: number, b: number) => allPathway[a][b] + (a === b ? 1 : 0);
        const product = N(i, j) - G[i].reduce((s, g, k) => s + g * N(k, j), 0);
        expect(product).toBeCloseTo(i === j ? 1 : 0, 12);
      }
    }
  });

  it('Cone Spring: plants are on no cycle, detritus cycles part of its input', () => {
    expect(total[at('plants')][at('plants')]).toBe(0);
    expect(total[at('detritus')][at('detritus')]).toBeGreaterThan(0);
    expect(totalContribution[at('detritus')][at('detritus')]).toBeCloseTo(total[at('detritus')][at('detritus')], 12);
  });

  it('0 ≤ d ≤ 1 and 0 ≤ c ≤ 1 on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25 }), (web) => {
        const deps = dependencies(createNetwork(web));
        for (const matrix of [deps.total, deps.totalContribution]) {
          const values = matrix.flat();
          expect(Math.min(...values)).toBeGreaterThanOrEqual(-TOLERANCE);
          expect(Math.max(...values)).toBeLessThanOrEqual(1 + TOLERANCE);
        }
      }),
    );
  });

  it('on an acyclic web d = N − I off the diagonal and the diagonal of d is 0', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 25, cycles: false }), (web) => {
        const deps = dependencies(createNetwork(web));
        const gaps = deps.total.flatMap((row, i) => row.map((d, j) => Math.abs(d - (i === j ? 0 : deps.allPathway[i][j]))));
        expect(Math.max(...gaps)).toBeLessThanOrEqual(TOLERANCE);
      }),
    );
  });

  it('total contribution equals M_ij / M_jj with M = (I − F)⁻¹ inverted directly', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 20 }), (web) => {
        const n = createNetwork(web);
        const M = inverseOfIdentityMinus(donorMatrix(n));
        const { totalContribution: c } = dependencies(n);
        const gaps = c.flatMap((row, i) => row.map((cij, j) => Math.abs(cij - (i === j ? 1 - 1 / M[j][j] : M[i][j] / M[j][j]))));
        expect(Math.max(...gaps)).toBeLessThanOrEqual(TOLERANCE);
      }),
    );
  });

  it('refuses an unbalanced web, naming the compartment', () => {
    const web = structuredClone(cone) as Web;
    web.imports[0].value = 11284;
    expect(() => dependencies(createNetwork(web))).toThrow(WebError);
    expect(() => dependencies(createNetwork(web))).toThrow(/"plants"/);
  });
});
