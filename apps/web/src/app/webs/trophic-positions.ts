import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';

export interface TrophicPosition {
  readonly id: string;
  readonly name: string;
  readonly kind: string;
  readonly trophicLevel: number;
  readonly cycled: number;
}

/** Each compartment's trophic level and cycled throughflow, in the order given (highest level first). */
@Component({
  selector: 'sw-trophic-positions',
  imports: [MatTableModule, DecimalPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="table-scroll" tabindex="0" role="region" aria-label="Trophic positions, scrollable">
      <table mat-table [dataSource]="positions()" class="positions" aria-label="Trophic positions">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef>Compartment</th>
          <td mat-cell *matCellDef="let row">{{ row.name }}</td>
        </ng-container>
        <ng-container matColumnDef="kind">
          <th mat-header-cell *matHeaderCellDef>Kind</th>
          <td mat-cell *matCellDef="let row">{{ row.kind }}</td>
        </ng-container>
        <ng-container matColumnDef="trophicLevel">
          <th mat-header-cell *matHeaderCellDef class="number">Trophic level</th>
          <td mat-cell *matCellDef="let row" class="number">{{ row.trophicLevel | number: '1.2-2' }}</td>
        </ng-container>
        <ng-container matColumnDef="cycled">
          <th mat-header-cell *matHeaderCellDef class="number">Cycled throughflow ({{ unit() }})</th>
          <td mat-cell *matCellDef="let row" class="number">{{ row.cycled | number: '1.1-1' }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </div>
  `,
  styles: `
    .table-scroll { position: relative; overflow-x: auto; }
    .positions { width: 100%; }
    .number { text-align: right; font-variant-numeric: tabular-nums; }
  `,
})
export class TrophicPositions {
  readonly positions = input.required<readonly TrophicPosition[]>();
  readonly unit = input.required<string>();
  protected readonly columns = ['name', 'kind', 'trophicLevel', 'cycled'];
}
