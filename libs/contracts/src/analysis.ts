/**
 * The analysis document of METHODS.md §11 (`npm run analyze`): every index for a balanced web,
 * as plain JSON keyed by compartment id (fleets by name). Scalars first, then maps.
 */

export type ById<T> = Record<string, T>;
export type Matrix2<T = number> = Record<string, Record<string, T>>;

export interface ScalarIndicators {
  /** T.. — total system throughput, the sum of every entry of the extended matrix X (Ulanowicz 1986). */
  tst: number;
  /** Σ_j T_j — total system throughflow, the sum of compartment throughflows (Finn 1976). */
  totalSystemThroughflow: number;
  developmentCapacity: number;
  ascendency: number;
  overhead: number;
  averageMutualInformation: number;
  flowDiversity: number;
  relativeAscendency: number;
  robustness: number;
  effectiveRoles: number;
  effectiveConnectance: number;
  finnCyclingIndex: number;
  totalCatch: number;
  /** null when there is no catch. */
  meanTrophicLevelOfCatch: number | null;
  primaryProductionRequired: number;
  /** null when the web has no primary production. */
  primaryProductionRequiredShare: number | null;
}

/** Keys of the scalar indicators, in the order of METHODS.md §11. */
export const SCALAR_INDICATORS = [
  'tst',
  'totalSystemThroughflow',
  'developmentCapacity',
  'ascendency',
  'overhead',
  'averageMutualInformation',
  'flowDiversity',
  'relativeAscendency',
  'robustness',
  'effectiveRoles',
  'effectiveConnectance',
  'finnCyclingIndex',
  'totalCatch',
  'meanTrophicLevelOfCatch',
  'primaryProductionRequired',
  'primaryProductionRequiredShare',
] as const satisfies readonly (keyof ScalarIndicators)[];

export interface FleetSummary {
  catch: number;
  meanTrophicLevelOfCatch: number | null;
  primaryProductionRequired: number;
  /** Tonnes per year, where the web gives areaKm2 and tonnesPerUnit. */
  tonnes: number | null;
  /** tonnes × price, where prices are given. */
  value: number | null;
}

export interface LadderLevelRow {
  level: number;
  input: number;
  passedOn: number;
  returnedToDetritus: number;
  respired: number;
  /** Exports other than harvest. */
  exported: number;
  harvested: number;
  /** passedOn / input; null where the level has no input. */
  efficiency: number | null;
}

export interface NexusRow {
  weakArc: { from: string; to: string; value: number };
  cycles: string[][];
}

export interface Analysis extends ScalarIndicators {
  unit: string;
  /** Finn's secondary form TST_c / (TST − TST_c): cycled against straight-through throughflow (Finn 1976). */
  finnCycledToStraightRatio: number;
  overheadParts: { imports: number; exports: number; respiration: number; redundancy: number };
  fitness: {
    relativeAscendency: number;
    robustness: number;
    /** F / (1/e): 1 at the peak of the fitness curve. */
    shareOfPeak: number;
    /** Which side of the peak: more flexibility than constraint, or more constraint than flexibility. */
    side: 'flexibility' | 'constraint' | 'peak';
  };
  totalCatchTonnes: number | null;
  totalCatchValue: number | null;
  ruleOfThumbPrimaryProductionRequired: number | null;
  trophicLevels: ById<number>;
  cycledThroughflow: ById<number>;
  primaryProductionIntensity: ById<number | null>;
  totalDependency: Matrix2;
  allPathwayDependency: Matrix2;
  totalContribution: Matrix2;
  mixedTrophicImpact: Matrix2;
  keystoneness: ById<number | null> | null;
  robustnessGradient: Matrix2;
  fleets: Record<string, FleetSummary>;
  trophicLadder: { levels: LadderLevelRow[]; shares: ById<number[]>; meanEfficiency: number | null };
  /** null when the cycle analysis was left out on request (never from the CLI). */
  cycles: {
    count: number;
    capped: boolean;
    nexuses: NexusRow[];
    cycledFlow: Matrix2;
    acyclicFlow: Matrix2;
  } | null;
  /** Cautions about the data, e.g. a consumer with no internal intake placed at level 2. */
  warnings: string[];
}
