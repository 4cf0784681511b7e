import {
  CYCLES_LISTED_PER_NEXUS,
  LARGE_ANALYSIS_TABLES,
  LARGE_CYCLE_TABLES,
  NEXUSES_LISTED,
  type Analysis,
  type TableSelection,
} from '@seinework/contracts';
import type { DifferenceMap } from '@seinework/harvest-options';

/**
 * Proportionate documents for the API: unless `tables=all` is asked for, the n² tables (and the
 * per-flow tables of the robustness gradient and the cycle analysis) are left out and the nexus
 * listing is cut to its first nexuses and cycles, with counts. The scalars, the per-compartment
 * maps, fleets, the trophic ladder and the warnings always stay. `tablesLeftOut` names what was
 * left out, so that a reader knows to ask.
 */

export const LEFT_OUT_KEYS = [...LARGE_ANALYSIS_TABLES, ...LARGE_CYCLE_TABLES.map((key) => `cycles.${key}`)];

export function proportionateAnalysis(analysis: Analysis, tables: TableSelection): object {
  if (tables === 'all') return analysis;
  const summary: Record<string, unknown> = { ...analysis };
  for (const key of LARGE_ANALYSIS_TABLES) delete summary[key];
  if (analysis.cycles) {
    const { cycledFlow: _cycled, acyclicFlow: _acyclic, nexuses, ...rest } = analysis.cycles;
    summary['cycles'] = {
      ...rest,
      nexusCount: nexuses.length,
      nexuses: nexuses.slice(0, NEXUSES_LISTED).map((nexus) => ({
        weakArc: nexus.weakArc,
        cycleCount: nexus.cycles.length,
        cycles: nexus.cycles.slice(0, CYCLES_LISTED_PER_NEXUS),
      })),
    };
  }
  summary['tablesLeftOut'] = LEFT_OUT_KEYS;
  return summary;
}

/** option − baseline without the tables the summary documents leave out. */
export function proportionateDifference(difference: DifferenceMap, tables: TableSelection): DifferenceMap {
  if (tables === 'all') return difference;
  const summary: DifferenceMap = { ...difference };
  for (const key of LARGE_ANALYSIS_TABLES) delete summary[key];
  const cycles = summary['cycles'];
  if (cycles && typeof cycles === 'object' && !Array.isArray(cycles)) {
    const rest: DifferenceMap = { ...cycles };
    for (const key of LARGE_CYCLE_TABLES) delete rest[key];
    summary['cycles'] = rest;
  }
  return summary;
}
