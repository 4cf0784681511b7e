import { WebError } from './web-error';

/**
 * The few dense linear-algebra operations the methods need, on flat Float64Arrays.
 * A solve uses one LU factorisation; an explicit inverse is taken only where a method needs the
 * whole matrix (N, M and the total-impact matrix are results in their own right).
 */

/** A square matrix, row-major in one flat array: entry (i, j) at `data[i * size + j]`. */
export interface SquareMatrix {
  readonly size: number;
  readonly data: Float64Array;
}

/** I − A. */
export function identityMinus(a: readonly (readonly number[])[]): SquareMatrix {
  const n = a.length;
  const data = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = a[i];
    for (let j = 0; j < n; j++) data[i * n + j] = (i === j ? 1 : 0) - row[j];
  }
  return { size: n, data };
}

/** I − Aᵀ, without building Aᵀ. */
export function identityMinusTransposed(a: readonly (readonly number[])[]): SquareMatrix {
  const n = a.length;
  const data = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = a[i];
    for (let j = 0; j < n; j++) data[j * n + i] = (i === j ? 1 : 0) - row[j];
  }
  return { size: n, data };
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
export function solve(a: SquareMatrix, b: readonly number[], system = 'this analysis'): number[] {
  const x = luSolve(a, b);
  if (x === null || !x.every(Number.isFinite)) throw singular(system);
  return x;
}

/**
 * x with A x = b by LU factorisation with partial pivoting, or null when a pivot is exactly zero.
 * The operations are those of the left-looking (Crout) factorisation of JAMA, in the same order,
 * as ml-matrix's LuDecomposition performs them — the engine solved with ml-matrix until the
 * Monte Carlo draws needed a solver without its per-entry accessors and allocations — so every
 * result is the same to the last bit (linear-algebra.spec.ts checks this against ml-matrix).
 */
export function luSolve(a: SquareMatrix, b: readonly number[]): number[] | null {
  const n = a.size;
  const lu = a.data.slice();
  const pivot = new Int32Array(n);
  for (let i = 0; i < n; i++) pivot[i] = i;
  const column = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) column[i] = lu[i * n + j];
    for (let i = 0; i < n; i++) {
      const kmax = Math.min(i, j);
      let s = 0;
      for (let k = 0; k < kmax; k++) s += lu[i * n + k] * column[k];
      column[i] -= s;
      lu[i * n + j] = column[i];
    }
    let p = j;
    for (let i = j + 1; i < n; i++) if (Math.abs(column[i]) > Math.abs(column[p])) p = i;
    if (p !== j) {
      swapRows(lu, n, p, j);
      const kept = pivot[p];
      pivot[p] = pivot[j];
      pivot[j] = kept;
    }
    const diagonal = lu[j * n + j];
    if (diagonal !== 0) for (let i = j + 1; i < n; i++) lu[i * n + j] = lu[i * n + j] / diagonal;
  }
  for (let j = 0; j < n; j++) if (lu[j * n + j] === 0) return null;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = b[pivot[i]];
  for (let k = 0; k < n; k++) for (let i = k + 1; i < n; i++) x[i] = x[i] - x[k] * lu[i * n + k];
  for (let k = n - 1; k >= 0; k--) {
    x[k] = x[k] / lu[k * n + k];
    for (let i = 0; i < k; i++) x[i] = x[i] - x[k] * lu[i * n + k];
  }
  return Array.from(x);
}

/**
 * (I − A)⁻¹ as plain arrays, by in-place Gauss–Jordan elimination with partial pivoting on one
 * flat Float64Array (Press et al., Numerical Recipes, §2.1). N, M and the total-impact matrix are
 * results in their own right, so the whole inverse is needed; this costs n³ multiply-adds and is
 * several times faster than ml-matrix's `inverse` at the web sizes councils use (see
 * `npm run bench`). linear-algebra.spec.ts cross-checks it against mathjs.
 */
export function inverseOfIdentityMinus(a: readonly (readonly number[])[], system = 'this analysis'): number[][] {
  const n = a.length;
  const m = flatInverseOfIdentityMinus(a, system);
  const result: number[][] = new Array(n);
  for (let i = 0; i < n; i++) result[i] = Array.from(m.subarray(i * n, (i + 1) * n));
  return result;
}

/** The diagonal of (I − A)⁻¹ alone, the same numbers as `inverseOfIdentityMinus` gives (the Finn cycling index needs no more). */
export function diagonalOfInverseOfIdentityMinus(a: readonly (readonly number[])[], system = 'this analysis'): number[] {
  const n = a.length;
  const m = flatInverseOfIdentityMinus(a, system);
  const diagonal = new Array<number>(n);
  for (let i = 0; i < n; i++) diagonal[i] = m[i * n + i];
  return diagonal;
}

function flatInverseOfIdentityMinus(a: readonly (readonly number[])[], system: string): Float64Array {
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
  for (let i = 0; i < m.length; i++) if (!Number.isFinite(m[i])) throw singular(system);
  return m;
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
