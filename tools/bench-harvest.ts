import type { Adjustment } from '@seinework/contracts';
import { createDrawPool } from '@seinework/draw-pool';
import { applyOption, harvestSensitivity, optionUncertainty } from '@seinework/harvest-options';
import { createNetwork } from '@seinework/network-analysis';
import { generateWeb } from '../libs/network-analysis/src/testing/generated-web';

/**
 * Harvest-option timings for `npm run bench`, against the targets the product set: medians of repeated in-process runs
 * after a warm-up, on generated 50-compartment webs. Draws run on a warm worker pool, as on the
 * server, which keeps one; a second row shows a one-off run that starts and stops its own pool (the CLI).
 */

export interface HarvestBenchmark {
  readonly name: string;
  readonly medianMs: number;
  /** The target, where there is one. */
  readonly limitMs?: number;
}

async function medianMs(run: () => unknown, repeats: number): Promise<number> {
  await run();
  const times: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const start = performance.now();
    await run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export async function harvestBenchmarks(): Promise<HarvestBenchmark[]> {
  const web = generateWeb({ compartments: 50, seed: 50, fleets: 3 });
  const network = createNetwork(web);
  const catches = web.exports.filter((e) => e.fleet !== undefined);
  const adjustments: Adjustment[] = [
    { type: 'scale-catch', fleet: catches[0].fleet!, compartment: catches[0].from, percent: -30 },
    { type: 'set-catch', fleet: catches[1].fleet!, compartment: catches[1].from, amount: catches[1].value * 1.2 },
  ];
  const option = { response: 'bottom-up' as const, adjustments };

  // a 50-compartment web with 20 catches: every consumer but a few landed by one of four fleets
  const fished = generateWeb({ compartments: 50, seed: 51, fleets: 4 });
  const consumers = fished.compartments.filter((c) => c.kind === 'consumer').map((c) => c.id);
  const landed = new Set(fished.exports.filter((e) => e.fleet !== undefined).map((e) => e.from));
  for (const id of consumers) {
    if (landed.size >= 20) break;
    if (landed.has(id)) continue;
    const respiration = fished.respiration.find((r) => r.from === id)!;
    fished.exports.push({ from: id, value: respiration.value * 0.1, fleet: `fleet-${(landed.size % 4) + 1}` });
    respiration.value *= 0.9;
    landed.add(id);
  }
  const fishedNetwork = createNetwork(fished);
  const catchCount = fishedNetwork.fluxes.filter((f) => f.fleet !== undefined && f.value > 0).length;

  const settings = { draws: 1000, cv: 0.2, seed: 1 };
  const pool = createDrawPool();
  const warm = await medianMs(() => optionUncertainty(web, option, settings, { pool }), 3);
  await pool.destroy();
  const cold = await medianMs(async () => {
    const own = createDrawPool();
    try {
      return await optionUncertainty(web, option, settings, { pool: own });
    } finally {
      await own.destroy();
    }
  }, 1);

  return [
    { name: 'harvest option (bottom-up), 50 compartments', medianMs: await medianMs(() => applyOption(network, option), 21), limitMs: 10 },
    { name: `1,000 uncertainty draws, ${pool.workers} workers (warm pool), 50 compartments`, medianMs: warm, limitMs: 5000 },
    { name: '1,000 uncertainty draws, pool started and stopped per run', medianMs: cold },
    {
      name: `harvest sensitivity, ${catchCount} catches, 50 compartments`,
      medianMs: await medianMs(() => harvestSensitivity(fishedNetwork), 3),
      limitMs: 2000,
    },
  ];
}
