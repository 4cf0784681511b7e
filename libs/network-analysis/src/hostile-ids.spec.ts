import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { analyzeWeb } from './analyze';
import { isBalanced } from './balance-check';
import { BALANCING_METHODS, balanceNetwork } from './balancing';
import { createNetwork, parseWeb, toWeb, withFluxValues } from './network';
import { balancedWeb } from './testing/arbitraries';
import { catchWebError } from './testing/catch-web-error';
import { HOSTILE_IDS, prototypeSnapshot, renamedDocument, renamedWeb, reversed, type Renaming } from './testing/hostile-ids';

/**
 * Compartment ids and fleet names that are also names of Object.prototype's members: every
 * document of the hostile web, renamed back, must be the document of the plain web (no row lost,
 * none changed), and nothing may be written into a prototype.
 */

/** Cone Spring (Finn 1976) with two fleets landing detritivores and carnivores, taken from their respiration. */
function fishedCone(): Web {
  const web = structuredClone(cone) as Web;
  web.respiration = web.respiration.map((r) => (r.from === 'detritivores' ? { ...r, value: 1714 } : r.from === 'carnivores' ? { ...r, value: 153 } : r));
  web.exports.push({ from: 'detritivores', value: 100, fleet: 'trap', price: 1000 }, { from: 'carnivores', value: 50, fleet: 'line', price: 3000 });
  return { ...web, areaKm2: 2, tonnesPerUnit: 9 };
}

/** Cone Spring with five fleets, each a hostile name, on bacteria, detritivores and carnivores. */
function fiveFleetCone(): Web {
  const web = structuredClone(cone) as Web;
  const on = ['bacteria', 'detritivores', 'carnivores', 'detritivores', 'carnivores'];
  web.exports.push(...on.map((from, k) => ({ from, value: 10, fleet: `fleet-${k}` })));
  web.respiration = web.respiration.map((r) => ({ ...r, value: r.value - 10 * on.filter((from) => from === r.from).length }));
  return web;
}

const before = prototypeSnapshot();
afterEach(() => expect(prototypeSnapshot()).toBe(before));

function expectSameAnalysis(plain: Web, renaming: Renaming): void {
  const hostile = renamedWeb(plain, renaming);
  const expected = JSON.stringify(analyzeWeb(plain));
  const document = analyzeWeb(hostile);
  expect(JSON.stringify(renamedDocument(document, reversed(renaming)))).toBe(expected);
  // what the CLI prints and the API sends, read back
  expect(JSON.stringify(renamedDocument(JSON.parse(JSON.stringify(document)), reversed(renaming)))).toBe(expected);
}

describe('ids that are names of Object.prototype members', () => {
  it.each(HOSTILE_IDS)('a compartment "%s": every map of the analysis keeps its rows', (id) => {
    expectSameAnalysis(fishedCone(), new Map([['carnivores', id]]));
    const document = analyzeWeb(renamedWeb(fishedCone(), new Map([['carnivores', id]])));
    for (const map of [document.trophicLevels, document.cycledThroughflow, document.totalDependency, document.mixedTrophicImpact, document.trophicLadder.shares]) {
      expect(Object.hasOwn(map, id)).toBe(true);
    }
    expect(typeof document.trophicLevels[id]).toBe('number');
    expect(Object.keys(document.robustnessGradient[id])).toEqual(['detritus']);
    expect(Object.keys(document.robustnessGradient.detritivores)).toEqual(['detritus', id]);
    expect(Object.keys(document.cycles!.acyclicFlow.detritivores)).toContain(id);
  });

  it.each(HOSTILE_IDS)('a fleet "%s": its summary and its column of the mixed trophic impact are kept', (fleet) => {
    expectSameAnalysis(fishedCone(), new Map([['trap', fleet]]));
    const document = analyzeWeb(renamedWeb(fishedCone(), new Map([['trap', fleet]])));
    expect(Object.keys(document.fleets)).toEqual([fleet, 'line']);
    expect(document.fleets[fleet].catch).toBe(100);
    expect(Object.hasOwn(document.mixedTrophicImpact.plants, fleet)).toBe(true);
  });

  it('all five at once, as the compartments of Cone Spring and as five fleets', () => {
    const ids = ['plants', 'detritus', 'bacteria', 'detritivores', 'carnivores'];
    expectSameAnalysis(fishedCone(), new Map(ids.map((id, k) => [id, HOSTILE_IDS[k]])));
    expectSameAnalysis(fiveFleetCone(), new Map(HOSTILE_IDS.map((name, k) => [`fleet-${k}`, name])));
  });

  it('the web read back (toWeb) and the balanced web of every method keep the ids', () => {
    const renaming: Renaming = new Map([
      ['plants', '__proto__'],
      ['detritus', 'constructor'],
      ['carnivores', 'toString'],
      ['trap', 'hasOwnProperty'],
      ['line', 'prototype'],
    ]);
    const hostile = renamedWeb(fishedCone(), renaming);
    expect(toWeb(createNetwork(parseWeb(hostile)))).toEqual(hostile);
    const unbalance = (web: Web) => {
      const network = createNetwork(web);
      return withFluxValues(network, network.fluxes.map((f, k) => (k % 3 === 0 ? f.value * 1.2 : f.value)));
    };
    for (const method of BALANCING_METHODS) {
      const plainBalanced = toWeb(balanceNetwork(unbalance(fishedCone()), { method }));
      const hostileBalanced = toWeb(balanceNetwork(unbalance(hostile), { method }));
      expect(isBalanced(createNetwork(parseWeb(hostileBalanced)))).toBe(true);
      expect(JSON.stringify(renamedDocument(hostileBalanced, reversed(renaming)))).toBe(JSON.stringify(plainBalanced));
    }
  });

  it('a fleet named like a compartment is refused: the mixed trophic impact table names both', () => {
    const web = fishedCone();
    web.exports = web.exports.map((e) => (e.fleet === 'trap' ? { ...e, fleet: 'carnivores' } : e));
    expect(catchWebError(() => createNetwork(web)).problems).toEqual([
      'exports[3]: fleet "carnivores" has the name of a compartment; give the fleet another name',
    ]);
  });

  it('random webs with hostile compartment ids and fleet names give the same documents as with plain ones', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 10 }), fc.shuffledSubarray([...HOSTILE_IDS], { minLength: 1 }), fc.nat(), (web, names, split) => {
        const fleets = [...new Set(web.exports.flatMap((e) => (e.fleet === undefined ? [] : [e.fleet])))];
        const renaming = new Map<string, string>();
        const asCompartments = split % (names.length + 1);
        names.slice(0, asCompartments).forEach((name, k) => renaming.set(web.compartments[(k * 7) % web.compartments.length].id, name));
        names.slice(asCompartments).forEach((name, k) => {
          if (k < fleets.length) renaming.set(fleets[k], name);
        });
        expectSameAnalysis(web, renaming);
        expect(prototypeSnapshot()).toBe(before);
      }),
      { numRuns: 30 },
    );
  });
});
