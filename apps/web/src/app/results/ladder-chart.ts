import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { CsvButton } from '../shared/csv-button';
import { formatAuto, formatValue } from './format';
import { ladderTable, levelName, type LadderRow } from './result-tables';

const BEFORE = '#5c6b73';
const AFTER = '#00696d';

/** The trophic ladder: each level's transfer efficiency before and after as bars, and the whole ladder as a table (its text alternative). */
@Component({
  selector: 'sw-ladder-chart',
  imports: [BaseChartDirective, CsvButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="note">
      The web folded into whole feeding levels (I = plants and detritus, II = what eats them, …). The transfer efficiency of a level is
      the share of what enters it that is passed up to the next; about 10 % is common in the sea.
      @if (meanBefore() !== null) {
        Mean efficiency of levels II–IV: {{ pct(meanBefore()) }} before, {{ pct(meanAfter()) }} after.
      }
    </p>
    <div class="chart">
      <canvas baseChart type="bar" [data]="data()" [options]="options" role="img" [attr.aria-label]="description()"></canvas>
    </div>
    <div class="table-head">
      <h3>The ladder, level by level</h3>
      <sw-csv-button [table]="table()" label="the trophic ladder" [prefix]="prefix()" />
    </div>
    <div class="scroll" tabindex="0" role="region" aria-label="Trophic ladder, scrollable">
      <table class="dense" aria-label="Trophic ladder before and after: input, amount passed on and transfer efficiency per level">
        <thead>
          <tr>
            <th scope="col" rowspan="2">Level</th>
            <th scope="colgroup" colspan="3">Before</th>
            <th scope="colgroup" colspan="3">After</th>
          </tr>
          <tr>
            <th scope="col">Input <span class="nowrap">({{ unit() }})</span></th><th scope="col">Passed on</th><th scope="col">Transfer efficiency</th>
            <th scope="col">Input <span class="nowrap">({{ unit() }})</span></th><th scope="col">Passed on</th><th scope="col">Transfer efficiency</th>
          </tr>
        </thead>
        <tbody>
          @for (r of rows(); track r.level) {
            <tr>
              <th scope="row">{{ name(r.level) }}</th>
              <td>{{ n(r.inputBefore) }}</td><td>{{ n(r.passedOnBefore) }}</td><td>{{ pct(r.efficiencyBefore) }}</td>
              <td>{{ n(r.inputAfter) }}</td><td>{{ n(r.passedOnAfter) }}</td><td>{{ pct(r.efficiencyAfter) }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './result-tables.scss',
  styles: `.chart { position: relative; height: 260px; max-width: 760px; }`,
})
export class LadderChart {
  readonly rows = input.required<readonly LadderRow[]>();
  readonly meanBefore = input<number | null>(null);
  readonly meanAfter = input<number | null>(null);
  readonly unit = input('');
  readonly prefix = input('run');

  protected readonly table = computed(() => ladderTable(this.rows()));
  /** Levels that pass something on: the top levels carry tiny, noisy amounts. */
  private readonly charted = computed(() => this.rows().filter((r) => (r.efficiencyBefore ?? 0) > 0 || (r.efficiencyAfter ?? 0) > 0).slice(0, 6));

  protected readonly data = computed<ChartConfiguration<'bar'>['data']>(() => ({
    labels: this.charted().map((r) => `${levelName(r.level)} → ${levelName(r.level + 1)}`),
    datasets: [
      { label: 'Before', data: this.charted().map((r) => (r.efficiencyBefore ?? 0) * 100), backgroundColor: BEFORE },
      { label: 'After', data: this.charted().map((r) => (r.efficiencyAfter ?? 0) * 100), backgroundColor: AFTER },
    ],
  }));

  protected readonly options: ChartConfiguration<'bar'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    scales: {
      x: { title: { display: true, text: 'From level to the next' } },
      y: { beginAtZero: true, title: { display: true, text: 'Transfer efficiency (%)' } },
    },
    plugins: {
      legend: { position: 'bottom' },
      tooltip: { callbacks: { label: (item) => `${item.dataset.label}: ${Number(item.raw).toFixed(1)} %` } },
    },
  };

  protected readonly description = computed(
    () =>
      'Bar chart of transfer efficiency per level, before and after: ' +
      this.charted()
        .map((r) => `level ${levelName(r.level)} ${this.pct(r.efficiencyBefore)} before, ${this.pct(r.efficiencyAfter)} after`)
        .join('; ') +
      '. The same figures are in the table below.',
  );

  protected name(level: number): string {
    return levelName(level);
  }
  protected n(value: number | null): string {
    return formatAuto(value);
  }
  protected pct(value: number | null): string {
    return formatValue(value, 'percent', 1);
  }
}
