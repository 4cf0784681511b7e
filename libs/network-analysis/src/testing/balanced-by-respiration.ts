import type { Web } from '@seinework/contracts';

type Kind = Web['compartments'][number]['kind'];

/**
 * A small hand-made web for unit tests: compartments by id and kind, internal flows and imports as
 * given, each compartment balanced by respiring its surplus (inputs − outputs; none where that is 0).
 * The surplus must not be negative: the test's numbers are meant to be worked by hand.
 */
export function balancedByRespiration(
  name: string,
  kinds: Record<string, Kind>,
  flows: readonly [from: string, to: string, value: number][],
  imports: Record<string, number>,
): Web {
  const ids = Object.keys(kinds);
  const surplus = new Map(ids.map((id) => [id, imports[id] ?? 0]));
  for (const [from, to, value] of flows) {
    surplus.set(to, surplus.get(to)! + value);
    surplus.set(from, surplus.get(from)! - value);
  }
  for (const [id, value] of surplus) if (value < 0) throw new Error(`test web "${name}": "${id}" gives out ${-value} more than it takes in`);
  return {
    name,
    unit: 'u',
    compartments: ids.map((id) => ({ id, name: id.toUpperCase(), kind: kinds[id] })),
    flows: flows.map(([from, to, value]) => ({ from, to, value })),
    imports: Object.entries(imports).map(([to, value]) => ({ to, value })),
    exports: [],
    respiration: ids.filter((id) => surplus.get(id)! > 0).map((id) => ({ from: id, value: surplus.get(id)! })),
  };
}
