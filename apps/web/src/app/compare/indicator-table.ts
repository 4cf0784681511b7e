import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { ComparedIndicator } from '@seinework/contracts';
import type { ComparedRun } from './compared-run';
import { formatChange, formatFigure, INDICATOR_NAMES, unitOf } from './indicator-names';
import { sortIndicators, type SortDirection } from './indicator-rows';

/** Every indicator side by side: the baseline, then each option's value after and its difference with the 5–95 % band. */
@Component({
  selector: 'sw-indicator-table',
  imports: [MatIconModule, MatSortModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="legend" id="exceeds-legend">
      <span class="mark"><mat-icon aria-hidden="true">flag</mat-icon> exceeds uncertainty</span>
      means the whole 5–95 % band of the difference lies on one side of zero: the change is larger than the data
      uncertainty of the web. A difference without the mark may be no change at all. Click a column heading to sort.
    </p>
    <div class="table-scroll" tabindex="0" role="region" aria-label="Indicators side by side, scrollable">
      <table mat-table [dataSource]="rows()" matSort (matSortChange)="sortBy($event)" aria-label="Indicators side by side" aria-describedby="exceeds-legend">
        <ng-container matColumnDef="group-indicator">
          <th mat-header-cell *matHeaderCellDef [attr.colspan]="2" class="group"><span class="visually-hidden">Indicator and baseline</span></th>
        </ng-container>
        @for (run of runs(); track run.runId) {
          <ng-container [matColumnDef]="'group:' + run.runId">
            <th mat-header-cell *matHeaderCellDef [attr.colspan]="2" class="group option-start">Option {{ run.letter }}: {{ run.optionName }}</th>
          </ng-container>
        }

        <ng-container matColumnDef="indicator">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Indicator</th>
          <td mat-cell *matCellDef="let row" class="name">
            {{ name(row) }}
            @if (unit(row); as unit) {
              <span class="unit">{{ unit }}</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="baseline">
          <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="number">Baseline</th>
          <td mat-cell *matCellDef="let row" class="number">{{ figure(row.baseline) }}</td>
        </ng-container>
        @for (run of runs(); track run.runId) {
          <ng-container [matColumnDef]="'after:' + run.runId">
            <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="number option-start">After <span class="visually-hidden">option {{ run.letter }}</span></th>
            <td mat-cell *matCellDef="let row" class="number option-start">{{ figure(valueOf(row, run.runId)?.after ?? null) }}</td>
          </ng-container>
          <ng-container [matColumnDef]="'difference:' + run.runId">
            <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="number">Change, 5–95 % band <span class="visually-hidden">option {{ run.letter }}</span></th>
            <td mat-cell *matCellDef="let row" class="number change">
              @if (valueOf(row, run.runId); as value) {
                <span class="difference" [class.exceeds]="value.exceedsUncertainty">{{ change(value.difference) }}</span>
                @if (value.exceedsUncertainty) {
                  <span class="mark"><mat-icon aria-hidden="true">flag</mat-icon> exceeds uncertainty</span>
                }
                @if (value.band; as band) {
                  <span class="band"><span class="visually-hidden">5–95 % band </span>{{ change(band.p5) }} to {{ change(band.p95) }}</span>
                } @else if (value.difference !== null) {
                  <span class="band">no band</span>
                }
              } @else {
                —
              }
            </td>
          </ng-container>
        }
        <tr mat-header-row *matHeaderRowDef="groupColumns()" class="group-row"></tr>
        <tr mat-header-row *matHeaderRowDef="columns()"></tr>
        <tr mat-row *matRowDef="let row; columns: columns()"></tr>
      </table>
    </div>
  `,
  styles: `
    /* positioned, so that the visually hidden header texts scroll with the table instead of widening the page */
    .table-scroll { position: relative; overflow-x: auto; }
    table { width: 100%; }
    .legend { max-width: 80ch; }
    .mark { display: inline-flex; align-items: center; gap: 2px; font-weight: 500; color: var(--mat-sys-tertiary); white-space: nowrap; font-size: 0.8125rem; }
    .mark mat-icon { font-size: 18px; width: 18px; height: 18px; }
    .number { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
    th.number { justify-content: flex-end; }
    .name { min-width: 10em; white-space: normal; }
    .unit { display: block; font-size: 0.75rem; color: var(--mat-sys-on-surface-variant); }
    th, td { padding: 6px 8px; }
    th:first-child, td:first-child { padding-left: 0; }
    .change { vertical-align: top; padding-top: 8px; padding-bottom: 8px; }
    .change > span { display: block; }
    .change .mark { display: flex; justify-content: flex-end; }
    .difference.exceeds { font-weight: 700; }
    .band { font-size: 0.75rem; color: var(--mat-sys-on-surface-variant); }
    .group { font: var(--mat-sys-title-small); color: var(--mat-sys-on-surface); white-space: normal; }
    .option-start { border-left: 1px solid var(--mat-sys-outline-variant); padding-left: 12px; }
    .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
  `,
})
export class IndicatorTable {
  readonly indicators = input.required<readonly ComparedIndicator[]>();
  readonly runs = input.required<readonly ComparedRun[]>();
  /** The web's flow unit, for the indicators measured in it; none shown while it is not known. */
  readonly flowUnit = input<string | null>(null);

  private readonly sort = signal<{ column: string; direction: SortDirection }>({ column: '', direction: '' });

  protected readonly columns = computed(() => ['indicator', 'baseline', ...this.runs().flatMap((run) => [`after:${run.runId}`, `difference:${run.runId}`])]);
  protected readonly groupColumns = computed(() => ['group-indicator', ...this.runs().map((run) => `group:${run.runId}`)]);
  protected readonly rows = computed(() => sortIndicators(this.indicators(), this.sort().column, this.sort().direction));

  protected sortBy(sort: Sort): void {
    this.sort.set({ column: sort.active, direction: sort.direction });
  }

  protected valueOf(row: ComparedIndicator, runId: string): ComparedIndicator['values'][number] | undefined {
    return row.values.find((v) => v.runId === runId);
  }

  protected unit(row: ComparedIndicator): string {
    const flowUnit = this.flowUnit();
    return flowUnit ? unitOf(row.key, flowUnit) : '';
  }

  protected name(row: ComparedIndicator): string {
    return INDICATOR_NAMES[row.key];
  }

  protected readonly figure = formatFigure;
  protected readonly change = formatChange;
}
