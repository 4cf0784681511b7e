import { SCALAR_INDICATORS, type ScalarIndicators, type UncertaintySettings, type Web } from '@seinework/contracts';
import { createNetwork, requireAnalysable } from '@seinework/network-analysis';
import type { OptionSpec } from './apply-option';
import { planOption } from './option-web';
import { runDraws, type DrawJob, type DrawOutcome } from './uncertainty-draw';

/**
 * Monte Carlo uncertainty of a harvest option (METHODS.md §8): many draws of the web within its
 * flows' cvs, each balanced by least change and run through the option, summarised per scalar
 * indicator as median and 5–95 % band of the baseline, the option and their difference, with the
 * share of draws in which the difference is positive. Draws run in chunks, in process or on a pool
 * of worker threads handed in by the caller (libs/draw-pool, Node only: this module stays pure);
 * results are identical bit for bit either way, since each draw's seed depends only on (seed, draw
 * index) and the summary is taken over draws in index order.
 */

export type ScalarKey = (typeof SCALAR_INDICATORS)[number];

export interface Band {
  readonly median: number;
  readonly p5: number;
  readonly p95: number;
}

export interface IndicatorUncertainty {
  /** null where the indicator has no value in any draw (e.g. no catch). */
  readonly baseline: Band | null;
  readonly option: Band | null;
  readonly difference: Band | null;
  /** Share of draws (with a difference) in which option − baseline > 0. */
  readonly shareDifferencePositive: number | null;
  /** The difference has the same sign in at least 90 % of draws. */
  readonly robust: boolean;
}

export interface UncertaintySummary {
  readonly draws: number;
  readonly succeeded: number;
  /** Draws refused (e.g. infeasible option on that draw): counted, never silently dropped. */
  readonly failed: number;
  /** The first few reasons, with their draw index. */
  readonly failures: string[];
  readonly cv: number;
  readonly seed: number;
  readonly indicators: Record<ScalarKey, IndicatorUncertainty>;
  /** The indicators whose difference is robust (same sign in at least 90 % of draws), in §11 order. */
  readonly robustDifferences: ScalarKey[];
}

/** Runs chunks of draws elsewhere, e.g. on worker threads (libs/draw-pool). */
export interface DrawRunner {
  /** How many chunks it runs at once, for sizing chunks. */
  readonly workers: number;
  run(job: DrawJob): Promise<DrawOutcome[]>;
}

