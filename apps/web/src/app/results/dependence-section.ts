import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { CsvButton } from '../shared/csv-button';
import { formatValue } from './format';
import { HeatTable } from './heat-table';
import { dependenceMatrixTable, dependenceTable, sortDependence, type DependenceChange } from './result-tables';
import type { ScenarioDocument } from './result-document';

/** Indirect diet dependence: the largest changes as a sortable table, and every change as a heat map. */
@Component({
  selector: 'sw-dependence-section',
  imports: [MatSortModule, CsvButton, HeatTable],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="note">
      How much of each compartment's food passed, on any path, through another compartment. A change shows where the option
      reroutes the web's food supply.
    </p>
    <div class="table-head">
      <h3>The {{ rows().length }} largest changes</h3>
      <sw-csv-button [table]="table()" label="the largest changes of diet dependence" [prefix]="prefix()" />
    </div>
    @if (rows().length === 0) {
      <p class="quiet">The option changes no dependence between compartments.</p>
    } @else {
      <div class="scroll" tabindex="0" role="region" aria-label="Largest changes of diet dependence, scrollable">
        <table class="dense sortable" matSort (matSortChange)="sort.set($event)" aria-label="Largest changes of indirect diet dependence">
          <thead>
            <tr>
              <th scope="col" class="text" mat-sort-header="fromName">Passed through</th>
              <th scope="col" class="text" mat-sort-header="toName">Food of</th>
              <th scope="col" mat-sort-header="before" arrowPosition="before" start="desc">Share before</th>
              <th scope="col" mat-sort-header="after" arrowPosition="before" start="desc">Share after</th>
              <th scope="col" mat-sort-header="change" arrowPosition="before" start="desc">Change</th>
            </tr>
          </thead>
          <tbody>
            @for (r of sorted(); track r.from + '>' + r.to) {
              <tr>
                <td class="text">{{ r.fromName }}</td>
                <td class="text">{{ r.toName }}</td>
                <td>{{ pct(r.before) }}</td>
                <td>{{ pct(r.after) }}</td>
                <td [class.up]="r.change > 0" [class.down]="r.change < 0">{{ pts(r.change) }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
    <div class="table-head">
      <h3>Every change, as a heat map</h3>
      <sw-csv-button [table]="matrix()" label="every change of diet dependence" [prefix]="prefix()" />
    </div>
    <p class="note">Rows: the compartment the food passed through. Columns: whose food it is. Figures: change of the share, in percentage points.</p>
    <sw-heat-table [table]="matrix()" format="percent" [decimals]="2" label="Change of indirect diet dependence, in percentage points, rows passed through, columns food of" />
  `,
  styleUrl: './result-tables.scss',
  styles: `
    table.dense { width: auto; min-width: min(100%, 720px); }
    table.dense td { font-variant-numeric: tabular-nums; }
    table.sortable thead th { cursor: pointer; }
    table.sortable thead th.text ::ng-deep .mat-sort-header-container { justify-content: flex-start; }
    table.sortable thead th ::ng-deep .mat-sort-header-container { justify-content: flex-end; }
    .up::before { content: '▲ '; color: var(--mat-sys-primary); }
    .down::before { content: '▼ '; color: var(--mat-sys-tertiary); }
  `,
})
export class DependenceSection {
  readonly doc = input.required<ScenarioDocument>();
  readonly rows = input.required<readonly DependenceChange[]>();
  readonly prefix = input('run');

  protected readonly sort = signal<Sort>({ active: '', direction: '' });
  protected readonly sorted = computed(() => sortDependence(this.rows(), this.sort().active, this.sort().direction));
  /** The CSV holds the rows in the order shown. */
  protected readonly table = computed(() => dependenceTable(this.sorted()));
  protected readonly matrix = computed(() => dependenceMatrixTable(this.doc()));

  protected pct(value: number): string {
    return formatValue(value, 'percent', 1);
  }
  protected pts(value: number): string {
    return formatValue(value, 'percent', 2, true);
  }
}
