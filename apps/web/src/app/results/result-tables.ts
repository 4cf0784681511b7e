import { SCALAR_INDICATORS, type Adjustment } from '@seinework/contracts';
import type { ChartConfiguration } from 'chart.js';
import type { ExportTable } from '../shared/table-export';
import { bandExcludesZero, type Band, type HarvestSensitivity, type ScenarioDocument } from './result-document';
import { INDICATOR_LABELS, type IndicatorKey } from './indicator-labels';

/** The rows the result page shows, built from the scenario document; each also feeds its CSV export. */

export interface IndicatorRow {
  readonly key: IndicatorKey;
  readonly name: string;
  readonly meaning: string;
  readonly format: 'percent' | 'number';
  readonly decimals: number;
  readonly baseline: number | null;
  readonly option: number | null;
  readonly difference: number | null;
  /** 5–95 % band of the difference over the draws; null for a run without draws. */
  readonly band: Band | null;
  readonly robust: boolean;
}

export function indicatorRows(doc: ScenarioDocument): IndicatorRow[] {
  return SCALAR_INDICATORS.map((key) => {
    const band = doc.uncertainty?.indicators[key]?.difference ?? null;
    return {
      key,
      ...INDICATOR_LABELS[key],
      baseline: doc.baseline[key],
      option: doc.option[key],
      difference: doc.difference[key],
      band,
      robust: bandExcludesZero(band),
    };
  });
}

export function indicatorTable(rows: readonly IndicatorRow[]): ExportTable {
  return {
    name: 'key-indicators',
    columns: ['indicator', 'key', 'before', 'after', 'difference', 'difference p5', 'difference median', 'difference p95', 'robust'],
    rows: rows.map((r) => [r.name, r.key, r.baseline, r.option, r.difference, r.band?.p5 ?? null, r.band?.median ?? null, r.band?.p95 ?? null, r.band ? (r.robust ? 'yes' : 'no') : null]),
  };
}

export interface FleetRow {
  readonly fleet: string;
  readonly catchBefore: number;
  readonly catchAfter: number | null;
  readonly tonnesBefore: number | null;
  readonly tonnesAfter: number | null;
  readonly valueBefore: number | null;
  readonly valueAfter: number | null;
  readonly mtlBefore: number | null;
  readonly mtlAfter: number | null;
  readonly fishingInBalance: number | null;
  readonly pprBefore: number;
  readonly pprAfter: number | null;
}

export function fleetRows(doc: ScenarioDocument): FleetRow[] {
  const names = [...new Set([...Object.keys(doc.baseline.fleets), ...Object.keys(doc.option.fleets)])];
  return names.map((fleet) => {
    const before = doc.baseline.fleets[fleet];
    const after = doc.option.fleets[fleet];
    return {
      fleet,
      catchBefore: before?.catch ?? 0,
      catchAfter: after?.catch ?? null,
      tonnesBefore: before?.tonnes ?? null,
      tonnesAfter: after?.tonnes ?? null,
      valueBefore: before?.value ?? null,
      valueAfter: after?.value ?? null,
      mtlBefore: before?.meanTrophicLevelOfCatch ?? null,
      mtlAfter: after?.meanTrophicLevelOfCatch ?? null,
      fishingInBalance: doc.difference.fleets[fleet]?.fishingInBalance ?? null,
      pprBefore: before?.primaryProductionRequired ?? 0,
      pprAfter: after?.primaryProductionRequired ?? null,
    };
  });
}

export function fleetTable(rows: readonly FleetRow[]): ExportTable {
  return {
    name: 'fleets',
    columns: ['fleet', 'catch before', 'catch after', 'tonnes before', 'tonnes after', 'value before', 'value after', 'mean trophic level before', 'mean trophic level after', 'fishing in balance', 'primary production required before', 'primary production required after'],
    rows: rows.map((r) => [r.fleet, r.catchBefore, r.catchAfter, r.tonnesBefore, r.tonnesAfter, r.valueBefore, r.valueAfter, r.mtlBefore, r.mtlAfter, r.fishingInBalance, r.pprBefore, r.pprAfter]),
  };
}

