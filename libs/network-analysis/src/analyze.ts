import type { Analysis, ById, Matrix2, ScalarIndicators, Web } from '@seinework/contracts';
import { requireAnalysable } from './balance-check';
import { cycleAnalysis } from './cycle-removal';
import type { CycleLimits } from './cycles';
import { finnCycling } from './finn-cycling-index';
import { fisheryIndicators } from './fishery-indicators';
import { informationIndices } from './information-indices';
import { mixedTrophicImpact } from './mixed-trophic-impact';
import { createNetwork, parseWeb, type Network } from './network';
import { idMap } from './id-map';
import { fitnessPosition, robustnessGradient } from './robustness';
import { dependencies } from './total-dependency';
import { trophicLadder } from './trophic-ladder';
import { trophicLevels } from './trophic-levels';

/**
 * Composes every method of METHODS.md §1–§6 and §9 into the analysis document of §11.
 * Numbers are never rounded here; maps are keyed by compartment id and fleets by name, as
 * null-prototype objects (id-map.ts) so that no id can reach a prototype.
 */

export interface AnalyzeOptions {
  /**
   * Caps on simple-cycle enumeration (count and time; see cycles.ts for the defaults), or false to
   * leave the cycle analysis out (`cycles: null`) where only the other indices are wanted.
   */
  readonly cycles?: CycleLimits | false;
}

export function analyze(network: Network, options: AnalyzeOptions = {}): Analysis {
  requireAnalysable(network);
  const ids = network.ids;
  const information = informationIndices(network);
  const levels = trophicLevels(network);
  const fishery = fisheryIndicators(network, levels.levels);
  const dependency = dependencies(network);
  const cycling = finnCycling(network, dependency.passesThrough);
  const impact = mixedTrophicImpact(network);
  const ladder = trophicLadder(network, { levelsChecked: true });
  const cycles = options.cycles === false ? null : cycleAnalysis(network, options.cycles);
  const existingFlows = (matrix: number[][]) => byFlow(network, matrix);

  return {
    ...scalarsFrom(network, information, cycling.finnCyclingIndex, fishery),
    unit: network.unit,
    finnCycledToStraightRatio: cycling.cycledToStraightRatio,
    overheadParts: information.overheadParts,
    fitness: fitnessPosition(information.relativeAscendency),
    totalCatchTonnes: fishery.totalTonnes,
    totalCatchValue: fishery.totalValue,
    ruleOfThumbPrimaryProductionRequired: fishery.ruleOfThumbPrimaryProductionRequired,
    trophicLevels: byId(ids, levels.levels),
    cycledThroughflow: byId(ids, cycling.cycledThroughflow),
    primaryProductionIntensity: byId(ids, fishery.primaryProductionIntensity),
    totalDependency: square(ids, ids, dependency.total),
    allPathwayDependency: square(ids, ids, dependency.allPathway),
    totalContribution: square(ids, ids, dependency.totalContribution),
    mixedTrophicImpact: square(impact.ids, impact.ids, impact.total),
    keystoneness: impact.keystoneness === null ? null : byId(ids, impact.keystoneness),
    robustnessGradient: existingFlows(robustnessGradient(network)),
    fleets: idMap(
      Object.entries(fishery.fleets).map(([fleet, f]) => [
        fleet,
        {
          catch: f.catch,
          meanTrophicLevelOfCatch: f.meanTrophicLevelOfCatch,
          primaryProductionRequired: f.primaryProductionRequired,
          tonnes: f.tonnes,
          value: f.value,
        },
      ]),
    ),
    trophicLadder: {
      levels: ladder.levels,
      shares: byId(ids, ladder.shares),
      meanEfficiency: ladder.meanEfficiency,
    },
    cycles: cycles && {
      count: cycles.count,
      capped: cycles.capped,
      nexuses: cycles.nexuses.map((nexus) => ({
        weakArc: { from: ids[nexus.weakArc.from], to: ids[nexus.weakArc.to], value: nexus.weakArc.value },
        cycles: nexus.cycles.map((cycle) => cycle.map((i) => ids[i])),
      })),
      cycledFlow: existingFlows(cycles.cycledFlow),
      acyclicFlow: existingFlows(cycles.acyclicFlow),
    },
    warnings: levels.warnings,
  };
}

/** The sixteen scalar indicators only — no cycle enumeration and no n×n maps: for Monte Carlo draws. */
export function scalarIndicators(network: Network): ScalarIndicators {
  requireAnalysable(network);
  const levels = trophicLevels(network);
  return scalarsFrom(
    network,
    informationIndices(network),
    finnCycling(network).finnCyclingIndex,
    fisheryIndicators(network, levels.levels),
  );
}

/** Parses, checks and analyses a WEB.json value; throws WebError on any problem. */
export function analyzeWeb(input: unknown | Web, options?: AnalyzeOptions): Analysis {
  return analyze(createNetwork(parseWeb(input)), options);
}

function scalarsFrom(
  network: Network,
  information: ReturnType<typeof informationIndices>,
  finnCyclingIndex: number,
  fishery: ReturnType<typeof fisheryIndicators>,
): ScalarIndicators {
  return {
    tst: information.tst,
    totalSystemThroughflow: network.throughflow.reduce((sum, t) => sum + t, 0),
    developmentCapacity: information.developmentCapacity,
    ascendency: information.ascendency,
    overhead: information.overhead,
    averageMutualInformation: information.averageMutualInformation,
    flowDiversity: information.flowDiversity,
    relativeAscendency: information.relativeAscendency,
    robustness: information.robustness,
    effectiveRoles: information.effectiveRoles,
    effectiveConnectance: information.effectiveConnectance,
    finnCyclingIndex,
    totalCatch: fishery.totalCatch,
    meanTrophicLevelOfCatch: fishery.meanTrophicLevelOfCatch,
    primaryProductionRequired: fishery.primaryProductionRequired,
    primaryProductionRequiredShare: fishery.primaryProductionRequiredShare,
  };
}

function byId<T>(ids: readonly string[], values: readonly T[]): ById<T> {
  return idMap(ids.map((id, i) => [id, values[i]]));
}

function square(rows: readonly string[], columns: readonly string[], matrix: readonly (readonly number[])[]): Matrix2 {
  return idMap(rows.map((row, i) => [row, idMap(columns.map((column, j) => [column, matrix[i][j]]))]));
}

/** Only the entries of internal flows that exist in the web (T_ij > 0), keyed from → to. */
function byFlow(network: Network, matrix: readonly (readonly number[])[]): Matrix2 {
  const result: Matrix2 = idMap();
  network.T.forEach((row, i) =>
    row.forEach((flow, j) => {
      if (flow > 0) (result[network.ids[i]] ??= idMap())[network.ids[j]] = matrix[i][j];
    }),
  );
  return result;
}
