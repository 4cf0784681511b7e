import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { downloadCsv, type ExportTable } from './table-export';

/** "Download CSV" for one table, beside its title. */
@Component({
  selector: 'sw-csv-button',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<button mat-button type="button" (click)="download()" [attr.aria-label]="'Download ' + label() + ' as CSV'">
    <mat-icon>download</mat-icon> CSV
  </button>`,
})
export class CsvButton {
  readonly table = input.required<ExportTable>();
  readonly label = input.required<string>();
  readonly prefix = input('run');

  protected download(): void {
    downloadCsv(this.table(), this.prefix());
  }
}
