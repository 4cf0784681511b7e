import type { ComparedIndicator } from './options-api';

/** Every compared indicator's key: the scalar indicators and Fishing-in-Balance. */
export type IndicatorKey = ComparedIndicator['key'];

/** Plain names of the indicators, one table for the compare page and the briefs (published method names keep their usual names). */
export const INDICATOR_NAMES: Record<IndicatorKey, string> = {
  tst: 'Total system throughput',
  totalSystemThroughflow: 'Total system throughflow',
  developmentCapacity: 'Development capacity',
  ascendency: 'Ascendency',
  overhead: 'Overhead',
  averageMutualInformation: 'Average mutual information',
  flowDiversity: 'Flow diversity',
  relativeAscendency: 'Relative ascendency',
  robustness: 'Fitness (robustness)',
  effectiveRoles: 'Effective number of roles',
  effectiveConnectance: 'Effective connectance',
  finnCyclingIndex: 'Finn cycling index',
  totalCatch: 'Total catch',
  meanTrophicLevelOfCatch: 'Mean trophic level of the catch',
  primaryProductionRequired: 'Primary production required',
  primaryProductionRequiredShare: 'Share of primary production required',
  fishingInBalance: 'Fishing-in-Balance',
};
