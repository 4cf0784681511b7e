import type { RunDetail } from '@seinework/contracts';
import type { Band, ScenarioDocument } from './result-document';

/**
 * A small made-up scenario document for the tests (plants → grazer → fish, one fleet on the fish):
 * only the keys the result page reads, with numbers chosen so each rule is visible.
 */
export function fixtureDocument(bands: Partial<Record<string, Band>> | null = {}): ScenarioDocument {
  const analysis = (scale: number) => ({
    unit: 'g C m-2 y-1',
    tst: 100 * scale, totalSystemThroughflow: 80 * scale, developmentCapacity: 300, ascendency: 120, overhead: 180,
    averageMutualInformation: 1.2, flowDiversity: 2.5, relativeAscendency: 0.3 + 0.01 * scale, robustness: 0.36,
    effectiveRoles: 2.1, effectiveConnectance: 1.4, finnCyclingIndex: 0.05, totalCatch: 2 * scale,
    meanTrophicLevelOfCatch: 3, primaryProductionRequired: 20, primaryProductionRequiredShare: 0.2,
    finnCycledToStraightRatio: 0.053,
    fitness: { relativeAscendency: 0.3, robustness: 0.36, shareOfPeak: 0.98, side: 'flexibility' },
    trophicLevels: { plants: 1, grazer: 2, fish: 3 + 0.1 * (scale - 1) },
    totalDependency: {
      plants: { plants: 0, grazer: 1, fish: 0.9 + 0.05 * (scale - 1) },
      grazer: { plants: 0, grazer: 0, fish: 0.5 - 0.2 * (scale - 1) },
      fish: { plants: 0, grazer: 0.01 * scale, fish: 0 },
    },
    mixedTrophicImpact: { Trawl: { plants: 0.1, grazer: 0.2, fish: -0.5 * scale } },
    fleets: { Trawl: { catch: 2 * scale, meanTrophicLevelOfCatch: 3, primaryProductionRequired: 20, tonnes: 900 * scale, value: 1000 * scale } },
    trophicLadder: {
      levels: [
        { level: 1, input: 50, passedOn: 10, returnedToDetritus: 0, respired: 40, exported: 0, harvested: 0, efficiency: 0.2 },
        { level: 2, input: 10, passedOn: 1 * scale, returnedToDetritus: 2, respired: 7, exported: 0, harvested: 0, efficiency: 0.1 * scale },
        ...(scale > 1 ? [{ level: 3, input: 1, passedOn: 0, returnedToDetritus: 0, respired: 1, exported: 0, harvested: 1, efficiency: 0 }] : []),
      ],
      shares: {},
      meanEfficiency: 0.1,
    },
    cycles: { count: 1, capped: false, nexuses: [{ weakArc: { from: 'fish', to: 'grazer', value: 0.5 }, cycles: [['grazer', 'fish']] }], cycledFlow: {}, acyclicFlow: {} },
    warnings: [],
  });
  const baseline = analysis(1);
  const option = analysis(2);
  return {
    baseline,
    option,
    difference: {
      ...Object.fromEntries(Object.entries(option).map(([k, v]) => [k, typeof v === 'number' ? v - ((baseline as Record<string, unknown>)[k] as number) : v])),
      totalDependency: {
        plants: { plants: 0, grazer: 0, fish: 0.05 },
        grazer: { plants: 0, grazer: 0, fish: -0.2 },
        fish: { plants: 0, grazer: 0.01, fish: 0 },
      },
      fleets: { Trawl: { catch: 2, fishingInBalance: 0.3 } },
    },
    web: {
      name: 'Test bay — option',
      unit: 'g C m-2 y-1',
      compartments: [
        { id: 'plants', name: 'Plants', kind: 'producer' },
        { id: 'grazer', name: 'Grazer', kind: 'consumer' },
        { id: 'fish', name: 'Fish', kind: 'consumer' },
      ],
      flows: [],
      imports: [],
      exports: [],
      respiration: [],
    },
    ...(bands === null
      ? {}
      : { uncertainty: { draws: 100, succeeded: 100, failed: 0, cv: 0.25, seed: 7, indicators: Object.fromEntries(Object.entries(bands).map(([k, difference]) => [k, { baseline: difference, option: difference, difference, shareDifferencePositive: 0.5, robust: false }])) } }),
  } as unknown as ScenarioDocument;
}

export function fixtureRun(status: RunDetail['status'], result?: ScenarioDocument): RunDetail {
  return {
    id: 'run-1',
    optionId: 'option-1',
    status,
    progress: { done: status === 'done' ? 100 : 40, total: 100 },
    draws: 100,
    cv: 0.25,
    seed: 7,
    engineVersion: 'seinework test',
    createdBy: 'Ana',
    createdAt: '2026-01-01T00:00:00Z',
    startedAt: '2026-01-01T00:00:01Z',
    finishedAt: status === 'done' ? '2026-01-01T00:00:05Z' : null,
    error: status === 'failed' ? 'the option web could not be balanced' : null,
    inputs: { webId: 'web-1', versionId: 'version-1', option: { name: 'Halve the trawl', response: 'bottom-up', adjustments: [{ type: 'scale-catch', fleet: 'Trawl', compartment: 'fish', percent: -50 }] }, uncertainty: null },
    timings: null,
    ...(result ? { result } : {}),
  } as RunDetail;
}
