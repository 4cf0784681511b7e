/**
 * What one API request may ask of the server. The engine itself has no limits (the CLI analyses
 * any web it can hold); the server refuses larger webs up front, naming the limit, so that one
 * request cannot hold the machine for minutes or answer hundreds of megabytes. 400 compartments
 * is the scale the product states; the other limits leave room around it.
 */
export const API_LIMITS = {
  /** Compartments of one web. */
  compartments: 400,
  /** Internal flows of one web (a 400-compartment web with one link in eight). */
  flows: 20_000,
  /** Imports, exports and respiration entries of one web, each. */
  entries: 4_000,
  /** Adjustments of one harvest option. */
  adjustments: 1_000,
  /** Uncertainty draws of one option run; larger studies belong to a background job. */
  draws: 5_000,
} as const;

/** How long the engine may work on one request before it is stopped and the request answered 503. */
export const API_TIME_BUDGET_MS = 60_000;

/** Problems listed in one refusal (422 body or CLI line); the rest are counted. */
export const PROBLEMS_LISTED = 20;

/**
 * The first PROBLEMS_LISTED problems, then "…and N more problems" when there are more. Capping a
 * capped list changes nothing, so a list capped where it was found (in a worker) keeps its count.
 */
export function capProblems<T>(problems: readonly T[], listed = PROBLEMS_LISTED): (T | string)[] {
  const last = problems.at(-1);
  if (problems.length <= listed || (problems.length === listed + 1 && typeof last === 'string' && MORE.test(last))) return [...problems];
  const more = problems.length - listed;
  return [...problems.slice(0, listed), `…and ${more} more problem${more === 1 ? '' : 's'}`];
}

const MORE = /^…and \d+ more problems?$/;

/**
 * The n² (or per-flow) tables of the analysis document that the API leaves out unless asked for
 * (`?tables=all`): at 400 compartments each square table alone is 160,000 numbers.
 */
export const LARGE_ANALYSIS_TABLES = ['totalDependency', 'allPathwayDependency', 'totalContribution', 'mixedTrophicImpact', 'robustnessGradient'] as const;
/** The per-flow tables of the cycle analysis, left out with the others. */
export const LARGE_CYCLE_TABLES = ['cycledFlow', 'acyclicFlow'] as const;
/** Nexuses listed in a summary document, and cycles listed per nexus; counts say how many there are. */
export const NEXUSES_LISTED = 50;
export const CYCLES_LISTED_PER_NEXUS = 20;

/** `summary`: the API's default; `all`: every table, as the CLI's document (METHODS.md §11). */
export type TableSelection = 'summary' | 'all';
