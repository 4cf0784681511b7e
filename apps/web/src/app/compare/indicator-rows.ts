import type { ComparedIndicator } from '@seinework/contracts';
import { INDICATOR_NAMES } from './indicator-names';

/**
 * Sorting the side-by-side table. Columns are `indicator`, `baseline`, and for each compared run
 * `after:<runId>` and `difference:<runId>`. Indicators without a value in the sorted column (no
 * catch, no baseline for Fishing-in-Balance) go last whichever way the column is sorted.
 */

export type SortDirection = 'asc' | 'desc' | '';

export function sortValue(indicator: ComparedIndicator, column: string): string | number | null {
  if (column === 'indicator') return INDICATOR_NAMES[indicator.key];
  if (column === 'baseline') return indicator.baseline;
  const [part, runId] = column.split(':');
  const value = indicator.values.find((v) => v.runId === runId);
  if (!value) return null;
  return part === 'after' ? value.after : part === 'difference' ? value.difference : null;
}

export function sortIndicators(indicators: readonly ComparedIndicator[], column: string, direction: SortDirection): ComparedIndicator[] {
  if (!column || !direction) return [...indicators];
  const sign = direction === 'asc' ? 1 : -1;
  return [...indicators].sort((a, b) => {
    const x = sortValue(a, column);
    const y = sortValue(b, column);
    if (x === null || y === null) return x === y ? 0 : x === null ? 1 : -1;
    if (typeof x === 'string' || typeof y === 'string') return sign * String(x).localeCompare(String(y));
    return sign * (x - y);
  });
}
