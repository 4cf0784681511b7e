import type { HarvestOption, Web } from '@seinework/contracts';
import { optionUncertainty } from '@seinework/harvest-options';
import cone from '../../../tests/fixtures/cone-spring.json';
import detritivoreFishery from '../../../tests/fixtures/cone-spring-detritivore-fishery.json';
import { createDrawPool } from './draw-pool';

const newFishery = detritivoreFishery as HarvestOption;

describe('createDrawPool (worker threads for uncertainty draws)', () => {
  it('gives the same summary bit for bit as drawing in process, whatever the chunking, and reports progress', async () => {
    const settings = { draws: 24, cv: 0.15, seed: 2024 };
    const inProcess = await optionUncertainty(cone as Web, newFishery, settings);
    const pool = createDrawPool(2);
    try {
      expect(pool.workers).toBe(2);
      const progress: number[] = [];
      const onWorkers = await optionUncertainty(cone as Web, newFishery, settings, { pool, chunkSize: 5, onProgress: (done) => progress.push(done) });
      expect(onWorkers).toEqual(inProcess);
      expect(progress).toHaveLength(5);
      expect(progress.at(-1)).toBe(24);
      expect(progress).toEqual([...progress].sort((a, b) => a - b));
      expect(await optionUncertainty(cone as Web, newFishery, settings, { pool, chunkSize: 7 })).toEqual(inProcess);
      expect(await optionUncertainty(cone as Web, newFishery, settings, { pool })).toEqual(inProcess);
    } finally {
      await pool.destroy();
    }
  });
});
