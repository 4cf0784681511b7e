import fc from 'fast-check';
import { inv, lusolve } from 'mathjs';
import { LuDecomposition, Matrix } from 'ml-matrix';
import cone from '../../../tests/fixtures/cone-spring.json';
import { identityMinus, identityMinusTransposed, inverseOfIdentityMinus, luSolve, solve } from './linear-algebra';
import { networkFromJson } from './network';
import { dietMatrix } from './total-dependency';

/**
 * Cross-checks the solver and the inverse against an independent implementation (mathjs `inv` and
 * `lusolve`), and the solver against ml-matrix's LU bit for bit (the engine solved with it before).
 */

const TOLERANCE = 1e-10;

/**
 * Square A whose rows have absolute sums ≤ 0.9, so I − A is strictly diagonally dominant and well
 * conditioned. Entries may be negative, as in the mixed-trophic-impact matrix Q.
 */
const contraction = fc
  .integer({ min: 1, max: 12 })
  .chain((n) =>
    fc.tuple(
      fc.array(fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }),
      fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: n, maxLength: n }),
    ),
  )
  .map(([raw, b]) => ({ A: raw.map((row) => scaleRow(row, 0.9)), b }));

function scaleRow(row: number[], bound: number): number[] {
  const sum = row.reduce((s, v) => s + Math.abs(v), 0);
  return sum > bound ? row.map((v) => (v * bound) / sum) : row;
}

function plainIdentityMinus(A: number[][]): number[][] {
  return A.map((row, i) => row.map((v, j) => (i === j ? 1 : 0) - v));
}

function maxGap(a: number[][], b: number[][]): number {
  return Math.max(0, ...a.flatMap((row, i) => row.map((v, j) => Math.abs(v - b[i][j]))));
}

describe('linear-algebra against mathjs', () => {
  it('inverseOfIdentityMinus agrees with mathjs inv on well-conditioned matrices', () => {
    fc.assert(
      fc.property(contraction, ({ A }) => {
        const expected = inv(plainIdentityMinus(A)) as number[][];
        expect(maxGap(inverseOfIdentityMinus(A), expected)).toBeLessThanOrEqual(TOLERANCE);
      }),
    );
  });

  it('inverseOfIdentityMinus agrees with mathjs inv where elimination must interchange rows', () => {
    // I − A = a permutation matrix scaled by 4 plus entries in [−1, 1]: invertible and well
    // conditioned, but the largest entry of a column is usually off the diagonal.
    const needsPivoting = fc.integer({ min: 2, max: 10 }).chain((n) =>
      fc.tuple(
        fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
        fc.array(fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }),
      ),
    );
    fc.assert(
      fc.property(needsPivoting, ([permutation, noise]) => {
        const B = noise.map((row, i) => row.map((v, j) => v / row.length + (permutation[i] === j ? 4 : 0)));
        const A = plainIdentityMinus(B);
        expect(maxGap(inverseOfIdentityMinus(A), inv(B) as number[][])).toBeLessThanOrEqual(TOLERANCE);
      }),
    );
  });

  it('solve agrees with mathjs lusolve on well-conditioned matrices', () => {
    fc.assert(
      fc.property(contraction, ({ A, b }) => {
        const expected = (lusolve(plainIdentityMinus(A), b) as number[][]).map((row) => row[0]);
        const x = solve(identityMinus(A), b);
        const gap = Math.max(...x.map((v, i) => Math.abs(v - expected[i])));
        expect(gap).toBeLessThanOrEqual(TOLERANCE * (1 + Math.max(...b.map(Math.abs))));
      }),
    );
  });

  it("Cone Spring's I − G: the inverse agrees with mathjs and solving (I − G) x = e + r gives the throughflows", () => {
    const network = networkFromJson(cone);
    const G = dietMatrix(network);
    expect(maxGap(inverseOfIdentityMinus(G), inv(plainIdentityMinus(G)) as number[][])).toBeLessThanOrEqual(TOLERANCE);
    // T_i = e_i + r_i + Σ_j G_ij T_j on the output side (METHODS.md §0, §7), so (I − G)⁻¹ (e + r) reproduces the table's throughflows
    const exits = network.e.map((e, i) => e + network.r[i]);
    const x = solve(identityMinus(G), exits);
    const expected = (lusolve(plainIdentityMinus(G), exits) as number[][]).map((row) => row[0]);
    x.forEach((v, i) => {
      expect(v).toBeCloseTo(network.throughflow[i], 8);
      expect(v).toBeCloseTo(expected[i], 8);
    });
  });

  it('luSolve gives ml-matrix LuDecomposition\'s answer to the last bit, pivoting or not', () => {
    const square = fc.integer({ min: 1, max: 12 }).chain((n) =>
      fc.tuple(
        fc.array(fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }),
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: n, maxLength: n }),
      ),
    );
    fc.assert(
      fc.property(square, ([A, b]) => {
        const lu = new LuDecomposition(new Matrix(plainIdentityMinus(A)));
        const expected = lu.isSingular() ? null : lu.solve(Matrix.columnVector(b)).getColumn(0);
        const x = luSolve(identityMinus(A), b);
        expect(x === null ? null : x.map((v) => (Object.is(v, -0) ? '-0' : v))).toEqual(expected === null ? null : expected.map((v) => (Object.is(v, -0) ? '-0' : v)));
      }),
      { numRuns: 300 },
    );
  });

  it('identityMinusTransposed is identityMinus of the transpose', () => {
    const A = [
      [0.1, 0.2, 0],
      [0.3, 0, 0.4],
      [0, 0.5, 0.6],
    ];
    expect(Array.from(identityMinusTransposed(A).data)).toEqual(Array.from(identityMinus(A.map((row, i) => row.map((_, j) => A[j][i]))).data));
  });

  it('refuses a singular I − A', () => {
    const A = [
      [1, 0],
      [0, 0.5],
    ];
    expect(() => inverseOfIdentityMinus(A)).toThrow(/singular/);
    expect(() => solve(identityMinus(A), [1, 1])).toThrow(/singular/);
  });

  it('inverts the empty matrix to the empty matrix', () => {
    expect(inverseOfIdentityMinus([])).toEqual([]);
  });
});