export interface UncertaintyRunOptions {
  /** Where to run the chunks of draws; in this thread when omitted. */
  readonly pool?: DrawRunner;
  /** Draws per chunk (default: about eight chunks per worker, at most 100 draws). */
  readonly chunkSize?: number;
  /** Called after each chunk with the number of draws done so far. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** Share of draws with one sign for a difference to count as robust. */
export const ROBUST_SHARE = 0.9;
const FAILURES_LISTED = 5;

export async function optionUncertainty(
  web: Web,
  option: OptionSpec,
  settings: UncertaintySettings,
  options: UncertaintyRunOptions = {},
): Promise<UncertaintySummary> {
  const network = createNetwork(web);
  requireAnalysable(network);
  planOption(network, option.adjustments);
  const workers = Math.max(1, options.pool?.workers ?? 1);
  const chunkSize = Math.max(1, Math.floor(options.chunkSize ?? Math.min(100, Math.ceil(settings.draws / (8 * workers)))));
  const jobs: DrawJob[] = [];
  for (let start = 0; start < settings.draws; start += chunkSize) {
    jobs.push({ web, option: { response: option.response, adjustments: option.adjustments }, cv: settings.cv, seed: settings.seed, start, end: Math.min(settings.draws, start + chunkSize) });
  }
  let done = 0;
  const finished = (outcomes: DrawOutcome[]) => {
    done += outcomes.length;
    options.onProgress?.(done, settings.draws);
    return outcomes;
  };
  const pool = options.pool;
  if (!pool) return summarise((await inProcess(jobs, finished)).flat(), settings);
  return summarise((await Promise.all(jobs.map(async (job) => finished(await pool.run(job))))).flat(), settings);
}

async function inProcess(jobs: DrawJob[], finished: (o: DrawOutcome[]) => DrawOutcome[]): Promise<DrawOutcome[][]> {
  const chunks: DrawOutcome[][] = [];
  for (const job of jobs) {
    chunks.push(finished(runDraws(job)));
    // let the event loop breathe between chunks (a server forwarding progress stays responsive)
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
  return chunks;
}

/** Bands and shares over the draws, in draw order. */
export function summarise(outcomes: readonly DrawOutcome[], settings: UncertaintySettings): UncertaintySummary {
  const ordered = [...outcomes].sort((a, b) => a.draw - b.draw);
  const good = ordered.filter((o): o is Extract<DrawOutcome, { baseline: ScalarIndicators }> => !('failure' in o));
  const bad = ordered.filter((o): o is Extract<DrawOutcome, { failure: string }> => 'failure' in o);
  const indicators = Object.fromEntries(
    SCALAR_INDICATORS.map((key) => {
      const baseline: number[] = [];
      const option: number[] = [];
      const differences: number[] = [];
      let above = 0;
      let below = 0;
      for (const o of good) {
        const before = o.baseline[key];
        const after = o.option[key];
        if (before !== null) baseline.push(before);
        if (after !== null) option.push(after);
        if (before === null || after === null) continue;
        const d = after - before;
        differences.push(d);
        if (d > 0) above++;
        else if (d < 0) below++;
      }
      const positive = above / differences.length;
      const negative = below / differences.length;
      const summary: IndicatorUncertainty = {
        baseline: band(baseline),
        option: band(option),
        difference: band(differences),
        shareDifferencePositive: differences.length > 0 ? positive : null,
        robust: differences.length > 0 && Math.max(positive, negative) >= ROBUST_SHARE,
      };
      return [key, summary];
    }),
  ) as Record<ScalarKey, IndicatorUncertainty>;
  return {
    draws: ordered.length,
    succeeded: good.length,
    failed: bad.length,
    failures: bad.slice(0, FAILURES_LISTED).map((o) => `draw ${o.draw}: ${o.failure}`),
    cv: settings.cv,
    seed: settings.seed,
    indicators,
    robustDifferences: SCALAR_INDICATORS.filter((key) => indicators[key].robust),
  };
}

function band(values: readonly number[]): Band | null {
  if (values.length === 0) return null;
  const sorted = ascending(values);
  return { median: quantile(sorted, 0.5), p5: quantile(sorted, 0.05), p95: quantile(sorted, 0.95) };
}

/**
 * The values in the order sorting with (a, b) => a − b leaves them. A typed-array sort is several
 * times faster (20,000 draws × 48 bands) and gives the same order wherever the comparator does:
 * it differs only by putting −0 before 0 and NaN last, so with either present the comparator sorts.
 */
function ascending(values: readonly number[]): ArrayLike<number> {
  const typed = Float64Array.from(values);
  for (let k = 0; k < typed.length; k++) {
    const v = typed[k];
    if (v !== v || (v === 0 && 1 / v < 0)) return [...values].sort((a, b) => a - b);
  }
  return typed.sort();
}

/** Linear interpolation between order statistics (Hyndman & Fan 1996, definition 7). */
export function quantile(sorted: ArrayLike<number>, p: number): number {
  const h = (sorted.length - 1) * p;
  const below = Math.floor(h);
  const above = Math.min(sorted.length - 1, below + 1);
  // equal neighbours give that value exactly (also when infinite, where the interpolation would give NaN)
  if (sorted[above] === sorted[below]) return sorted[below];
  return sorted[below] + (h - below) * (sorted[above] - sorted[below]);
}
