import type { Analysis, BriefFleet, BriefIndicator, CommentCounts, DependenceChange, HarvestOption, OptionBrief, PreferenceSummary, Web } from '@seinework/contracts';
import type { UncertaintySummary } from '@seinework/harvest-options';
import { fitnessChart } from './charts/fitness-chart';
import { ladderChart } from './charts/ladder-chart';
import { adjustmentInWords, CAUTION, indicatorLabel, KEY_INDICATORS, responseInWords } from './brief-words';

/**
 * An option's brief from its run's stored result document (`{baseline, option, difference, web,
 * uncertainty?}`, METHODS.md §11) and the record around it. Pure: the same inputs give the same brief.
 */

export interface RunResult {
  baseline: Analysis;
  option: Analysis;
  difference: Record<string, unknown>;
  web: Web;
  uncertainty?: UncertaintySummary;
}

export interface OptionBriefInputs {
  option: { id: string; name: string; purpose: string; inputs: HarvestOption };
  web: OptionBrief['web'];
  run: { id: string; engineVersion: string; seed: number; draws: number; cv: number; finishedAt: string };
  result: RunResult;
  preferences: PreferenceSummary[];
  comments: CommentCounts;
}

const DEPENDENCE_ROWS = 10;
const MAIN_COMPARTMENTS = 6;

export function optionBriefModel({ option, web, run, result, preferences, comments }: OptionBriefInputs): OptionBrief {
  const names = new Map(result.web.compartments.map((c) => [c.id, c.name]));
  const nameOf = (id: string) => names.get(id) ?? id;
  const u = result.uncertainty;
  return {
    option: {
      id: option.id,
      name: option.name,
      purpose: option.purpose,
      response: option.inputs.response,
      responseInWords: responseInWords(option.inputs.response),
      adjustments: option.inputs.adjustments.map((a) => adjustmentInWords(a, nameOf, web.unit)),
    },
    web,
    run: { ...run, succeeded: u ? u.succeeded : null },
    indicators: KEY_INDICATORS.map((key) => indicatorRow(key, result)),
    fitnessCurve: fitnessChart([
      { label: 'baseline', relativeAscendency: result.baseline.relativeAscendency, robustness: result.baseline.robustness, bandA: u?.indicators.relativeAscendency?.baseline ?? null, bandF: u?.indicators.robustness?.baseline ?? null, baseline: true },
      { label: 'with the option', relativeAscendency: result.option.relativeAscendency, robustness: result.option.robustness, bandA: u?.indicators.relativeAscendency?.option ?? null, bandF: u?.indicators.robustness?.option ?? null },
    ]),
    trophicLadder: ladderChart(result.baseline.trophicLadder.levels, result.option.trophicLadder.levels, web.unit),
    dependence: dependenceChanges(result, nameOf),
    ...fleetEffects(result, nameOf),
    preferences,
    comments: { ...comments, byAnchor: comments.byAnchor.map((a) => ({ ...a, label: a.kind === 'indicator' ? indicatorLabel(a.key) : nameOf(a.key) })) },
    caution: CAUTION,
    dated: run.finishedAt,
  };
}

function finite(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function own(record: unknown, key: string): unknown {
  return typeof record === 'object' && record !== null && Object.hasOwn(record, key) ? (record as Record<string, unknown>)[key] : undefined;
}

function indicatorRow(key: string, result: RunResult): BriefIndicator {
  const spread = own(own(result.uncertainty, 'indicators'), key) as UncertaintySummary['indicators'][keyof UncertaintySummary['indicators']] | undefined;
  const band = spread?.difference ?? null;
  return {
    key,
    label: indicatorLabel(key),
    baseline: key === 'fishingInBalance' ? null : finite(own(result.baseline, key)),
    option: key === 'fishingInBalance' ? null : finite(own(result.option, key)),
    difference: finite(own(result.difference, key)),
    band: band ? { p5: band.p5, median: band.median, p95: band.p95 } : null,
    robust: spread ? spread.robust : null,
  };
}

/** The largest changes (by size) in the share of one compartment's input that passed through another. */
function dependenceChanges(result: RunResult, nameOf: (id: string) => string): DependenceChange[] {
  const rows: DependenceChange[] = [];
  for (const [from, row] of Object.entries(result.baseline.totalDependency ?? {})) {
    for (const [to, before] of Object.entries(row)) {
      if (from === to) continue;
      const after = finite(own(own(result.option.totalDependency, from), to)) ?? 0;
      rows.push({ from: nameOf(from), to: nameOf(to), before, after, change: after - before });
    }
  }
  for (const [from, row] of Object.entries(result.option.totalDependency ?? {})) {
    for (const [to, after] of Object.entries(row)) {
      if (from !== to && own(own(result.baseline.totalDependency, from), to) === undefined) rows.push({ from: nameOf(from), to: nameOf(to), before: 0, after, change: after });
    }
  }
  return rows
    .filter((r) => Math.abs(r.change) > 1e-12)
    .sort((a, b) => Math.abs(b.change) - Math.abs(a.change) || a.from.localeCompare(b.from) || a.to.localeCompare(b.to))
    .slice(0, DEPENDENCE_ROWS);
}

/**
 * Each fleet's catch, value, mean trophic level of the catch and primary production required,
 * before and after, and its mixed trophic impact (in the option web) on the compartments the
 * fleets touch most (largest summed absolute impact).
 */
function fleetEffects(result: RunResult, nameOf: (id: string) => string): { mainCompartments: string[]; fleets: BriefFleet[] } {
  const fleetNames = [...new Set([...Object.keys(result.baseline.fleets ?? {}), ...Object.keys(result.option.fleets ?? {})])].sort((a, b) => a.localeCompare(b));
  const mti = result.option.mixedTrophicImpact ?? {};
  const weight = new Map<string, number>();
  for (const fleet of fleetNames) {
    for (const [to, value] of Object.entries(own(mti, fleet) ?? {})) {
      if (fleetNames.includes(to) || typeof value !== 'number') continue;
      weight.set(to, (weight.get(to) ?? 0) + Math.abs(value));
    }
  }
  const main = [...weight.entries()]
    .sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))
    .slice(0, MAIN_COMPARTMENTS)
    .map(([id]) => id);
  const fleets = fleetNames.map((fleet): BriefFleet => {
    const before = own(result.baseline.fleets, fleet) as Analysis['fleets'][string] | undefined;
    const after = own(result.option.fleets, fleet) as Analysis['fleets'][string] | undefined;
    return {
      fleet,
      catchBefore: before?.catch ?? 0,
      catchAfter: after?.catch ?? 0,
      valueBefore: before?.value ?? null,
      valueAfter: after?.value ?? null,
      meanTrophicLevelBefore: before?.meanTrophicLevelOfCatch ?? null,
      meanTrophicLevelAfter: after?.meanTrophicLevelOfCatch ?? null,
      pprBefore: before?.primaryProductionRequired ?? 0,
      pprAfter: after?.primaryProductionRequired ?? 0,
      impacts: main.map((id) => finite(own(own(mti, fleet), id))),
    };
  });
  return { mainCompartments: main.map(nameOf), fleets };
}
