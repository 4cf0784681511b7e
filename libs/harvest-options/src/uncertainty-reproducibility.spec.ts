import { createHash } from 'node:crypto';
import type { HarvestOption, Web } from '@seinework/contracts';
import brannockBay from '../../../seeds/brannock-bay.json';
import closeSetGillnet from '../../../seeds/options/close-set-gillnet.json';
import filterFeederDredge from '../../../seeds/options/filter-feeder-dredge.json';
import forageFishQuotaCut from '../../../seeds/options/forage-fish-quota-cut.json';
import raiseMidwaterPredatorQuota from '../../../seeds/options/raise-midwater-predator-quota.json';
import { generateWeb } from '../../network-analysis/src/testing/generated-web';
import { runOption } from './run-option';
import { runDraws } from './uncertainty-draw';
import { optionUncertainty } from './uncertainty';

/**
 * Regression check of reproducibility (issue 8: "the same inputs and seed always give the same
 * result, bit for bit"). The expected digests and numbers below were produced by the engine at
 * commit 76a78dc, BEFORE the draw loop was made faster; every later speed-up must leave them
 * unchanged. A digest is SHA-256 of the JSON of the result with -0 and non-finite numbers spelled
 * out, so one changed bit of any number changes it. If a deliberate change of METHODS.md's
 * formulas moves them, regenerate them and say so in the commit.
 */

function digest(value: unknown): string {
  const exact = JSON.stringify(value, (_key, x) =>
    typeof x === 'number' && (Object.is(x, -0) || !Number.isFinite(x)) ? `number:${Object.is(x, -0) ? '-0' : x}` : x,
  );
  return createHash('sha256').update(exact).digest('hex');
}

const web = brannockBay as Web;
const seedOptions = {
  'forage-fish-quota-cut': forageFishQuotaCut,
  'close-set-gillnet': closeSetGillnet,
  'filter-feeder-dredge': filterFeederDredge,
  'raise-midwater-predator-quota': raiseMidwaterPredatorQuota,
} as Record<string, HarvestOption>;

const expectedOnBrannockBay: Record<string, { summary: string; draws: string; run: string }> = {
  'forage-fish-quota-cut': {
    summary: '1af1b2e593893690a8a6fb69866fd38bf89a7867dc54e282f55c8156d6352094',
    draws: 'ab977400afb87dc684e4dfc796720b43891fd3207baf074d83ad9117e0b15993',
    run: 'df6c20eee2f751c78544f29e67ae2bf725292e4f660bc33a4e10f2769a69b74c',
  },
  'close-set-gillnet': {
    summary: '272a3033b69f12272f91e3e23b74408c49063801dea23f19a1c0b6cd7418dea2',
    draws: '15f4b28bf28d567ab92c2aa0643f838cf47ab9a3e6e1822cfef5c1ecd871ffe1',
    run: '79e0ea018c65380051b36dec8811abb199a2823fb4fdba1534cbac3faf009618',
  },
  'filter-feeder-dredge': {
    summary: '8af56063a105efb501442ca002ae0d1ff8c1ea095f1ae0a3a090d39932cf71ac',
    draws: 'fd7c2fad9b0b54428c3766e280b2da98adede5af4674a5e69fc261e10eb411c2',
    run: 'f27f84db6c3b2ab2e724d6eeec53ff1e4b89f27647b6b6c76376d15862e22991',
  },
  'raise-midwater-predator-quota': {
    summary: '663af424b655e8370b3ac8671f3cd0f60d500655f1b45e6c58d7b43551d38df6',
    draws: 'afbbf1496720aef10a9cf44883d9d417ea059e1c1cc82a0f4e989f2a906ab702',
    run: '1e6aa4567fe0aeb94939541c195119b43a6fc2c1b3b24cd83755cb3cb02c49fa',
  },
};

