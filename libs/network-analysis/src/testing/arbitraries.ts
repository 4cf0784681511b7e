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
