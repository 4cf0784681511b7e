import { LuDecomposition, Matrix } from 'ml-matrix';
import { WebError } from './web-error';

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

/**
 * Callers check a web's structure first and name the compartments at fault; what still reaches
 * this is numerical: flows so small or so far apart that double precision cannot resolve the
 * system. It is refused as bad input, saying which system failed.
 */
function singular(system: string): WebError {
  return new WebError('infeasible', [
    `the linear system for ${system} is singular in double precision: some flows are too small or too far apart in size to resolve`,
  ]);
}

/** x with A x = b; `system` names what is being solved for, in the refusal. */
export function solve(a: Matrix, b: number[], system = 'this analysis'): number[] {
  const lu = new LuDecomposition(a);
  if (lu.isSingular()) throw singular(system);
  const x = lu.solve(Matrix.columnVector(b)).getColumn(0);
  if (!x.every(Number.isFinite)) throw singular(system);
  return x;
}

/**
 * (I − A)⁻¹ as plain arrays, by in-place Gauss–Jordan elimination with partial pivoting on one
 * flat Float64Array (Press et al., Numerical Recipes, §2.1). N, M and the total-impact matrix are
 * results in their own right, so the whole inverse is needed; this costs n³ multiply-adds and is
 * several times faster than ml-matrix's `inverse` at the web sizes councils use (see
 * `npm run bench`). linear-algebra.spec.ts cross-checks it against mathjs.
 */
export function inverseOfIdentityMinus(a: number[][], system = 'this analysis'): number[][] {
  const n = a.length;
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = a[i];
    for (let j = 0; j < n; j++) m[i * n + j] = (i === j ? 1 : 0) - row[j];
  }
  const swappedWith = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let pivotRow = k;
    let largest = Math.abs(m[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const size = Math.abs(m[i * n + k]);
      if (size > largest) (largest = size), (pivotRow = i);
    }
    if (!(largest > 0) || !Number.isFinite(largest)) throw singular(system);
    swappedWith[k] = pivotRow;
    if (pivotRow !== k) swapRows(m, n, k, pivotRow);
    const pivotStart = k * n;
    const reciprocal = 1 / m[pivotStart + k];
    m[pivotStart + k] = 1;
    for (let j = 0; j < n; j++) m[pivotStart + j] *= reciprocal;
    for (let i = 0; i < n; i++) {
      if (i === k) continue;
      const start = i * n;
      const factor = m[start + k];
      // Food webs are sparse: most eliminations have nothing to do.
      if (factor === 0) continue;
      m[start + k] = 0;
      for (let j = 0; j < n; j++) m[start + j] -= factor * m[pivotStart + j];
    }
  }
  // Row interchanges on the way in are column interchanges of the inverse, undone in reverse.
  for (let k = n - 1; k >= 0; k--) {
    const other = swappedWith[k];
    if (other === k) continue;
    for (let i = 0; i < n; i++) {
      const start = i * n;
      const kept = m[start + k];
      m[start + k] = m[start + other];
      m[start + other] = kept;
    }
  }
  const result: number[][] = new Array(n);
  for (let i = 0; i < n; i++) {
    const row = Array.from(m.subarray(i * n, (i + 1) * n));
    for (const value of row) if (!Number.isFinite(value)) throw singular(system);
    result[i] = row;
  }
  return result;
}

function swapRows(m: Float64Array, n: number, a: number, b: number): void {
  for (let j = 0; j < n; j++) {
    const kept = m[a * n + j];
    m[a * n + j] = m[b * n + j];
    m[b * n + j] = kept;
  }
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
