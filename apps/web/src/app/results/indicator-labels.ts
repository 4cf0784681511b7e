import { INDICATOR_NAMES, type ScalarIndicators } from '@seinework/contracts';

export type IndicatorKey = keyof ScalarIndicators;

export interface IndicatorLabel {
  /** From the one table of names in libs/contracts, so the result page, the compare page, discussions and briefs say the same. */
  readonly name: string;
  /** What the number means, in words a council member uses. */
  readonly meaning: string;
  /** How to show it: a share as a percentage, or a plain number with this many decimals. */
  readonly format: 'percent' | 'number';
  readonly decimals: number;
}

export const INDICATOR_LABELS: Record<IndicatorKey, IndicatorLabel> = {
  totalCatch: { name: INDICATOR_NAMES.totalCatch, meaning: 'everything the fleets land, in the web’s unit', format: 'number', decimals: 3 },
  meanTrophicLevelOfCatch: { name: INDICATOR_NAMES.meanTrophicLevelOfCatch, meaning: 'how high in the food web the catch is taken', format: 'number', decimals: 3 },
  primaryProductionRequiredShare: { name: INDICATOR_NAMES.primaryProductionRequiredShare, meaning: 'share of the plant and algal production that ends up supporting the catch', format: 'percent', decimals: 2 },
  primaryProductionRequired: { name: INDICATOR_NAMES.primaryProductionRequired, meaning: 'plant and algal production needed to sustain the catch', format: 'number', decimals: 2 },
  relativeAscendency: { name: INDICATOR_NAMES.relativeAscendency, meaning: 'how organised (constrained) the web is, 0–1', format: 'number', decimals: 4 },
  robustness: { name: INDICATOR_NAMES.robustness, meaning: 'balance between organisation and reserve; highest at the curve’s peak', format: 'number', decimals: 4 },
  finnCyclingIndex: { name: INDICATOR_NAMES.finnCyclingIndex, meaning: 'share of all throughflow that is recycled', format: 'percent', decimals: 2 },
  totalSystemThroughflow: { name: INDICATOR_NAMES.totalSystemThroughflow, meaning: 'all the material passing through the compartments', format: 'number', decimals: 1 },
  tst: { name: INDICATOR_NAMES.tst, meaning: 'every flow in the web added up, imports and losses included', format: 'number', decimals: 1 },
  developmentCapacity: { name: INDICATOR_NAMES.developmentCapacity, meaning: 'the most organisation the web could reach', format: 'number', decimals: 1 },
  ascendency: { name: INDICATOR_NAMES.ascendency, meaning: 'the organised part of the development capacity', format: 'number', decimals: 1 },
  overhead: { name: INDICATOR_NAMES.overhead, meaning: 'the reserve: redundancy and losses that let the web adapt', format: 'number', decimals: 1 },
  averageMutualInformation: { name: INDICATOR_NAMES.averageMutualInformation, meaning: 'how predictable the paths of flow are', format: 'number', decimals: 4 },
  flowDiversity: { name: INDICATOR_NAMES.flowDiversity, meaning: 'how evenly flow is spread over the links', format: 'number', decimals: 4 },
  effectiveRoles: { name: INDICATOR_NAMES.effectiveRoles, meaning: 'how many distinct roles the web effectively has', format: 'number', decimals: 3 },
  effectiveConnectance: { name: INDICATOR_NAMES.effectiveConnectance, meaning: 'links per compartment, weighted by flow', format: 'number', decimals: 3 },
};

/** The six a council member reads first, shown large as cards; every indicator follows in the full table. */
export const HEADLINE_KEYS: readonly IndicatorKey[] = ['totalCatch', 'meanTrophicLevelOfCatch', 'primaryProductionRequiredShare', 'robustness', 'relativeAscendency', 'finnCyclingIndex'];
