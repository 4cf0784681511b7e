import type { Analysis, ScalarIndicators, Web } from '@seinework/contracts';

/**
 * The run's result as the `scenario` command prints it (METHODS.md §11): the baseline and option
 * analyses, their difference, the balanced option web and, when draws were run, the uncertainty.
 */
export interface Band {
  readonly p5: number;
  readonly median: number;
  readonly p95: number;
}

export interface IndicatorUncertainty {
  readonly baseline: Band;
  readonly option: Band;
  readonly difference: Band;
  readonly shareDifferencePositive: number;
  readonly robust: boolean;
}

export interface RunUncertainty {
  /** Keys whose difference band excludes zero, as the engine judged it. */
  readonly robustDifferences?: readonly string[];
  readonly draws: number;
  readonly succeeded: number;
  readonly failed: number;
  readonly cv: number;
  readonly seed: number;
  readonly indicators: Partial<Record<keyof ScalarIndicators, IndicatorUncertainty>>;
}

/** The difference document: the analysis keys as option − baseline, plus Fishing-in-Balance. */
export type Difference = Omit<Analysis, 'fleets' | 'unit' | 'fitness' | 'warnings' | 'cycles'> & {
  fishingInBalance: number | null;
  fleets: Record<string, Analysis['fleets'][string] & { fishingInBalance: number | null }>;
};

export interface ScenarioDocument {
  readonly baseline: Analysis;
  readonly option: Analysis;
  readonly difference: Difference;
  readonly web: Web;
  readonly uncertainty?: RunUncertainty;
}

/**
 * A difference is robust when its 5–95 % band lies wholly on one side of zero: nine draws in ten or
 * more agree on its direction. A band touching zero is not robust.
 */
export function bandExcludesZero(band: Pick<Band, 'p5' | 'p95'> | null | undefined): boolean {
  if (!band) return false;
  return band.p5 > 0 || band.p95 < 0;
}

/** `POST /api/options/sensitivity` with `{ web, response }`: each catch's effect per +1 % (libs/harvest-options, harvest-sensitivity.ts). */
export interface CatchSensitivity {
  readonly fleet: string;
  readonly compartment: string;
  readonly catch: number;
  readonly perPercent: Partial<Record<keyof ScalarIndicators, number | null>> | null;
  readonly distanceFromPeakChange: number | null;
  readonly catchValueChange: number | null;
  readonly refused?: string;
}

export interface HarvestSensitivity {
  readonly response: string;
  readonly rows: CatchSensitivity[];
  readonly byRobustness: CatchSensitivity[];
  readonly byCatchValue: CatchSensitivity[];
}