export interface CompartmentRef {
  readonly id: string;
  readonly name: string;
}

export function compartments(doc: ScenarioDocument): CompartmentRef[] {
  return doc.web.compartments.map((c) => ({ id: c.id, name: c.name }));
}

export interface PositionRow extends CompartmentRef {
  readonly before: number;
  readonly after: number;
  readonly change: number;
}

/** Trophic positions, highest first, as the ladder is read from the top. */
export function positionRows(doc: ScenarioDocument): PositionRow[] {
  return compartments(doc)
    .map((c) => ({ ...c, before: doc.baseline.trophicLevels[c.id], after: doc.option.trophicLevels[c.id], change: doc.option.trophicLevels[c.id] - doc.baseline.trophicLevels[c.id] }))
    .sort((a, b) => b.before - a.before);
}

export function positionTable(rows: readonly PositionRow[]): ExportTable {
  return { name: 'trophic-positions', columns: ['compartment id', 'compartment', 'trophic level before', 'trophic level after', 'change'], rows: rows.map((r) => [r.id, r.name, r.before, r.after, r.change]) };
}

export interface LadderRow {
  readonly level: number;
  readonly inputBefore: number | null;
  readonly passedOnBefore: number | null;
  readonly efficiencyBefore: number | null;
  readonly inputAfter: number | null;
  readonly passedOnAfter: number | null;
  readonly efficiencyAfter: number | null;
}

/** The ladder's levels before and after, level by level (the two webs may reach different heights). */
export function ladderRows(doc: ScenarioDocument): LadderRow[] {
  const before = new Map(doc.baseline.trophicLadder.levels.map((l) => [l.level, l]));
  const after = new Map(doc.option.trophicLadder.levels.map((l) => [l.level, l]));
  const levels = [...new Set([...before.keys(), ...after.keys()])].sort((a, b) => a - b);
  return levels.map((level) => ({
    level,
    inputBefore: before.get(level)?.input ?? null,
    passedOnBefore: before.get(level)?.passedOn ?? null,
    efficiencyBefore: before.get(level)?.efficiency ?? null,
    inputAfter: after.get(level)?.input ?? null,
    passedOnAfter: after.get(level)?.passedOn ?? null,
    efficiencyAfter: after.get(level)?.efficiency ?? null,
  }));
}

export function ladderTable(rows: readonly LadderRow[]): ExportTable {
  return {
    name: 'trophic-ladder',
    columns: ['level', 'input before', 'passed on before', 'transfer efficiency before', 'input after', 'passed on after', 'transfer efficiency after'],
    rows: rows.map((r) => [r.level, r.inputBefore, r.passedOnBefore, r.efficiencyBefore, r.inputAfter, r.passedOnAfter, r.efficiencyAfter]),
  };
}

/** Roman numerals for ladder levels, as the ladder is usually labelled. */
export function levelName(level: number): string {
  const numerals = ['I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X'];
  return numerals[level - 1] ?? String(level);
}

/** Mixed trophic impact of each fleet (rows) on each compartment (columns), after the option. */
export function fleetEffectsTable(doc: ScenarioDocument): ExportTable {
  const fleets = [...new Set([...Object.keys(doc.baseline.fleets), ...Object.keys(doc.option.fleets)])];
  const ids = compartments(doc);
  const mti = doc.option.mixedTrophicImpact ?? {};
  return { name: 'fleet-effects', columns: ['fleet', ...ids.map((c) => c.name)], rows: fleets.map((f) => [f, ...ids.map((c) => mti[f]?.[c.id] ?? null)]) };
}

export interface DependenceChange {
  readonly from: string;
  readonly fromName: string;
  readonly to: string;
  readonly toName: string;
  readonly before: number;
  readonly after: number;
  readonly change: number;
}

/**
 * Indirect diet dependence: the share of a compartment's intake that passed through another, on any
 * path. Every pair whose share moved, largest move first.
 */
