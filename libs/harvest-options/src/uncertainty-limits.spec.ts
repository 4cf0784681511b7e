import { FLOW_CV_LIMITS, webSchema, type Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork } from '@seinework/network-analysis';
import type { OptionSpec } from './apply-option';
import { optionUncertainty, type UncertaintySummary } from './uncertainty';
import { runDraw } from './uncertainty-draw';

/**
 * Uncertainty draws of a web whose flow cvs sit at or beyond the schema's bound: the run always
 * finishes with a summary (draws least change cannot balance are counted as failures with their
 * reason) and never holds a number that is not finite.
 */

const newFishery: OptionSpec = { response: 'least-change', adjustments: [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 50 }] };

function coneWithFlowCv(cv: number): Web {
  const web = structuredClone(cone) as Web;
  web.flows[0].cv = cv;
  return web;
}

function numbersIn(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (typeof value === 'object' && value !== null) return Object.values(value).flatMap(numbersIn);
  return [];
}

function expectWhole(summary: UncertaintySummary, draws: number): void {
  expect(summary.succeeded + summary.failed).toBe(draws);
  expect(summary.failures.length).toBe(Math.min(5, summary.failed));
  for (const v of numbersIn(summary)) expect(Number.isFinite(v)).toBe(true);
}

describe('uncertainty with extreme flow cvs', () => {
  it('cv 1e6 on one flow: refused by the schema; given to the engine anyway, every draw is counted and no number is lost', async () => {
    expect(webSchema.safeParse(coneWithFlowCv(1e6)).success).toBe(false);
    // draw 35 of seed 2 is a web whose normal equations lose their pivot (once a bare Error, a 500)
    const summary = await optionUncertainty(coneWithFlowCv(1e6), { ...newFishery, response: 'bottom-up' }, { draws: 40, cv: 0.25, seed: 2 });
    expectWhole(summary, 40);
    const drawn = runDraw(createNetwork(coneWithFlowCv(1e6)), { option: { ...newFishery, response: 'bottom-up' }, cv: 0.25, seed: 2 }, 35);
    expect(drawn).toEqual({ draw: 35, failure: expect.stringMatching(/^least-change balancing cannot solve for compartment "\w+": .*flow "plants" → "detritus"/) });
    expect(summary.failed).toBeGreaterThan(0);
    expect(summary.failures[0]).toMatch(/^draw \d+: .*least-change balancing .*compartment "(plants|detritus)"/);
  });

  it('cv 10 (the bound) on one flow: a summary with finite bands', async () => {
    expect(webSchema.safeParse(coneWithFlowCv(FLOW_CV_LIMITS.max)).success).toBe(true);
    const summary = await optionUncertainty(coneWithFlowCv(FLOW_CV_LIMITS.max), newFishery, { draws: 40, cv: 0.2, seed: 3 });
    expectWhole(summary, 40);
    expect(summary.indicators.tst.difference).not.toBeNull();
  });
});
