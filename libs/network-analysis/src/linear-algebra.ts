import { LuDecomposition, Matrix, inverse } from 'ml-matrix';

/**
 * The few dense linear-algebra operations the methods need, on ml-matrix.
 * A solve uses one LU factorisation; an explicit inverse is taken only where a method needs the
 * whole matrix (N, M and the total-impact matrix are results in their own right).
 */

export function identityMinus(a: number[][]): Matrix {
  const n = a.length;
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) {
    const row = a[i];
    for (let j = 0; j < n; j++) m.set(i, j, (i === j ? 1 : 0) - row[j]);
  }
  return m;
}

/** x with A x = b; throws if A is singular (callers check structure first and name compartments). */
export function solve(a: Matrix, b: number[]): number[] {
  const lu = new LuDecomposition(a);
  if (lu.isSingular()) throw new Error('singular matrix');
  const x = lu.solve(Matrix.columnVector(b)).getColumn(0);
  if (!x.every(Number.isFinite)) throw new Error('singular matrix');
  return x;
}

/** (I − A)⁻¹ as plain arrays. */
export function inverseOfIdentityMinus(a: number[][]): number[][] {
  if (a.length === 0) return [];
  const result = inverse(identityMinus(a)).to2DArray();
  if (!result.every((row) => row.every(Number.isFinite))) throw new Error('singular matrix');
  return result;
}

export function transpose(a: number[][]): number[][] {
  const rows = a.length;
  const cols = rows === 0 ? 0 : a[0].length;
  const t: number[][] = Array.from({ length: cols }, () => new Array<number>(rows).fill(0));
  for (let i = 0; i < rows; i++) for (let j = 0; j < cols; j++) t[j][i] = a[i][j];
  return t;
}

export function zeros(rows: number, cols: number): number[][] {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0));
}