export function dependenceChanges(doc: ScenarioDocument, limit = 25): DependenceChange[] {
  const before = doc.baseline.totalDependency ?? {};
  const after = doc.option.totalDependency ?? {};
  const names = new Map(compartments(doc).map((c) => [c.id, c.name]));
  const changes: DependenceChange[] = [];
  for (const from of names.keys()) {
    for (const to of names.keys()) {
      if (from === to) continue;
      const b = before[from]?.[to] ?? 0;
      const a = after[from]?.[to] ?? 0;
      if (a === b) continue;
      changes.push({ from, fromName: names.get(from)!, to, toName: names.get(to)!, before: b, after: a, change: a - b });
    }
  }
  return changes.sort((x, y) => Math.abs(y.change) - Math.abs(x.change)).slice(0, limit);
}

export type DependenceColumn = 'fromName' | 'toName' | 'before' | 'after' | 'change';

/**
 * The dependence rows ordered by a column as the table's sort header asks; no direction keeps the
 * given order (largest change first). The change sorts by its signed value.
 */
export function sortDependence(rows: readonly DependenceChange[], column: string, direction: 'asc' | 'desc' | ''): DependenceChange[] {
  if (!direction || !['fromName', 'toName', 'before', 'after', 'change'].includes(column)) return [...rows];
  const key = column as DependenceColumn;
  const sign = direction === 'asc' ? 1 : -1;
  return [...rows].sort((x, y) => {
    const a = x[key];
    const b = y[key];
    return sign * (typeof a === 'number' && typeof b === 'number' ? a - b : String(a).localeCompare(String(b), 'en-GB'));
  });
}

export function dependenceTable(rows: readonly DependenceChange[]): ExportTable {
  return { name: 'diet-dependence-changes', columns: ['through', 'into', 'share before', 'share after', 'change'], rows: rows.map((r) => [r.fromName, r.toName, r.before, r.after, r.change]) };
}

/** The full change matrix (through → into) behind the heat map. */
export function dependenceMatrixTable(doc: ScenarioDocument): ExportTable {
  const ids = compartments(doc);
  const diff = doc.difference.totalDependency ?? {};
  return { name: 'diet-dependence-matrix', columns: ['through \\ into', ...ids.map((c) => c.name)], rows: ids.map((f) => [f.name, ...ids.map((t) => diff[f.id]?.[t.id] ?? 0)]) };
}

export interface WeakArcRow {
  readonly from: string;
  readonly to: string;
  readonly value: number;
  readonly cycles: number;
  readonly longest: string;
}

export function weakArcRows(doc: ScenarioDocument, which: 'baseline' | 'option'): WeakArcRow[] {
  const names = new Map(compartments(doc).map((c) => [c.id, c.name]));
  const name = (id: string) => names.get(id) ?? id;
  return (doc[which].cycles?.nexuses ?? []).map((n) => ({
    from: name(n.weakArc.from),
    to: name(n.weakArc.to),
    value: n.weakArc.value,
    cycles: n.cycles.length,
    longest: [...n.cycles].sort((a, b) => b.length - a.length)[0]?.map(name).join(' → ') ?? '',
  }));
}

export function weakArcTable(rows: readonly WeakArcRow[], which: string): ExportTable {
  return { name: `cycles-${which}`, columns: ['weak arc from', 'weak arc to', 'flow on the weak arc', 'cycles through it', 'longest cycle'], rows: rows.map((r) => [r.from, r.to, r.value, r.cycles, r.longest]) };
}

export interface FitnessRow {
  readonly label: string;
  readonly relativeAscendency: number;
  readonly robustness: number;
  readonly aBand: Band | null;
  readonly fBand: Band | null;
  readonly side: string;
}

