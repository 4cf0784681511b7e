import type { Adjustment, HarvestOption, ResponseRule, Web } from '@seinework/contracts';
import { createNetwork } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { catchWebError } from '../../network-analysis/src/testing/catch-web-error';
import { HOSTILE_IDS, prototypeSnapshot, renamedDocument, renamedWeb, reversed, type Renaming } from '../../network-analysis/src/testing/hostile-ids';
import { harvestSensitivity } from './harvest-sensitivity';
import { runOption } from './run-option';
import { optionUncertainty } from './uncertainty';

/**
 * Compartment ids and fleet names that are also names of Object.prototype's members, in every
 * role an option gives them: the caught compartment, a fleet whose catch is scaled, a fleet that
 * is closed, a fleet that only the option opens. Each document renamed back must be the document
 * of the plain web, and nothing may be written into a prototype.
 */

/** Cone Spring (Finn 1976) with fleets "trap" on detritivores and "line" on carnivores, taken from their respiration. */
function fishedCone(): Web {
  const web = structuredClone(cone) as Web;
  web.respiration = web.respiration.map((r) => (r.from === 'detritivores' ? { ...r, value: 1714 } : r.from === 'carnivores' ? { ...r, value: 153 } : r));
  web.exports.push({ from: 'detritivores', value: 100, fleet: 'trap', price: 1000 }, { from: 'carnivores', value: 50, fleet: 'line', price: 3000 });
  return { ...web, areaKm2: 2, tonnesPerUnit: 9 };
}

function adjustments(to: (name: string) => string): Adjustment[] {
  return [
    { type: 'scale-catch', fleet: to('trap'), compartment: to('detritivores'), percent: 10 },
    { type: 'close-fleet', fleet: to('line') },
    { type: 'open-fishery', fleet: to('sieve'), compartment: to('bacteria'), amount: 20 },
  ];
}

function option(renaming: Renaming, response: ResponseRule): HarvestOption {
  return { name: 'hostile', response, adjustments: adjustments((name) => renaming.get(name) ?? name) };
}

/** Each hostile name in each role, one at a time. */
const ROLES = ['detritivores', 'trap', 'line', 'sieve'] as const;
const CASES = HOSTILE_IDS.flatMap((name) => ROLES.map((role) => ({ name, role, renaming: new Map([[role, name]]) as Renaming })));

const before = prototypeSnapshot();
afterEach(() => expect(prototypeSnapshot()).toBe(before));

const same = (hostile: unknown, plain: unknown, renaming: Renaming) =>
  expect(JSON.stringify(renamedDocument(hostile, reversed(renaming)))).toBe(JSON.stringify(plain));

describe('harvest options on ids that are names of Object.prototype members', () => {
  it.each(CASES)('$name as $role: the run (baseline, option, difference, web) under both response rules', ({ renaming }) => {
    for (const response of ['bottom-up', 'least-change'] as const) {
      const plain = runOption(fishedCone(), option(new Map(), response));
      const hostile = runOption(renamedWeb(fishedCone(), renaming), option(renaming, response));
      same(hostile, plain, renaming);
      same(JSON.parse(JSON.stringify(hostile)), plain, renaming);
    }
  });

  it('all five at once: the difference keeps every fleet and compartment, with Fishing-in-Balance per fleet', () => {
    const renaming: Renaming = new Map([
      ['detritivores', '__proto__'],
      ['bacteria', 'constructor'],
      ['trap', 'toString'],
      ['line', 'hasOwnProperty'],
      ['sieve', 'prototype'],
    ]);
    const hostile = runOption(renamedWeb(fishedCone(), renaming), option(renaming, 'bottom-up'));
    same(hostile, runOption(fishedCone(), option(new Map(), 'bottom-up')), renaming);
    const fleets = hostile.difference.fleets as Record<string, Record<string, number | null>>;
    const fleet = (name: string) => fleets[name];
    expect(Object.keys(fleets)).toEqual(['toString', 'hasOwnProperty', 'prototype']);
    expect(fleet('prototype').catch).toBe(20);
    expect(fleet('hasOwnProperty').catch).toBe(-50);
    expect(fleet('toString').fishingInBalance).toEqual(expect.any(Number));
    expect(Object.hasOwn(hostile.difference.trophicLevels as object, '__proto__')).toBe(true);
  });

  it.each(HOSTILE_IDS)('"%s" as compartment and as fleet: the harvest-sensitivity table', (name) => {
    for (const renaming of [new Map([['detritivores', name]]), new Map([['trap', name]])] as Renaming[]) {
      const network = createNetwork(renamedWeb(fishedCone(), renaming));
      same(harvestSensitivity(network, 'least-change'), harvestSensitivity(createNetwork(fishedCone()), 'least-change'), renaming);
    }
  });

  it.each(HOSTILE_IDS)('"%s" as compartment and as the new fleet: the uncertainty summary', async (name) => {
    const settings = { draws: 12, cv: 0.1, seed: 5 };
    const plain = await optionUncertainty(fishedCone(), option(new Map(), 'bottom-up'), settings);
    for (const renaming of [new Map([['bacteria', name]]), new Map([['sieve', name]])] as Renaming[]) {
      const hostile = await optionUncertainty(renamedWeb(fishedCone(), renaming), option(renaming, 'bottom-up'), settings);
      same(hostile, plain, renaming);
      expect(hostile.succeeded).toBe(12);
    }
  });

  it('a new fleet named like a compartment is refused, naming the adjustment', () => {
    const network = createNetwork(fishedCone());
    const error = catchWebError(() => runOption(fishedCone(), { name: 'x', response: 'bottom-up', adjustments: [{ type: 'open-fishery', fleet: 'bacteria', compartment: 'bacteria', amount: 1 }] }));
    expect(network.fleets).toEqual(['trap', 'line']);
    expect(error.problems).toEqual([
      'adjustments[0] (open-fishery fleet "bacteria" on "bacteria" at 1): fleet "bacteria" has the name of a compartment; give the new fleet another name',
    ]);
  });
});
