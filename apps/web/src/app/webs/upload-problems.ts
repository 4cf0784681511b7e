import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import type { UploadProblem } from '@seinework/contracts';

const TABLE_ORDER = ['file', 'web', 'compartments', 'flows', 'imports', 'exports', 'respiration'];

/** Why an upload was refused, one line per problem against the table, row and column of the file sent. */
@Component({
  selector: 'sw-upload-problems',
  imports: [MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="problems" role="alert" aria-labelledby="upload-problems-title">
      <h2 id="upload-problems-title" tabindex="-1">Nothing was stored: {{ headline() }}</h2>
      <p>Fix {{ problems().length === 1 ? 'it' : 'them' }} in your file and upload it again. Rows are counted as your spreadsheet shows them, the header row being row 1.</p>
      <div class="table-scroll" tabindex="0" role="region" aria-label="Problems, scrollable">
        <table mat-table [dataSource]="ordered()" aria-label="Problems found in the upload">
          <ng-container matColumnDef="table">
            <th mat-header-cell *matHeaderCellDef>Table</th>
            <td mat-cell *matCellDef="let p">{{ p.table }}</td>
          </ng-container>
          <ng-container matColumnDef="row">
            <th mat-header-cell *matHeaderCellDef class="number">Row</th>
            <td mat-cell *matCellDef="let p" class="number">{{ p.row ?? '—' }}</td>
          </ng-container>
          <ng-container matColumnDef="column">
            <th mat-header-cell *matHeaderCellDef>Column</th>
            <td mat-cell *matCellDef="let p">{{ p.column ?? '—' }}</td>
          </ng-container>
          <ng-container matColumnDef="problem">
            <th mat-header-cell *matHeaderCellDef>Problem</th>
            <td mat-cell *matCellDef="let p" class="problem">{{ p.problem }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let p; columns: columns"></tr>
        </table>
      </div>
    </section>
  `,
  styles: `
    .problems { border: 1px solid var(--mat-sys-error); border-radius: 12px; padding: 8px 16px 16px; margin: 24px 0; }
    h2 { font: var(--mat-sys-title-large); color: var(--mat-sys-error); margin: 8px 0; }
    .table-scroll { position: relative; overflow-x: auto; }
    table { width: 100%; }
    .number { text-align: right; font-variant-numeric: tabular-nums; width: 4em; }
    .problem { overflow-wrap: anywhere; }
  `,
})
export class UploadProblems {
  readonly problems = input.required<readonly UploadProblem[]>();
  protected readonly columns = ['table', 'row', 'column', 'problem'];

  protected readonly headline = computed(() => {
    const n = this.problems().length;
    return n === 1 ? 'one problem was found' : `${n} problems were found`;
  });

  /** Problems in the order of the file: table by table, row by row. */
  protected readonly ordered = computed(() => {
    const rank = (table: string) => {
      const k = TABLE_ORDER.indexOf(table);
      return k < 0 ? TABLE_ORDER.length : k;
    };
    return [...this.problems()].sort((a, b) => rank(a.table) - rank(b.table) || a.table.localeCompare(b.table) || (a.row ?? 0) - (b.row ?? 0));
  });
}