/** The baseline and the option on the fitness curve, with the 5–95 % band of each coordinate over the draws. */
export function fitnessRows(doc: ScenarioDocument): FitnessRow[] {
  const u = doc.uncertainty?.indicators;
  return (['baseline', 'option'] as const).map((which) => ({
    label: which === 'baseline' ? 'Baseline' : 'With the option',
    relativeAscendency: doc[which].relativeAscendency,
    robustness: doc[which].robustness,
    aBand: u?.relativeAscendency?.[which] ?? null,
    fBand: u?.robustness?.[which] ?? null,
    side: doc[which].fitness?.side ?? '',
  }));
}

export function fitnessTable(rows: readonly FitnessRow[]): ExportTable {
  return {
    name: 'fitness-curve',
    columns: ['web', 'relative ascendency', 'relative ascendency p5', 'relative ascendency p95', 'fitness', 'fitness p5', 'fitness p95', 'side of the peak'],
    rows: rows.map((r) => [r.label, r.relativeAscendency, r.aBand?.p5 ?? null, r.aBand?.p95 ?? null, r.robustness, r.fBand?.p5 ?? null, r.fBand?.p95 ?? null, r.side]),
  };
}

export interface SensitivityRow {
  readonly fleet: string;
  readonly compartment: string;
  readonly compartmentName: string;
  readonly catch: number;
  readonly totalCatch: number | null;
  readonly meanTrophicLevelOfCatch: number | null;
  readonly robustness: number | null;
  readonly distanceFromPeakChange: number | null;
  readonly catchValueChange: number | null;
  readonly refused: string | null;
}

/** The harvest sensitivity of the baseline, in the engine's order "most toward the fitness peak first". */
export function sensitivityRows(sensitivity: HarvestSensitivity, doc: ScenarioDocument): SensitivityRow[] {
  const names = new Map(compartments(doc).map((c) => [c.id, c.name]));
  return sensitivity.byRobustness.map((r) => ({
    fleet: r.fleet,
    compartment: r.compartment,
    compartmentName: names.get(r.compartment) ?? r.compartment,
    catch: r.catch,
    totalCatch: r.perPercent?.totalCatch ?? null,
    meanTrophicLevelOfCatch: r.perPercent?.meanTrophicLevelOfCatch ?? null,
    robustness: r.perPercent?.robustness ?? null,
    distanceFromPeakChange: r.distanceFromPeakChange,
    catchValueChange: r.catchValueChange,
    refused: r.refused ?? null,
  }));
}

export function sensitivityTable(rows: readonly SensitivityRow[]): ExportTable {
  return {
    name: 'harvest-sensitivity',
    columns: ['fleet', 'compartment id', 'compartment', 'catch', 'total catch per +1 %', 'mean trophic level of the catch per +1 %', 'fitness per +1 %', 'distance from the peak per +1 %', 'catch value per +1 %', 'refused'],
    rows: rows.map((r) => [r.fleet, r.compartment, r.compartmentName, r.catch, r.totalCatch, r.meanTrophicLevelOfCatch, r.robustness, r.distanceFromPeakChange, r.catchValueChange, r.refused]),
  };
}

/** Finn cycling index and the cycle count before and after. */
export function recyclingTable(doc: ScenarioDocument): ExportTable {
  return {
    name: 'recycling',
    columns: ['measure', 'before', 'after'],
    rows: [
      ['Finn cycling index', doc.baseline.finnCyclingIndex, doc.option.finnCyclingIndex],
      ['cycled to straight-through throughflow', doc.baseline.finnCycledToStraightRatio ?? null, doc.option.finnCycledToStraightRatio ?? null],
      ['simple cycles', doc.baseline.cycles?.count ?? null, doc.option.cycles?.count ?? null],
    ],
  };
}

