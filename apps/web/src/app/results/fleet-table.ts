import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { CsvButton } from '../shared/csv-button';
import { formatValue } from './format';
import { fleetTable, type FleetRow } from './result-tables';

/** Each fleet's catch, value, mean trophic level of its catch, Fishing-in-Balance and primary production required. */
@Component({
  selector: 'sw-fleet-table',
  imports: [CsvButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="table-head">
      <h3>Per fleet, before → after</h3>
      <sw-csv-button [table]="table()" label="the fleet table" [prefix]="prefix()" />
    </div>
    <div class="scroll">
      <table class="dense" aria-label="Catch, value, trophic level, Fishing-in-Balance and primary production required per fleet">
        <thead>
          <tr>
            <th scope="col">Fleet</th>
            <th scope="col">Catch <span class="nowrap">({{ unit() }})</span></th>
            <th scope="col">Tonnes per year</th>
            <th scope="col">Value</th>
            <th scope="col">Mean trophic level of the catch</th>
            <th scope="col">Fishing-in-Balance</th>
            <th scope="col">Primary production required <span class="nowrap">({{ unit() }})</span></th>
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.fleet) {
            <tr [id]="'fleet-' + slug(row.fleet)">
              <th scope="row">{{ row.fleet }}</th>
              <td>{{ n(row.catchBefore, 3) }} → {{ n(row.catchAfter, 3) }}</td>
              <td>{{ n(row.tonnesBefore, 0) }} → {{ n(row.tonnesAfter, 0) }}</td>
              <td>{{ n(row.valueBefore, 0) }} → {{ n(row.valueAfter, 0) }}</td>
              <td>{{ n(row.mtlBefore, 2) }} → {{ n(row.mtlAfter, 2) }}</td>
              <td>{{ signed(row.fishingInBalance) }}</td>
              <td>{{ n(row.pprBefore, 2) }} → {{ n(row.pprAfter, 2) }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
    <p class="note">
      Fishing-in-Balance is zero when a fleet's change of catch is just what the change in the trophic level of its catch allows
      (about ten times the catch for one level lower); above zero the catch rose by more than that, below zero it fell by more.
    </p>
  `,
  styleUrl: './result-tables.scss',
})
export class FleetTable {
  readonly rows = input.required<readonly FleetRow[]>();
  readonly unit = input('');
  readonly prefix = input('run');

  protected readonly table = computed(() => fleetTable(this.rows()));
  /** An id-safe form of a fleet's name: `Purse seine` → `purse-seine`. */
  protected slug(name: string): string {
    return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');
  }
  protected n(value: number | null, decimals: number): string {
    return formatValue(value, 'number', decimals);
  }
  protected signed(value: number | null): string {
    return formatValue(value, 'number', 3, true);
  }
}
