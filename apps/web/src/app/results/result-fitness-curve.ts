import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { fitnessCurveData, fitnessCurveOptions } from '../shared/fitness-curve-data';
import { fitnessPlot, type FitnessRow } from './result-tables';

/**
 * The fitness curve of the shared pieces (fitness-curve-data.ts) with the run's two webs told apart
 * (baseline a grey circle, the option an orange triangle) and the 5–95 % band of each drawn as a cross.
 * "Close up" zooms to the two points, which on the whole curve often sit on top of each other.
 */
@Component({
  selector: 'sw-result-fitness-curve',
  imports: [BaseChartDirective, MatButtonToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-button-toggle-group [value]="zoom()" (change)="zoom.set($event.value)" aria-label="How much of the curve to show" hideSingleSelectionIndicator>
      <mat-button-toggle value="whole">Whole curve</mat-button-toggle>
      <mat-button-toggle value="close">Close up on the two points</mat-button-toggle>
    </mat-button-toggle-group>
    <div class="chart">
      <canvas baseChart type="scatter" [data]="data()" [options]="options()" role="img" [attr.aria-label]="description()"></canvas>
    </div>
  `,
  styles: `
    :host { display: block; }
    .chart { position: relative; height: 300px; max-width: 900px; margin-top: 8px; }
  `,
})
export class ResultFitnessCurve {
  readonly rows = input.required<readonly FitnessRow[]>();

  protected readonly zoom = signal<'whole' | 'close'>('whole');
  private readonly plot = computed(() => fitnessPlot(this.rows()));

  protected readonly data = computed<ChartConfiguration<'scatter'>['data']>(() => {
    const base = fitnessCurveData([]);
    const bounds = this.plot().bounds;
    if (this.zoom() === 'close' && bounds) {
      // a finer curve over the close-up, so that it is drawn smooth
      const steps = 120;
      base.datasets[0].data = Array.from({ length: steps + 1 }, (_, k) => {
        const a = bounds.xMin + ((bounds.xMax - bounds.xMin) * k) / steps;
        return { x: a, y: a <= 0 ? 0 : -a * Math.log(a) };
      });
    }
    return { datasets: [...base.datasets, ...this.plot().datasets] };
  });

  protected readonly options = computed<ChartConfiguration<'scatter'>['options']>(() => {
    const bounds = this.plot().bounds;
    const close = this.zoom() === 'close' && bounds;
    return {
      ...fitnessCurveOptions,
      scales: close
        ? {
            x: { min: bounds.xMin, max: bounds.xMax, title: { display: true, text: 'Relative ascendency a (constraint →)' } },
            y: { min: bounds.yMin, max: bounds.yMax, title: { display: true, text: 'Fitness F' } },
          }
        : fitnessCurveOptions!.scales,
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true, filter: (item) => !item.text.includes('band') } },
        tooltip: { callbacks: { label: (item) => `${item.dataset.label}: a = ${(item.raw as { x: number }).x.toFixed(4)}, F = ${(item.raw as { y: number }).y.toFixed(4)}` } },
      },
    };
  });

  protected readonly description = computed(
    () =>
      'Fitness curve with ' +
      this.rows()
        .map((r) => `${r.label} at relative ascendency ${r.relativeAscendency.toFixed(4)}, fitness ${r.robustness.toFixed(4)}`)
        .join('; ') +
      '. The same figures and their bands are in the table below.',
  );
}
