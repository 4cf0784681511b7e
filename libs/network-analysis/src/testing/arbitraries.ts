import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import { generateWeb } from './generated-web';

/** fast-check arbitrary of balanced generated webs (see generateWeb); shrinks toward small webs. */
export function balancedWeb(options: { min?: number; max?: number; cycles?: boolean } = {}): fc.Arbitrary<Web> {
  return fc
    .record({
      compartments: fc.integer({ min: options.min ?? 3, max: options.max ?? 12 }),
      seed: fc.integer({ min: 0, max: 2 ** 31 - 1 }),
      density: fc.double({ min: 0.05, max: 0.8, noNaN: true }),
    })
    .map((o) => generateWeb({ ...o, cycles: options.cycles }));
}

/**
 * Balanced webs of any structure: random kinds and links (isolated compartments, consumers with no
 * food, detritus with no exit, closed loops), balanced by adding respiration or an import wherever
 * inputs and outputs differ. `value` draws every flow, import and catch.
 */
export function anyStructureWeb(value: fc.Arbitrary<number>): fc.Arbitrary<Web> {
  return fc
    .record({
      kinds: fc.array(fc.constantFrom('producer', 'consumer', 'detritus'), { minLength: 1, maxLength: 7 }),
      links: fc.array(fc.tuple(fc.nat(6), fc.nat(6), value), { maxLength: 20 }),
      imports: fc.array(fc.tuple(fc.nat(6), value), { maxLength: 4 }),
      fleets: fc.array(fc.tuple(fc.nat(6), fc.constantFrom('A', 'B'), value), { maxLength: 3 }),
    })
    .map(({ kinds, links, imports, fleets }): Web => {
      const n = kinds.length;
      const id = (i: number) => `c${i % n}`;
      const flows = new Map<string, { from: string; to: string; value: number }>();
      for (const [from, to, v] of links) if (from % n !== to % n) flows.set(`${id(from)}>${id(to)}`, { from: id(from), to: id(to), value: v });
      // one import per compartment (a second one is a refusal of its own, tested with the web's format)
      const imported = new Map<string, { to: string; value: number }>();
      for (const [to, v] of imports) imported.set(id(to), { to: id(to), value: v });
      const web: Web = {
        name: 'fuzz',
        unit: 'u',
        compartments: kinds.map((kind, i) => ({ id: id(i), name: `C${i}`, kind })),
        flows: [...flows.values()],
        imports: [...imported.values()],
        exports: [...new Map(fleets.map(([from, fleet, v]) => [`${id(from)}/${fleet}`, { from: id(from), value: v, fleet }])).values()],
        respiration: [],
      };
      const sum = (values: { value: number }[]) => values.reduce((s, v) => s + v.value, 0);
      for (let i = 0; i < n; i++) {
        const inputs = sum(web.imports.filter((f) => f.to === id(i))) + sum(web.flows.filter((f) => f.to === id(i)));
        const outputs = sum(web.exports.filter((f) => f.from === id(i))) + sum(web.flows.filter((f) => f.from === id(i)));
        if (inputs > outputs) web.respiration.push({ from: id(i), value: inputs - outputs });
        else if (outputs > inputs) {
          const existing = web.imports.find((f) => f.to === id(i));
          if (existing) existing.value += outputs - inputs;
          else web.imports.push({ to: id(i), value: outputs - inputs });
        }
      }
      return web;
    });
}
