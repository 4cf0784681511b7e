import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Web } from '@seinework/contracts';

/** Webs for the webs-routes tests: the demo baseline and a tiny web, balanced or not. */

export const brannockBay: Web = JSON.parse(readFileSync(resolve(import.meta.dirname, '../../../../seeds/brannock-bay.json'), 'utf8'));

/** Algae → fish, harvested by a trawl fleet; balanced unless the fish respiration is changed. */
export function tinyWeb(fishRespiration = 6): Web {
  return {
    name: 'Tiny bay',
    unit: 'g C m-2 y-1',
    compartments: [
      { id: 'algae', name: 'Algae', kind: 'producer', biomass: 3 },
      { id: 'fish', name: 'Fish', kind: 'consumer', biomass: 1 },
    ],
    flows: [{ from: 'algae', to: 'fish', value: 10, cv: 0.2 }],
    imports: [{ to: 'algae', value: 20 }],
    exports: [{ from: 'fish', value: 4, fleet: 'trawl', price: 1200 }],
    respiration: [
      { from: 'algae', value: 10 },
      { from: 'fish', value: fishRespiration },
    ],
  };
}
