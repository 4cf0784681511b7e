import type { Web } from '@seinework/contracts';
import { createNetwork, isBalanced } from '@seinework/network-analysis';
import cone from '../../../tests/fixtures/cone-spring.json';
import { leastChangeResponse } from './least-change-response';
import { planOption } from './option-web';

/** Cone Spring with the bacteria export landed by a fleet. */
function fishedCone() {
  const web = structuredClone(cone) as Web;
  web.exports = web.exports.map((e) => (e.from === 'bacteria' ? { ...e, fleet: 'sieve' } : e));
  return createNetwork(web);
}

describe('leastChangeResponse (least-change balance of METHODS.md §7; Vézina & Platt 1988)', () => {
  it('pins catches and producer imports and moves the other flows', () => {
    const baseline = fishedCone();
    const option = leastChangeResponse(planOption(baseline, [{ type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: 40 }]));
    const b = baseline.index.get('bacteria')!;
    expect(option.catches[0][b]).toBe(255 * 1.4);
    expect(option.z[baseline.index.get('plants')!]).toBe(11184);
    expect(isBalanced(option)).toBe(true);
    // the extra 102 comes out of bacteria's other outputs or from more intake: something else moved
    const moved = option.fluxes.filter((f, k) => f.fleet === undefined && f.value !== baseline.fluxes[k].value);
    expect(moved.length).toBeGreaterThan(0);
  });

  it('lets a new fishery in as a pinned appended harvest flux, with no other new link', () => {
    const baseline = fishedCone();
    const option = leastChangeResponse(planOption(baseline, [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }]));
    expect(option.fluxes).toHaveLength(baseline.fluxes.length + 1);
    expect(option.fluxes.at(-1)).toMatchObject({ kind: 'export', fleet: 'net', value: 100 });
    baseline.fluxes.forEach((f, k) => expect(option.fluxes[k].value > 0).toBe(f.value > 0));
    expect(isBalanced(option)).toBe(true);
  });

  it('closing the fleet lands nothing and leaves a balanced, non-negative web', () => {
    const baseline = fishedCone();
    const option = leastChangeResponse(planOption(baseline, [{ type: 'close-fleet', fleet: 'sieve' }]));
    const b = baseline.index.get('bacteria')!;
    expect(option.catches[0][b]).toBe(0);
    expect(isBalanced(option)).toBe(true);
    expect(option.throughflow.every((t) => t >= 0)).toBe(true);
  });
});
