import { toCsv, sheetName } from '../shared/table-export';
import { formatCell, formatSmall, formatValue } from './format';
import { bandExcludesZero } from './result-document';
import { fixtureDocument } from './result-fixture';
import {
  allTables,
  dependenceChanges,
  describeAdjustment,
  fitnessPlot,
  fitnessRows,
  indicatorRows,
  indicatorTable,
  ladderRows,
  positionRows,
  sortDependence,
  weakArcRows,
} from './result-tables';

describe('the robust mark', () => {
  it('is given only when the 5–95 % band lies wholly on one side of zero', () => {
    expect(bandExcludesZero({ p5: 0.1, p95: 0.4 })).toBe(true);
    expect(bandExcludesZero({ p5: -0.4, p95: -0.01 })).toBe(true);
    expect(bandExcludesZero({ p5: -0.1, p95: 0.4 })).toBe(false);
    expect(bandExcludesZero({ p5: 0, p95: 0.4 })).toBe(false);
    expect(bandExcludesZero({ p5: -0.3, p95: 0 })).toBe(false);
    expect(bandExcludesZero(null)).toBe(false);
  });

  it('follows each indicator’s own band, and no band means no mark', () => {
    const doc = fixtureDocument({
      totalCatch: { p5: 1.5, median: 2, p95: 2.5 },
      tst: { p5: -1, median: 0.2, p95: 3 },
      overhead: { p5: -4, median: -2, p95: -0.5 },
    });
    const rows = indicatorRows(doc);
    const byKey = new Map(rows.map((r) => [r.key, r]));
    expect(rows).toHaveLength(16);
    expect(byKey.get('totalCatch')!.robust).toBe(true);
    expect(byKey.get('overhead')!.robust).toBe(true);
    expect(byKey.get('tst')!.robust).toBe(false);
    expect(byKey.get('tst')!.band).toEqual({ p5: -1, median: 0.2, p95: 3 });
    expect(byKey.get('ascendency')!.band).toBeNull();
    expect(byKey.get('ascendency')!.robust).toBe(false);
    expect(byKey.get('totalCatch')!.difference).toBe(2);

    const withoutDraws = indicatorRows(fixtureDocument(null));
    expect(withoutDraws.every((r) => r.band === null && !r.robust)).toBe(true);
  });

  it('goes into the CSV as yes, no, or empty where there are no draws', () => {
    const doc = fixtureDocument({ totalCatch: { p5: 1.5, median: 2, p95: 2.5 }, tst: { p5: -1, median: 0.2, p95: 3 } });
    const csv = toCsv(indicatorTable(indicatorRows(doc))).split('\r\n');
    expect(csv[0]).toBe('indicator,key,before,after,difference,difference p5,difference median,difference p95,robust');
    expect(csv.find((l) => l.includes(',totalCatch,'))).toBe('Total catch,totalCatch,2,4,2,1.5,2,2.5,yes');
    expect(csv.find((l) => l.includes(',tst,'))).toBe('Total system throughput,tst,100,200,100,-1,0.2,3,no');
    expect(csv.find((l) => l.includes(',ascendency,'))).toBe('Ascendency,ascendency,120,120,0,,,,');
  });
});

describe('diet dependence changes', () => {
  const doc = fixtureDocument();

  it('leave out a compartment on itself and pairs that did not move, largest move first', () => {
    const rows = dependenceChanges(doc);
    expect(rows.map((r) => `${r.from}>${r.to}`)).toEqual(['grazer>fish', 'plants>fish', 'fish>grazer']);
    expect(rows[0].change).toBeCloseTo(-0.2, 12);
    expect(rows[0].fromName).toBe('Grazer');
    expect(dependenceChanges(doc, 2)).toHaveLength(2);
  });

  it('sort by any column either way; no direction keeps the largest-first order', () => {
    const rows = dependenceChanges(doc);
    expect(sortDependence(rows, 'change', 'asc').map((r) => r.change)).toEqual([...rows.map((r) => r.change)].sort((a, b) => a - b));
    expect(sortDependence(rows, 'change', 'desc')[0].from).toBe('plants');
    expect(sortDependence(rows, 'fromName', 'asc').map((r) => r.fromName)).toEqual(['Fish', 'Grazer', 'Plants']);
    expect(sortDependence(rows, 'toName', 'desc').map((r) => r.toName)).toEqual(['Grazer', 'Fish', 'Fish']);
    expect(sortDependence(rows, 'change', '')).toEqual(rows);
    expect(sortDependence(rows, 'no-such-column', 'asc')).toEqual(rows);
    expect(rows.map((r) => r.from)).toEqual(['grazer', 'plants', 'fish']); // the input is left as it was
  });
});

