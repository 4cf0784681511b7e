import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { BaseChartDirective } from 'ng2-charts';
import { fitnessCurveData, fitnessCurveOptions, type PlacedWeb } from './fitness-curve-data';

/** Where one or more webs sit on the fitness curve, between flexibility (left) and constraint (right). */
@Component({
  selector: 'sw-fitness-curve',
  imports: [BaseChartDirective],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="chart">
      <canvas baseChart type="scatter" [data]="data()" [options]="options" [attr.aria-label]="description()" role="img"></canvas>
    </div>
  `,
  styles: `.chart { position: relative; height: 280px; }`,
})
export class FitnessCurve {
  readonly webs = input.required<readonly PlacedWeb[]>();

  protected readonly options = fitnessCurveOptions;
  protected readonly data = computed(() => fitnessCurveData(this.webs()));
  protected readonly description = computed(
    () =>
      'Fitness curve: ' +
      this.webs()
        .map((w) => `${w.label} at relative ascendency ${w.relativeAscendency.toFixed(3)}, fitness ${w.robustness.toFixed(3)}`)
        .join('; '),
  );
}
