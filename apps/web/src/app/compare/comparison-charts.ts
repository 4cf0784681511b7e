import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { BaseChartDirective } from 'ng2-charts';
import type { Comparison } from '@seinework/contracts';
import { FitnessCurve } from '../shared/fitness-curve';
import type { PlacedWeb } from '../shared/fitness-curve-data';
import { differenceChartData, differenceChartOptions, fitnessCloseUpData, fitnessCloseUpOptions, zeroLine } from './compare-charts-data';
import type { ComparedRun } from './compared-run';
import { formatChange, formatFigure, INDICATOR_NAMES, KEY_INDICATORS } from './indicator-names';

/** The key indicators' differences with their bands, and the fitness-curve positions together, each with its figures as a table. */
@Component({
  selector: 'sw-comparison-charts',
  imports: [BaseChartDirective, FitnessCurve],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2>Key indicators: change and its band</h2>
    <p class="explain">
      Each mark is an option's change from the baseline; the bar behind it spans the 5–95 % band of that change across the
      run's draws. A bar that does not cross the zero line is a change larger than the data uncertainty.
    </p>
    <div class="charts">
      @for (chart of differenceCharts(); track chart.key) {
        <figure>
          <figcaption>{{ chart.name }}</figcaption>
          <div class="chart" [style.height.px]="80 + runs().length * 36">
            <canvas baseChart [type]="'bar'" [data]="chart.data" [options]="chartOptions" [plugins]="chartPlugins" role="img" [attr.aria-label]="chart.description"></canvas>
          </div>
          <details>
            <summary>The figures of this chart</summary>
            <table class="figures" [attr.aria-label]="chart.name + ': change per option'">
              <thead><tr><th scope="col">Option</th><th scope="col">Change</th><th scope="col">5 %</th><th scope="col">95 %</th><th scope="col">Exceeds uncertainty</th></tr></thead>
              <tbody>
                @for (row of chart.rows; track row.letter) {
                  <tr><th scope="row">{{ row.letter }}</th><td>{{ row.change }}</td><td>{{ row.p5 }}</td><td>{{ row.p95 }}</td><td>{{ row.exceeds }}</td></tr>
                }
              </tbody>
            </table>
          </details>
        </figure>
      }
    </div>

    <h2>Where each option leaves the web on the fitness curve</h2>
    <p class="explain">
      Relative ascendency <em>a</em> measures how constrained the flows are; fitness <em>F</em> = −<em>a</em> ln <em>a</em> is highest
      at <em>a</em> = 1/e ≈ 0.368. On the whole curve the options sit on the baseline's spot; the close-up beside it spreads them apart.
    </p>
    <div class="charts fitness">
      <figure>
        <figcaption>The whole curve</figcaption>
        <sw-fitness-curve [webs]="placed().slice(0, 1)" />
      </figure>
      <figure>
        <figcaption>Close up</figcaption>
        <div class="chart close-up">
          <canvas baseChart type="scatter" [data]="closeUp()" [options]="closeUpOptions()" role="img" [attr.aria-label]="closeUpDescription()"></canvas>
        </div>
      </figure>
    </div>
    <details>
      <summary>The figures of these charts</summary>
      <table class="figures" aria-label="Positions on the fitness curve">
        <thead><tr><th scope="col">Web</th><th scope="col">Relative ascendency a</th><th scope="col">Fitness F</th></tr></thead>
        <tbody>
          @for (web of placed(); track web.label) {
            <tr><th scope="row">{{ web.label }}</th><td>{{ web.relativeAscendency.toFixed(5) }}</td><td>{{ web.robustness.toFixed(5) }}</td></tr>
          }
        </tbody>
      </table>
    </details>
  `,
  styles: `
    h2 { font: var(--mat-sys-title-large); margin: 32px 0 8px; }
    .explain { max-width: 80ch; }
    .charts { display: grid; grid-template-columns: repeat(auto-fit, minmax(min(100%, 420px), 1fr)); gap: 16px 24px; }
    figure { margin: 0; min-width: 0; }
    figcaption { font: var(--mat-sys-title-small); margin-bottom: 4px; }
    .chart { position: relative; }
    .close-up { height: 280px; }
    details { margin-top: 4px; }
    summary { cursor: pointer; color: var(--mat-sys-primary); }
    .figures { border-collapse: collapse; margin: 8px 0; font-variant-numeric: tabular-nums; }
    .figures th, .figures td { padding: 4px 10px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: right; }
    .figures th[scope='row'], .figures thead th:first-child { text-align: left; }
  `,
})
export class ComparisonCharts {
  readonly comparison = input.required<Comparison>();
  readonly runs = input.required<readonly ComparedRun[]>();

  protected readonly chartOptions = differenceChartOptions;
  protected readonly chartPlugins = [zeroLine];

  protected readonly differenceCharts = computed(() =>
    KEY_INDICATORS.map((key) => this.comparison().indicators.find((i) => i.key === key))
      .filter((indicator) => indicator !== undefined)
      .map((indicator) => {
        const name = INDICATOR_NAMES[indicator.key];
        const rows = this.runs().map((run) => {
          const value = indicator.values.find((v) => v.runId === run.runId);
          return {
            letter: run.letter,
            change: formatChange(value?.difference ?? null),
            p5: formatChange(value?.band?.p5 ?? null),
            p95: formatChange(value?.band?.p95 ?? null),
            exceeds: value?.band ? (value.exceedsUncertainty ? 'yes' : 'no') : 'no band',
          };
        });
        return {
          key: indicator.key,
          name,
          data: differenceChartData(indicator, this.runs()),
          rows,
          description: `${name}, change from the baseline: ` + rows.map((r) => `option ${r.letter} ${r.change} (5–95 % ${r.p5} to ${r.p95})`).join('; '),
        };
      }),
  );

  /** The baseline, then each option after, at the engine's own (a, F). */
  protected readonly placed = computed((): PlacedWeb[] => {
    const indicators = this.comparison().indicators;
    const a = indicators.find((i) => i.key === 'relativeAscendency');
    const f = indicators.find((i) => i.key === 'robustness');
    if (!a || !f || a.baseline === null || f.baseline === null) return [];
    const options = this.runs().flatMap((run) => {
      const after = a.values.find((v) => v.runId === run.runId)?.after ?? null;
      const fitness = f.values.find((v) => v.runId === run.runId)?.after ?? null;
      return after === null || fitness === null ? [] : [{ label: `Option ${run.letter}`, relativeAscendency: after, robustness: fitness }];
    });
    return [{ label: 'Baseline', relativeAscendency: a.baseline, robustness: f.baseline }, ...options];
  });

  protected readonly closeUp = computed(() => fitnessCloseUpData(this.placed()));
  protected readonly closeUpOptions = computed(() => fitnessCloseUpOptions(this.placed()));
  protected readonly closeUpDescription = computed(
    () => 'Fitness curve close up: ' + this.placed().map((w) => `${w.label} at a ${formatFigure(w.relativeAscendency)}, F ${formatFigure(w.robustness)}`).join('; '),
  );
}