describe('the other result tables', () => {
  const doc = fixtureDocument({ relativeAscendency: { p5: 0.2, median: 0.3, p95: 0.4 }, robustness: { p5: 0.3, median: 0.35, p95: 0.37 } });

  it('list trophic positions highest first, before and after', () => {
    expect(positionRows(doc).map((r) => [r.id, r.before, r.after])).toEqual([
      ['fish', 3, 3.1],
      ['grazer', 2, 2],
      ['plants', 1, 1],
    ]);
  });

  it('put the ladders side by side level by level, though the option reaches a level more', () => {
    const rows = ladderRows(doc);
    expect(rows.map((r) => r.level)).toEqual([1, 2, 3]);
    expect(rows[1]).toMatchObject({ efficiencyBefore: 0.1, efficiencyAfter: 0.2 });
    expect(rows[2]).toMatchObject({ inputBefore: null, inputAfter: 1 });
  });

  it('name the compartments of each weak arc and its longest cycle', () => {
    expect(weakArcRows(doc, 'baseline')).toEqual([{ from: 'Fish', to: 'Grazer', value: 0.5, cycles: 1, longest: 'Grazer → Fish' }]);
  });

  it('place both webs on the fitness curve with their bands, and the close-up holds every band', () => {
    const rows = fitnessRows(doc);
    expect(rows.map((r) => r.label)).toEqual(['Baseline', 'With the option']);
    const { datasets, bounds } = fitnessPlot(rows);
    expect(datasets.filter((d) => d.label?.includes('band'))).toHaveLength(4);
    expect(bounds!.xMin).toBeLessThan(0.2);
    expect(bounds!.xMax).toBeGreaterThan(0.4);
    expect(bounds!.yMax).toBeGreaterThan(0.37);
  });

  it('say each adjustment in words, with the compartment’s name', () => {
    expect(describeAdjustment({ type: 'scale-catch', fleet: 'Trawl', compartment: 'fish', percent: -40 }, doc, 't')).toBe('Trawl: catch of Fish −40 %');
    expect(describeAdjustment({ type: 'close-fleet', fleet: 'Trawl' }, doc, 't')).toBe('Trawl: fleet closed');
  });

  it('give every table to the workbook, each under a name Excel accepts', () => {
    const tables = allTables(doc, []);
    expect(tables.map((t) => t.name)).toContain('diet-dependence-matrix');
    const taken = new Set<string>();
    const names = tables.map((t) => sheetName(t.name, taken));
    expect(new Set(names).size).toBe(names.length);
    expect(names.every((n) => n.length <= 31)).toBe(true);
    expect(sheetName('a/b:c*d?[e]', new Set())).toBe('a b c d  e ');
  });
});

describe('numbers on the result page', () => {
  it('keep a small change visible instead of rounding it to zero, and drop arithmetic noise', () => {
    expect(formatValue(0.0000118, 'number', 4, true)).toBe('+0.000012');
    expect(formatValue(-2.2e-16, 'number', 4, true)).toBe('0.0000');
    expect(formatValue(-0.4277, 'percent', 2, true)).toBe('−42.77 pts');
    expect(formatValue(0.2782, 'percent', 2)).toBe('27.82 %');
    expect(formatValue(12361.5, 'number', 0)).toBe('12,362');
    expect(formatValue(null, 'number', 2)).toBe('—');
  });

  it('print heat-map cells compactly and very small changes as powers of ten', () => {
    expect(formatCell(0.00004, 'number', 3)).toBe('0');
    expect(formatCell(-0.0691, 'number', 3)).toBe('−0.069');
    expect(formatCell(0.0039, 'percent', 2)).toBe('+0.39');
    expect(formatSmall(-2.43e-7)).toBe('−2.43 × 10⁻⁷');
    expect(formatSmall(0.012)).toBe('+0.012');
  });
});