describe('uncertainty draws are reproducible bit for bit (regression check against the engine at 76a78dc)', () => {
  for (const [name, option] of Object.entries(seedOptions)) {
    it(`Brannock Bay, ${name}: summary of 200 draws, 100 draws one by one, deterministic run`, async () => {
      const spec = { response: option.response, adjustments: option.adjustments };
      const summary = await optionUncertainty(web, spec, { draws: 200, cv: 0.25, seed: 20261202 });
      expect(summary.failed).toBe(0);
      expect({
        summary: digest(summary),
        draws: digest(runDraws({ web, option: spec, cv: 0.3, seed: 7, start: 0, end: 100 })),
        run: digest(runOption(web, option)),
      }).toEqual(expectedOnBrannockBay[name]);
    });
  }

  it('Brannock Bay, the forage-fish quota cut: ascendency and total catch bands, number by number', async () => {
    const summary = await optionUncertainty(web, forageFishQuotaCut as HarvestOption, { draws: 200, cv: 0.25, seed: 20261202 });
    expect(summary.indicators.ascendency).toEqual({
      baseline: { median: 2431.0962892746647, p5: 2211.475497152556, p95: 2598.797009064202 },
      option: { median: 2432.8377249067207, p5: 2213.1504902473607, p95: 2600.1969977546373 },
      difference: { median: 1.5874580936590519, p5: 1.3995751010776758, p95: 1.8763721974022238 },
      shareDifferencePositive: 1,
      robust: true,
    });
    expect(summary.indicators.totalCatch).toEqual({
      baseline: { median: 3.3263459268875017, p5: 3.08303493283678, p95: 3.576852470343211 },
      option: { median: 2.843100036181598, p5: 2.639440811713866, p95: 3.0758464212971455 },
      difference: { median: -0.48072979741986877, p5: -0.5473747357760099, p95: -0.4079136480796783 },
      shareDifferencePositive: 0,
      robust: true,
    });
  });

  it('Brannock Bay, a dredge catch beyond what some draws can supply: the refused draws and their messages', async () => {
    const option = { response: 'bottom-up' as const, adjustments: [{ type: 'open-fishery' as const, fleet: 'Shellfish dredge', compartment: 'filter-feeders', amount: 45 }] };
    const summary = await optionUncertainty(web, option, { draws: 100, cv: 0.4, seed: 5 });
    expect(summary.failed).toBe(2);
    expect(summary.succeeded).toBe(98);
    expect(digest(summary)).toBe('eb5bd122e6dd9107d93a3d681af7c02c1fb239da0e7b747b9dee160970ef0349');
  });

  for (const response of ['bottom-up', 'least-change'] as const) {
    it(`a generated 30-compartment web, ${response}, a cut catch and a new fishery: summary of 60 draws, 20 draws one by one`, async () => {
      const generated = generateWeb({ compartments: 30, seed: 30, fleets: 3 });
      const landed = generated.exports.find((e) => e.fleet !== undefined)!;
      const option: HarvestOption = {
        name: 'generated',
        response,
        adjustments: [
          { type: 'scale-catch', fleet: landed.fleet!, compartment: landed.from, percent: -30 },
          { type: 'open-fishery', fleet: 'new-fleet', compartment: generated.compartments.at(-1)!.id, amount: 0.01 },
        ],
      };
      expect({
        summary: digest(await optionUncertainty(generated, option, { draws: 60, cv: 0.3, seed: 99 })),
        draws: digest(runDraws({ web: generated, option, cv: 0.2, seed: 3, start: 10, end: 30 })),
      }).toEqual(expectedOnGenerated[response]);
    });
  }
});

const expectedOnGenerated: Record<string, { summary: string; draws: string }> = {
  'bottom-up': {
    summary: '5f59a8fb762bafaa3397f40ae9d6688fe35cae1654dcaddc01dc2af16454d90c',
    draws: 'e1908b45ca6ffb4a716c42b1538bfb16afed18e3e9711889879b36477eff7db6',
  },
  'least-change': {
    summary: '00e06097cc0e3033bd9e03613d69e056035dafa1b6426b730d11f5e36c88702b',
    draws: 'd20c225726304b9f98df9f754a6732985dd92693175620451c7632cfaa2a48ba',
  },
};
