import { SCALAR_INDICATORS, type ComparedIndicator } from '@seinework/contracts';

/**
 * Every scalar indicator of 2–6 runs' result documents side by side (METHODS.md §11 keys, then
 * Fishing-in-Balance, which exists only as a difference): the baseline's value, each run's value
 * after the option, the difference, its 5–95 % band where draws were run, and whether that band
 * excludes zero (the difference exceeds the uncertainty). Pure: the documents as stored.
 */

export interface ComparedResult {
  readonly runId: string;
  /** `{baseline, option, difference, web, uncertainty?}` as the scenario command prints it. */
  readonly result: unknown;
}

type Band = { p5: number; median: number; p95: number };

export function comparedIndicators(results: readonly ComparedResult[]): ComparedIndicator[] {
  const keys = [...SCALAR_INDICATORS, 'fishingInBalance'] as const;
  return keys.map((key) => ({
    key,
    baseline: key === 'fishingInBalance' ? null : numberAt(results[0]?.result, 'baseline', key),
    values: results.map(({ runId, result }) => {
      const band = bandAt(result, key);
      return {
        runId,
        after: key === 'fishingInBalance' ? null : numberAt(result, 'option', key),
        difference: numberAt(result, 'difference', key),
        band,
        exceedsUncertainty: band !== null && (band.p5 > 0 || band.p95 < 0),
      };
    }),
  }));
}

function member(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null && Object.hasOwn(value, key) ? (value as Record<string, unknown>)[key] : undefined;
}

function numberAt(result: unknown, part: string, key: string): number | null {
  const value = member(member(result, part), key);
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function bandAt(result: unknown, key: string): Band | null {
  const band = member(member(member(member(result, 'uncertainty'), 'indicators'), key), 'difference');
  const p5 = member(band, 'p5');
  const median = member(band, 'median');
  const p95 = member(band, 'p95');
  return typeof p5 === 'number' && typeof median === 'number' && typeof p95 === 'number' ? { p5, median, p95 } : null;
}
