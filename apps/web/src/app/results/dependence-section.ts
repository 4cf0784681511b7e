import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { CsvButton } from '../shared/csv-button';
import { formatValue } from './format';
import { HeatTable } from './heat-table';
import { dependenceMatrixTable, dependenceTable, sortDependence, type DependenceChange } from './result-tables';
import type { ScenarioDocument } from './result-document';

/** Indirect diet dependence: the largest changes as a sortable table, and every change as a heat map. */
@Component({
  selector: 'sw-dependence-section',
  imports: [MatSortModule, MatTableModule, CsvButton, HeatTable],
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
        <table mat-table [dataSource]="sorted()" matSort (matSortChange)="sort.set($event)" class="dense" aria-label="Largest changes of indirect diet dependence">
          <ng-container matColumnDef="fromName">
            <th mat-header-cell *matHeaderCellDef mat-sort-header>Passed through</th>
            <td mat-cell *matCellDef="let r">{{ r.fromName }}</td>
          </ng-container>
          <ng-container matColumnDef="toName">
            <th mat-header-cell *matHeaderCellDef mat-sort-header>Food of</th>
            <td mat-cell *matCellDef="let r">{{ r.toName }}</td>
          </ng-container>
          <ng-container matColumnDef="before">
            <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" start="desc">Share before</th>
            <td mat-cell *matCellDef="let r" class="num">{{ pct(r.before) }}</td>
          </ng-container>
          <ng-container matColumnDef="after">
            <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" start="desc">Share after</th>
            <td mat-cell *matCellDef="let r" class="num">{{ pct(r.after) }}</td>
          </ng-container>
          <ng-container matColumnDef="change">
            <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" start="desc">Change</th>
            <td mat-cell *matCellDef="let r" class="num" [class.up]="r.change > 0" [class.down]="r.change < 0">{{ pts(r.change) }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let r; columns: columns"></tr>
        </table>
      </div>
    }
    <div class="table-head">
      <h3>Every change, as a heat map</h3>
      <sw-csv-button [table]="matrix()" label="every change of diet dependence" [prefix]="prefix()" />
    </div>
    <p class="note">Rows: the compartment the food passed through. Columns: whose food it is. Figures: change of the share, in percentage points.</p>
    <sw-heat-table [table]="matrix()" format="percent" [decimals]="1" label="Change of indirect diet dependence, in percentage points, rows passed through, columns food of" />
  `,
  styleUrl: './result-tables.scss',
  styles: `
    table.dense { width: auto; min-width: 60%; }
    .num { text-align: right; font-variant-numeric: tabular-nums; }
    .up::before { content: '▲ '; color: var(--mat-sys-primary); }
    .down::before { content: '▼ '; color: var(--mat-sys-tertiary); }
  `,
})
export class DependenceSection {
  readonly doc = input.required<ScenarioDocument>();
  readonly rows = input.required<readonly DependenceChange[]>();
  readonly prefix = input('run');

  protected readonly columns = ['fromName', 'toName', 'before', 'after', 'change'];
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
