import type { Web } from '@seinework/contracts';

/**
 * Ids that name what every plain object inherits: on an object literal `__proto__` sets the
 * prototype, and the others read Object.prototype's methods where a map lacks the key.
 */
export const HOSTILE_IDS = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'prototype'] as const;

/** Old name → new name, for compartment ids and fleet names alike. */
export type Renaming = ReadonlyMap<string, string>;

/** The same web with compartment ids and fleet names renamed (names absent from the renaming kept). */
export function renamedWeb(web: Web, renaming: Renaming): Web {
  const to = (name: string) => renaming.get(name) ?? name;
  return {
    ...web,
    compartments: web.compartments.map((c) => ({ ...c, id: to(c.id) })),
    flows: web.flows.map((f) => ({ ...f, from: to(f.from), to: to(f.to) })),
    imports: web.imports.map((f) => ({ ...f, to: to(f.to) })),
    exports: web.exports.map((f) => (f.fleet === undefined ? { ...f, from: to(f.from) } : { ...f, from: to(f.from), fleet: to(f.fleet) })),
    respiration: web.respiration.map((f) => ({ ...f, from: to(f.from) })),
  };
}

/**
 * A document (analysis, run, table…) with every key, every string equal to a renamed name and
 * every quoted name inside a message renamed: a document of the hostile web renamed back must be
 * the document of the plain web, character for character once serialised. Reads only own
 * enumerable keys, as JSON.stringify does, so a row written into a prototype counts as missing.
 */
export function renamedDocument(value: unknown, renaming: Renaming): unknown {
  if (typeof value === 'string') {
    const exact = renaming.get(value);
    if (exact !== undefined) return exact;
    let text = value;
    for (const [from, to] of renaming) text = text.replaceAll(`"${from}"`, `"${to}"`);
    return text;
  }
  if (Array.isArray(value)) return value.map((v) => renamedDocument(v, renaming));
  if (typeof value === 'object' && value !== null) {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [renaming.get(k) ?? k, renamedDocument(v, renaming)]));
  }
  return value;
}

/** The reverse renaming. */
export function reversed(renaming: Renaming): Renaming {
  return new Map([...renaming].map(([from, to]) => [to, from]));
}

/**
 * Own property names of Object.prototype, Object, Function.prototype and every function
 * Object.prototype holds (where a write through `map["constructor"][id]` or
 * `map["toString"][id]` would land), for checking that nothing wrote into them.
 */
export function prototypeSnapshot(): string {
  const targets: [string, object][] = [
    ['Object.prototype', Object.prototype],
    ['Object', Object],
    ['Function.prototype', Function.prototype],
    ['Array.prototype', Array.prototype],
  ];
  for (const name of Object.getOwnPropertyNames(Object.prototype)) {
    const descriptor = Object.getOwnPropertyDescriptor(Object.prototype, name);
    if (typeof descriptor?.value === 'function') targets.push([`Object.prototype.${name}`, descriptor.value as object]);
  }
  return targets.map(([name, target]) => `${name}: ${Object.getOwnPropertyNames(target).sort().join(',')}`).join('\n');
}
