import type { Network } from './network';
import { zeros } from './linear-algebra';

/**
 * Information indices of a flow network (METHODS.md §1): development capacity C, ascendency A,
 * overhead Φ and its four parts, average mutual information, flow diversity, relative ascendency a
 * and robustness F = −a ln a.
 * Sources: Ulanowicz 1986, *Growth and Development*; Ulanowicz 2004, Comput. Biol. Chem.
 * 28:321-339; effective roles and connectance from Zorach & Ulanowicz 2003, Complexity 8(3):68-76;
 * robustness from Ulanowicz, Goerner, Lietaer & Gomez 2009, Ecol. Complexity 6:27-36.
 * Works on unbalanced webs too: everything is read off the extended matrix X, not throughflows.
 */

export interface OverheadParts {
  imports: number;
  exports: number;
  respiration: number;
  redundancy: number;
}

export interface InformationIndices {
  /** T.. — sum of every entry of X (total system throughput). */
  tst: number;
  developmentCapacity: number;
  ascendency: number;
  overhead: number;
  overheadParts: OverheadParts;
  averageMutualInformation: number;
  flowDiversity: number;
  relativeAscendency: number;
  /** F = −a ln a */
  robustness: number;
  effectiveRoles: number;
  effectiveConnectance: number;
}

/**
 * X of size n+3: row 0 imports, rows and columns 1..n compartments, column n+1 exports (harvest
 * included), column n+2 respiration. Rows n+1, n+2 and column 0 stay zero.
 */
export function extendedMatrix(network: Network): number[][] {
  const { n, T, z, e, r } = network;
  const X = zeros(n + 3, n + 3);
  for (let j = 0; j < n; j++) X[0][j + 1] = z[j];
  for (let i = 0; i < n; i++) {
    const row = X[i + 1];
    const Ti = T[i];
    for (let j = 0; j < n; j++) row[j + 1] = Ti[j];
    row[n + 1] = e[i];
    row[n + 2] = r[i];
  }
  return X;
}

export function informationIndices(network: Network): InformationIndices {
  return indicesOf(extendedMatrix(network));
}

/** T_i. and T_.j of X, and T.. */
function marginals(X: number[][]): { rowSums: number[]; columnSums: number[]; tst: number } {
  const size = X.length;
  const rowSums = new Array<number>(size).fill(0);
  const columnSums = new Array<number>(size).fill(0);
  let tst = 0;
  for (let i = 0; i < size; i++) {
    const row = X[i];
    for (let j = 0; j < size; j++) {
      const x = row[j];
      if (x === 0) continue;
      rowSums[i] += x;
      columnSums[j] += x;
    }
    tst += rowSums[i];
  }
  return { rowSums, columnSums, tst };
}

function indicesOf(X: number[][]): InformationIndices {
  const size = X.length;
  const exportColumn = size - 2;
  const respirationColumn = size - 1;
  const { rowSums, columnSums, tst } = marginals(X);
  let developmentCapacity = 0;
  let ascendency = 0;
  const overheadParts: OverheadParts = { imports: 0, exports: 0, respiration: 0, redundancy: 0 };
  // Sums of logarithms rather than logarithms of products and quotients: a product of two tiny
  // marginals underflows to 0 (and a product of two huge ones overflows) long before any flow does.
  const logTst = Math.log2(tst);
  const logRow = rowSums.map((t) => (t > 0 ? Math.log2(t) : 0));
  const logColumn = columnSums.map((t) => (t > 0 ? Math.log2(t) : 0));
  for (let i = 0; i < size; i++) {
    const row = X[i];
    for (let j = 0; j < size; j++) {
      const x = row[j];
      if (x <= 0) continue;
      const logX = Math.log2(x);
      const capacityTerm = -x * (logX - logTst);
      const ascendencyTerm = x * (logX + logTst - logRow[i] - logColumn[j]);
      developmentCapacity += capacityTerm;
      ascendency += ascendencyTerm;
      // Row 0 holds only imports and columns n+1, n+2 only exits, so each entry has one home.
      const overheadTerm = capacityTerm - ascendencyTerm;
      if (i === 0) overheadParts.imports += overheadTerm;
      else if (j === exportColumn) overheadParts.exports += overheadTerm;
      else if (j === respirationColumn) overheadParts.respiration += overheadTerm;
      else overheadParts.redundancy += overheadTerm;
    }
  }
  const overhead = developmentCapacity - ascendency;
  // A web with at most one nonzero flux has no capacity; its ratios are taken as 0, not NaN.
  const relativeAscendency = developmentCapacity > 0 ? ascendency / developmentCapacity : 0;
  const averageMutualInformation = tst > 0 ? ascendency / tst : 0;
  const flowDiversity = tst > 0 ? developmentCapacity / tst : 0;
  return {
    tst,
    developmentCapacity,
    ascendency,
    overhead,
    overheadParts,
    averageMutualInformation,
    flowDiversity,
    relativeAscendency,
    // robustnessOf (robustness.ts) is the same −a ln a; kept inline so that module can build on this one
    robustness: relativeAscendency > 0 ? 0 - relativeAscendency * Math.log(relativeAscendency) : 0,
    effectiveRoles: 2 ** averageMutualInformation,
    effectiveConnectance: tst > 0 ? 2 ** (overhead / (2 * tst)) : 1,
  };
}
