import type { Adjustment, Web } from '@seinework/contracts';
import { createNetwork, WebError } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { describeAdjustment, planOption, targetValues } from './option-web';

/** Cone Spring with two fleets: "sieve" lands bacteria, "trap" lands detritivores and bacteria. */
function fishedCone(): Web {
  const web = structuredClone(cone) as Web;
  web.exports = web.exports.map((e) => (e.from === 'bacteria' ? { ...e, value: 155, fleet: 'sieve', price: 100 } : e));
  web.exports.push({ from: 'bacteria', value: 100, fleet: 'trap' });
  web.respiration = web.respiration.map((r) => (r.from === 'detritivores' ? { ...r, value: 1764 } : r));
  web.exports.push({ from: 'detritivores', value: 50, fleet: 'trap' });
  return web;
}

function refusal(adjustments: Adjustment[]): WebError {
  try {
    planOption(createNetwork(fishedCone()), adjustments);
  } catch (error) {
    if (error instanceof WebError) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}

describe('planOption', () => {
  it('gives every catch a target: adjusted ones their new amount, the others their baseline', () => {
    const network = createNetwork(fishedCone());
    const plan = planOption(network, [
      { type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: -20 },
      { type: 'set-catch', fleet: 'trap', compartment: 'detritivores', amount: 70 },
    ]);
    const byKey = Object.fromEntries(plan.catches.map((c) => [`${c.fleet}/${network.ids[c.compartment]}`, c.amount]));
    expect(byKey).toEqual({ 'sieve/bacteria': 124, 'trap/bacteria': 100, 'trap/detritivores': 70 });
    expect(plan.catches.find((c) => c.fleet === 'trap' && c.amount === 100)!.label).toMatch(/kept at its baseline 100/);
    expect(plan.network).toBe(network);
  });

  it('closing a fleet targets every one of its catches at zero', () => {
    const plan = planOption(createNetwork(fishedCone()), [{ type: 'close-fleet', fleet: 'trap' }]);
    expect(plan.catches.filter((c) => c.fleet === 'trap').map((c) => c.amount)).toEqual([0, 0]);
    expect(plan.catches.find((c) => c.fleet === 'sieve')!.amount).toBe(155);
  });

  it('appends a zero harvest flux for a new fishery, keeping the baseline flux order', () => {
    const network = createNetwork(fishedCone());
    const plan = planOption(network, [{ type: 'open-fishery', fleet: 'line', compartment: 'carnivores', amount: 5 }]);
    expect(plan.network.fluxes.slice(0, network.fluxes.length)).toEqual(network.fluxes);
    expect(plan.network.fluxes.at(-1)).toMatchObject({ kind: 'export', fleet: 'line', value: 0 });
    expect(plan.network.fleets).toContain('line');
    expect(targetValues(plan).at(-1)).toBe(5);
  });

  it('scales the imports of a producer', () => {
    const plan = planOption(createNetwork(fishedCone()), [{ type: 'scale-production', compartment: 'plants', percent: 10 }]);
    expect([...plan.imports.values()]).toEqual([11184 * 1.1]);
  });

  const refusals: [string, Adjustment[], string][] = [
    ['an unknown fleet', [{ type: 'set-catch', fleet: 'trawl', compartment: 'bacteria', amount: 1 }], 'adjustments[0] (set-catch fleet "trawl" on "bacteria" to 1): unknown fleet "trawl"'],
    ['an unknown compartment', [{ type: 'scale-catch', fleet: 'sieve', compartment: 'flatfish', percent: 5 }], 'adjustments[0] (scale-catch fleet "sieve" on "flatfish" by 5 %): unknown compartment "flatfish"'],
    ['a percentage below −100', [{ type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: -120 }], 'adjustments[0] (scale-catch fleet "sieve" on "bacteria" by -120 %): percent -120 is below -100'],
    ['a catch a fleet does not take', [{ type: 'scale-catch', fleet: 'sieve', compartment: 'carnivores', percent: 5 }], 'fleet "sieve" does not catch "carnivores"; use open-fishery'],
    ['two targets for one catch', [
      { type: 'scale-catch', fleet: 'trap', compartment: 'bacteria', percent: 5 },
      { type: 'set-catch', fleet: 'trap', compartment: 'bacteria', amount: 50 },
    ], 'adjustments[1] (set-catch fleet "trap" on "bacteria" to 50): contradicts adjustments[0], which already sets the catch of fleet "trap" on "bacteria"'],
    ['a catch of a closed fleet', [
      { type: 'set-catch', fleet: 'trap', compartment: 'bacteria', amount: 50 },
      { type: 'close-fleet', fleet: 'trap' },
    ], 'adjustments[0] (set-catch fleet "trap" on "bacteria" to 50): contradicts adjustments[1], which closes fleet "trap"'],
    ['a fleet closed twice', [{ type: 'close-fleet', fleet: 'trap' }, { type: 'close-fleet', fleet: 'trap' }], 'adjustments[1] (close-fleet "trap"): fleet "trap" is already closed by adjustments[0]'],
    ['opening a fishery that exists', [{ type: 'open-fishery', fleet: 'sieve', compartment: 'bacteria', amount: 3 }], 'fleet "sieve" already catches "bacteria" (155)'],
    ['opening a fishery twice', [
      { type: 'open-fishery', fleet: 'line', compartment: 'carnivores', amount: 3 },
      { type: 'open-fishery', fleet: 'line', compartment: 'carnivores', amount: 4 },
    ], 'adjustments[1] (open-fishery fleet "line" on "carnivores" at 4): contradicts adjustments[0]'],
    ['scaling a non-producer', [{ type: 'scale-production', compartment: 'detritus', percent: 5 }], 'adjustments[0] (scale-production of "detritus" by 5 %): "detritus" is a detritus, not a producer'],
    ['scaling a producer twice', [
      { type: 'scale-production', compartment: 'plants', percent: 5 },
      { type: 'scale-production', compartment: 'plants', percent: 6 },
    ], 'contradicts adjustments[0], which already scales "plants"'],
  ];
  it.each(refusals)('refuses %s, naming the adjustment', (_, adjustments, message) => {
    const error = refusal(adjustments);
    expect(error.kind).toBe('invalid');
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toContain(message);
  });

  it('refuses scaling a producer with no import', () => {
    const web = fishedCone();
    web.compartments.push({ id: 'moss', name: 'Moss', kind: 'producer' });
    expect(() => planOption(createNetwork(web), [{ type: 'scale-production', compartment: 'moss', percent: 5 }])).toThrow(
      /adjustments\[0\] \(scale-production of "moss" by 5 %\): producer "moss" has no import/,
    );
  });

  it('reports every problem at once', () => {
    const error = refusal([
      { type: 'close-fleet', fleet: 'nets' },
      { type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: -101 },
    ]);
    expect(error.problems).toHaveLength(2);
    expect(error.problems[0]).toMatch(/^adjustments\[0\] \(close-fleet "nets"\): unknown fleet "nets"/);
    expect(error.problems[1]).toMatch(/^adjustments\[1\] .*below -100/);
  });

  it('describes each kind of adjustment', () => {
    expect(describeAdjustment({ type: 'close-fleet', fleet: 'trap' }, 3)).toBe('adjustments[3] (close-fleet "trap")');
    expect(describeAdjustment({ type: 'open-fishery', fleet: 'f', compartment: 'c', amount: 2 }, 0)).toBe('adjustments[0] (open-fishery fleet "f" on "c" at 2)');
  });
});
