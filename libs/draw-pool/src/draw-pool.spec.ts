import type { HarvestOption, Web } from '@seinework/contracts';
import { optionUncertainty, runDraws } from '@seinework/harvest-options';
import cone from '../../../tests/fixtures/cone-spring.json';
import detritivoreFishery from '../../../tests/fixtures/cone-spring-detritivore-fishery.json';
import { createDrawPool } from './draw-pool';
import { isAbortError, QueueFullError } from './worker-pool';

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

  it('runs a chunk given as JSON text exactly as the same chunk given as a web', async () => {
    const pool = createDrawPool(1);
    try {
      const job = { option: newFishery, cv: 0.2, seed: 5, start: 3, end: 9 };
      expect(await pool.runSerialised({ ...job, webJson: JSON.stringify(cone) })).toEqual(runDraws({ ...job, web: cone as Web }));
    } finally {
      await pool.destroy();
    }
  });

  it('refuses a chunk past its queue with QueueFullError, and drops a request’s chunks when its signal aborts', async () => {
    const pool = createDrawPool(1, { maxQueue: 3 });
    try {
      const job = { webJson: JSON.stringify(cone), option: newFishery, cv: 0.1, seed: 1 };
      const request = new AbortController();
      const accepted = [0, 1, 2, 3].map((k) => pool.runSerialised({ ...job, start: k * 200, end: (k + 1) * 200 }, request.signal));
      await expect(pool.runSerialised({ ...job, start: 0, end: 1 })).rejects.toBeInstanceOf(QueueFullError);
      expect(pool.queueSize).toBe(3);
      request.abort();
      const outcomes = await Promise.allSettled(accepted);
      expect(outcomes.every((o) => o.status === 'rejected' && isAbortError(o.reason))).toBe(true);
      expect(pool.queueSize).toBe(0);
      expect(pool.finished).toBe(0);
      // the pool still works after its running chunk's worker was stopped
      expect(await pool.runSerialised({ ...job, start: 0, end: 2 })).toHaveLength(2);
    } finally {
      await pool.destroy();
    }
  });
});
