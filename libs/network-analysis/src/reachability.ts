/**
 * Which compartments are joined by positive flows: the structural checks behind "no path to an
 * exit" (balance checks, balancing), "no link to food" (trophic levels) and "never exported"
 * (primary production intensities). T is the internal flow matrix, T[i][j] from i to j.
 */

/** Compartments reached from a seed by following positive flows forward (seed → … → j), seeds included. */
export function downstreamOf(T: readonly (readonly number[])[], seeds: readonly boolean[]): boolean[] {
  const n = T.length;
  const result = seeds.slice();
  const stack = seededStack(result);
  while (stack.length > 0) {
    const row = T[stack.pop()!];
    for (let j = 0; j < n; j++) {
      if (!result[j] && row[j] > 0) {
        result[j] = true;
        stack.push(j);
      }
    }
  }
  return result;
}

/** Compartments from which some seed is reached along positive flows (i → … → seed), seeds included. */
export function upstreamOf(T: readonly (readonly number[])[], seeds: readonly boolean[]): boolean[] {
  const n = T.length;
  const result = seeds.slice();
  const stack = seededStack(result);
  while (stack.length > 0) {
    const i = stack.pop()!;
    for (let j = 0; j < n; j++) {
      if (!result[j] && T[j][i] > 0) {
        result[j] = true;
        stack.push(j);
      }
    }
  }
  return result;
}

// two loops rather than one walk taking a step function: these run several times per Monte Carlo draw
function seededStack(seeds: readonly boolean[]): number[] {
  const stack: number[] = [];
  for (let i = 0; i < seeds.length; i++) if (seeds[i]) stack.push(i);
  return stack;
}
