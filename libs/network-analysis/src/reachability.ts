/**
 * Which compartments are joined by positive flows: the structural checks behind "no path to an
 * exit" (balance checks, balancing), "no link to food" (trophic levels) and "never exported"
 * (primary production intensities). T is the internal flow matrix, T[i][j] from i to j.
 */

/** Compartments reached from a seed by following positive flows forward (seed → … → j), seeds included. */
export function downstreamOf(T: readonly (readonly number[])[], seeds: readonly boolean[]): boolean[] {
  return reached(T.length, seeds, (i, j) => T[i][j] > 0);
}

/** Compartments from which some seed is reached along positive flows (i → … → seed), seeds included. */
export function upstreamOf(T: readonly (readonly number[])[], seeds: readonly boolean[]): boolean[] {
  return reached(T.length, seeds, (i, j) => T[j][i] > 0);
}

function reached(n: number, seeds: readonly boolean[], step: (from: number, to: number) => boolean): boolean[] {
  const result = seeds.slice();
  const stack = result.flatMap((isSeed, i) => (isSeed ? [i] : []));
  while (stack.length > 0) {
    const i = stack.pop()!;
    for (let j = 0; j < n; j++) {
      if (!result[j] && step(i, j)) {
        result[j] = true;
        stack.push(j);
      }
    }
  }
  return result;
}