/** One adjustment of the option in words, with compartment names from the web. */
export function describeAdjustment(adjustment: Adjustment, doc: ScenarioDocument | null, unit: string): string {
  const names = new Map((doc?.web.compartments ?? []).map((c) => [c.id, c.name]));
  const name = (id: string) => names.get(id) ?? id;
  const pct = (p: number) => `${p > 0 ? '+' : p < 0 ? '−' : ''}${Math.abs(p)} %`;
  switch (adjustment.type) {
    case 'scale-catch':
      return `${adjustment.fleet}: catch of ${name(adjustment.compartment)} ${pct(adjustment.percent)}`;
    case 'set-catch':
      return `${adjustment.fleet}: catch of ${name(adjustment.compartment)} set to ${adjustment.amount} ${unit}`;
    case 'close-fleet':
      return `${adjustment.fleet}: fleet closed`;
    case 'open-fishery':
      return `${adjustment.fleet}: new fishery on ${name(adjustment.compartment)}, ${adjustment.amount} ${unit}`;
    case 'scale-production':
      return `Primary production of ${name(adjustment.compartment)} ${pct(adjustment.percent)}`;
  }
}

/** Every table of the result page, for the one-file workbook download. */
export function allTables(doc: ScenarioDocument, sensitivity: readonly SensitivityRow[]): ExportTable[] {
  const tables = [
    indicatorTable(indicatorRows(doc)),
    fitnessTable(fitnessRows(doc)),
    fleetTable(fleetRows(doc)),
    fleetEffectsTable(doc),
    dependenceTable(dependenceChanges(doc)),
    dependenceMatrixTable(doc),
    positionTable(positionRows(doc)),
    ladderTable(ladderRows(doc)),
    recyclingTable(doc),
    weakArcTable(weakArcRows(doc, 'baseline'), 'before'),
    weakArcTable(weakArcRows(doc, 'option'), 'after'),
  ];
  if (sensitivity.length > 0) tables.push(sensitivityTable(sensitivity));
  return tables;
}

const FITNESS_STYLE = {
  // chart.js draws lower `order` on top: the option's triangle over the baseline's larger circle
  Baseline: { colour: '#5c6b73', point: 'circle', radius: 9, order: 2 },
  'With the option': { colour: '#b4530b', point: 'triangle', radius: 7, order: 1 },
} as const;

/**
 * The two points and their 5–95 % bands (a horizontal segment for a, a vertical one for F) as
 * scatter datasets, and the box that holds them all, padded, for the close-up.
 */
export function fitnessPlot(rows: readonly FitnessRow[]): {
  datasets: ChartConfiguration<'scatter'>['data']['datasets'];
  bounds: { xMin: number; xMax: number; yMin: number; yMax: number } | null;
} {
  const datasets: ChartConfiguration<'scatter'>['data']['datasets'] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  for (const r of rows) {
    const style = FITNESS_STYLE[r.label as keyof typeof FITNESS_STYLE] ?? FITNESS_STYLE['With the option'];
    xs.push(r.relativeAscendency);
    ys.push(r.robustness);
    if (r.aBand) {
      datasets.push({ label: `${r.label} band of a`, data: [{ x: r.aBand.p5, y: r.robustness }, { x: r.aBand.p95, y: r.robustness }], showLine: true, pointRadius: 0, borderColor: style.colour, borderWidth: 2, order: 3 });
      xs.push(r.aBand.p5, r.aBand.p95);
    }
    if (r.fBand) {
      datasets.push({ label: `${r.label} band of F`, data: [{ x: r.relativeAscendency, y: r.fBand.p5 }, { x: r.relativeAscendency, y: r.fBand.p95 }], showLine: true, pointRadius: 0, borderColor: style.colour, borderWidth: 2, order: 3 });
      ys.push(r.fBand.p5, r.fBand.p95);
    }
    datasets.push({ label: r.label, data: [{ x: r.relativeAscendency, y: r.robustness }], pointRadius: style.radius, pointStyle: style.point, backgroundColor: style.colour, borderColor: '#fff', borderWidth: 1, order: style.order });
  }
  if (xs.length === 0) return { datasets, bounds: null };
  const pad = (lo: number, hi: number) => Math.max((hi - lo) * 0.15, 1e-4);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  return { datasets, bounds: { xMin: x0 - pad(x0, x1), xMax: x1 + pad(x0, x1), yMin: y0 - pad(y0, y1), yMax: y1 + pad(y0, y1) } };
}
