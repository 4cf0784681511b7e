/**
 * Maps keyed by compartment id or fleet name. Ids come from whoever wrote the web, and
 * `__proto__`, `constructor` or `toString` are ids like any other: on an ordinary object literal
 * the first would set the prototype (or write into Object.prototype) and the others would read
 * what Object.prototype holds. These maps have no prototype, so every key is an own property, an
 * absent key reads undefined and JSON.stringify writes every key.
 */
export type IdMap<T> = Record<string, T>;

export function idMap<T>(entries: Iterable<readonly [string, T]> = []): IdMap<T> {
  const map = Object.create(null) as IdMap<T>;
  for (const [key, value] of entries) map[key] = value;
  return map;
}

/** The value under `key` only when the map holds it itself, never one inherited from a prototype. */
export function ownValue(map: object, key: string): unknown {
  return Object.hasOwn(map, key) ? (map as Record<string, unknown>)[key] : undefined;
}
