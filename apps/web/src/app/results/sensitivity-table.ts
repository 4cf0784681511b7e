import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { CsvButton } from '../shared/csv-button';
import { formatAuto, formatSmall, formatValue } from './format';
import { sensitivityTable, type SensitivityRow } from './result-tables';

/** The baseline's harvest sensitivity: what +1 % of each existing catch would do, most toward the fitness peak first. */
@Component({
  selector: 'sw-sensitivity-table',
  imports: [CsvButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="table-head">
      <h3>What 1 % more of each catch would do to the baseline</h3>
      <sw-csv-button [table]="table()" label="the harvest sensitivity" [prefix]="prefix()" />
    </div>
    <p class="note">
      Each existing catch raised by 1 % on its own, under the same response rule as this option ({{ response() }}). Rows that bring
      the web closer to the peak of the fitness curve come first. Each figure is the change of that indicator for the 1 %. A guide to which catches the web is most sensitive to, not an option.
    </p>
    <div class="scroll" tabindex="0" role="region" aria-label="Harvest sensitivity, scrollable">
      <table class="dense" aria-label="Harvest sensitivity of the baseline: change per 1 % more of each catch">
        <thead>
          <tr>
            <th scope="col">Fleet</th>
            <th scope="col" class="text">Compartment caught</th>
            <th scope="col">Catch <span class="nowrap">({{ unit() }})</span></th>
            <th scope="col">Total catch</th>
            <th scope="col">Mean trophic level of the catch</th>
            <th scope="col">Fitness</th>
            <th scope="col">Distance from the peak (− = toward it)</th>
            <th scope="col">Catch value</th>
          </tr>
        </thead>
        <tbody>
          @for (r of rows(); track r.fleet + r.compartment) {
            <tr>
              <th scope="row">{{ r.fleet }}</th>
              <td class="text">{{ r.compartmentName }}</td>
              <td>{{ auto(r.catch) }}</td>
              @if (r.refused) {
                <td colspan="5" class="text refused">Not possible: {{ r.refused }}</td>
              } @else {
                <td>{{ small(r.totalCatch) }}</td>
                <td>{{ small(r.meanTrophicLevelOfCatch) }}</td>
                <td>{{ small(r.robustness) }}</td>
                <td>
                  {{ small(r.distanceFromPeakChange) }}
                  @if (r.distanceFromPeakChange !== null && r.distanceFromPeakChange < 0) { <span class="toward">toward the peak</span> }
                </td>
                <td>{{ money(r.catchValueChange) }}</td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './result-tables.scss',
  styles: `
    table.dense td.refused { color: var(--mat-sys-error); white-space: normal; text-align: left; }
    .toward { display: block; font-size: 0.75rem; color: var(--mat-sys-primary); }
  `,
})
export class SensitivityTable {
  readonly rows = input.required<readonly SensitivityRow[]>();
  readonly response = input('');
  readonly unit = input('');
  readonly prefix = input('run');

  protected readonly table = computed(() => sensitivityTable(this.rows()));
  protected auto(value: number | null): string {
    return formatAuto(value);
  }
  /** Changes per 1 % are small: three significant digits with their sign. */
  protected small(value: number | null): string {
    return formatSmall(value);
  }
  protected money(value: number | null): string {
    return formatValue(value, 'number', 0, true);
  }
}
