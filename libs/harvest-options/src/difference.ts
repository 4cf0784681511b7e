import { idMap, ownValue } from '@seinework/network-analysis';

/**
 * Option − baseline for every numeric value of two analysis documents (METHODS.md §11), maps
 * compared key by key. A key present on one side only counts as 0 there (a new fishery's catch, a
 * flow that disappears), except a mean trophic level, which has no value without a catch: null.
 * null on either side gives null; non-numeric fields (unit, side of the fitness peak, warnings,
 * cycle listings) are left out. Keys are compartment ids and fleet names as much as field names:
 * only own properties are read and the result is built of null-prototype maps (id-map.ts).
 */

export type DifferenceValue = number | null | DifferenceValue[] | { [key: string]: DifferenceValue };

/** Fields with no meaningful option − baseline: identities and listings rather than quantities. */
const LEFT_OUT = new Set(['nexuses', 'level']);
/** Quantities that do not exist where there is nothing to measure (no catch, no level). */
const NO_ZERO = new Set(['meanTrophicLevelOfCatch', 'trophicLevels']);

export type DifferenceMap = { [key: string]: DifferenceValue };

export function difference(baseline: object, option: object): DifferenceMap {
  return (diff(baseline, option, false) as DifferenceMap | undefined) ?? idMap();
}

function diff(before: unknown, after: unknown, noZero: boolean): DifferenceValue | undefined {
  if (before === null || after === null) return null;
  if (typeof before === 'number' || typeof after === 'number') {
    if (before === undefined || after === undefined) {
      if (noZero) return null;
      return typeof after === 'number' ? after : -(before as number);
    }
    return typeof before === 'number' && typeof after === 'number' ? after - before : undefined;
  }
  if (Array.isArray(before) || Array.isArray(after)) {
    const a = Array.isArray(before) ? before : [];
    const b = Array.isArray(after) ? after : [];
    const result: DifferenceValue[] = [];
    for (let k = 0; k < Math.max(a.length, b.length); k++) {
      const d = diff(a[k], b[k], noZero);
      if (d !== undefined) result.push(d);
    }
    return result.length > 0 ? result : undefined;
  }
  if (isObject(before) || isObject(after)) {
    const a = isObject(before) ? before : idMap();
    const b = isObject(after) ? after : idMap();
    const result: DifferenceMap = idMap();
    for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
      if (LEFT_OUT.has(key)) continue;
      const d = diff(ownValue(a, key), ownValue(b, key), noZero || NO_ZERO.has(key));
      if (d !== undefined) result[key] = d;
    }
    return Object.keys(result).length > 0 ? result : undefined;
  }
  return undefined;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
