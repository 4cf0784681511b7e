import type { Comparison, ComparedIndicator } from '@seinework/contracts';

/** A small comparison of two runs for the component tests, shaped as the server answers. */

const band = (p5: number, p95: number) => ({ p5, median: (p5 + p95) / 2, p95 });

export const INDICATORS: ComparedIndicator[] = [
  {
    key: 'relativeAscendency',
    baseline: 0.3437,
    values: [
      { runId: 'r1', after: 0.3439, difference: 0.0002, band: band(0.0001, 0.0003), exceedsUncertainty: true },
      { runId: 'r2', after: 0.3436, difference: -0.0001, band: band(-0.0003, 0.0001), exceedsUncertainty: false },
    ],
  },
  {
    key: 'totalCatch',
    baseline: 3.35,
    values: [
      { runId: 'r1', after: 2.87, difference: -0.48, band: band(-0.56, -0.4), exceedsUncertainty: true },
      { runId: 'r2', after: 3.46, difference: 0.11, band: band(0.09, 0.13), exceedsUncertainty: true },
    ],
  },
  {
    key: 'tst',
    baseline: 1623.3,
    values: [
      { runId: 'r1', after: 1623.6, difference: 0.35, band: band(0.26, 0.46), exceedsUncertainty: true },
      { runId: 'r2', after: 1623.1, difference: -0.18, band: band(-0.23, 0.02), exceedsUncertainty: false },
    ],
  },
  {
    key: 'fishingInBalance',
    baseline: null,
    values: [
      { runId: 'r1', after: null, difference: -0.027, band: null, exceedsUncertainty: false },
      { runId: 'r2', after: null, difference: 0.035, band: null, exceedsUncertainty: false },
    ],
  },
];

const run = (id: string, optionId: string, optionName: string) => ({
  id,
  optionId,
  status: 'done' as const,
  progress: { done: 500, total: 500 },
  draws: 500,
  cv: 0.25,
  seed: 7,
  engineVersion: 'test',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  startedAt: '2026-03-01T10:00:01Z',
  finishedAt: '2026-03-01T10:00:05Z',
  error: null,
  optionName,
  webId: 'w1',
  versionId: 'v1',
});

export const COMPARISON: Comparison = {
  runs: [run('r1', 'o1', 'Cut the forage-fish quota'), run('r2', 'o2', 'Close the gillnets')],
  indicators: INDICATORS,
  preferences: [],
};
