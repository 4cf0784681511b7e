import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ExportTable } from '../shared/table-export';
import { formatCell, formatValue } from './format';
import { heatColour, largestMagnitude } from './heat-colour';

/**
 * A heat map that is also its own text alternative: a table of signed numbers, each cell tinted
 * teal above zero and amber below by its size against the largest shown. The number is always
 * printed, so nothing is told by colour alone.
 */
@Component({
  selector: 'sw-heat-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="scroll" tabindex="0" role="region" [attr.aria-label]="label() + ', scrollable'">
      <table class="dense heat" [attr.aria-label]="label()">
        <thead>
          <tr>
            <th scope="col" class="corner">{{ corner() }}</th>
            @for (c of table().columns.slice(1); track $index) {
              <th scope="col" class="vertical"><span>{{ c }}</span></th>
            }
          </tr>
        </thead>
        <tbody>
          @for (row of table().rows; track $index) {
            <tr>
              <th scope="row">{{ row[0] }}</th>
              @for (cell of row.slice(1); track $index) {
                <td [style.background]="colour(cell)" [class.strong]="strong(cell)" [class.zero]="show(cell) === '0'">{{ show(cell) }}</td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
    <p class="key" aria-hidden="true">
      <span class="swatch" [style.background]="colourOf(-1)"></span> lowers
      <span class="swatch" [style.background]="colourOf(0)"></span> no effect
      <span class="swatch" [style.background]="colourOf(1)"></span> raises
      <span class="quiet">(darker = larger; largest shown {{ showExtent() }})</span>
    </p>
  `,
  styleUrl: './result-tables.scss',
  styles: `
    .corner { vertical-align: bottom; min-width: 10em; }
    table.dense.heat thead th.vertical { min-width: 0; }
    .vertical { height: 150px; vertical-align: bottom; text-align: center; padding: 4px 2px; }
    .vertical span { writing-mode: vertical-rl; transform: rotate(180deg); display: inline-block; text-align: left; white-space: nowrap; }
    table.dense.heat td { font-variant-numeric: tabular-nums; text-align: center; min-width: 3.6em; padding: 4px 3px; }
    .heat td.zero { color: var(--mat-sys-outline); }
    table.dense.heat td.strong { color: #fff; }
    .key { display: flex; align-items: center; gap: 6px; flex-wrap: wrap; font: var(--mat-sys-body-small); margin: 6px 0 0; }
    .swatch { display: inline-block; width: 14px; height: 14px; border: 1px solid var(--mat-sys-outline-variant); }
  `,
})
export class HeatTable {
  readonly table = input.required<ExportTable>();
  readonly label = input.required<string>();
  readonly decimals = input(2);
  readonly format = input<'percent' | 'number'>('number');

  protected readonly extent = computed(() => largestMagnitude(this.table().rows.flatMap((r) => r.slice(1).map((c) => (typeof c === 'number' ? c : null)))));

  /** The CSV's first column name, capitalised for the screen. */
  protected readonly corner = computed(() => {
    const name = this.table().columns[0] ?? '';
    return name.charAt(0).toUpperCase() + name.slice(1);
  });

  protected colour(cell: unknown): string {
    return heatColour(typeof cell === 'number' ? cell : null, this.extent());
  }
  protected colourOf(sign: number): string {
    return heatColour(sign * this.extent(), this.extent());
  }
  /** Dark cells get light figures so they stay legible. */
  protected strong(cell: unknown): boolean {
    return typeof cell === 'number' && this.extent() > 0 && Math.abs(cell) / this.extent() > 0.6;
  }
  protected show(cell: unknown): string {
    return formatCell(typeof cell === 'number' ? cell : null, this.format(), this.decimals());
  }
  protected showExtent(): string {
    return '±' + formatValue(this.extent(), this.format(), this.decimals() + 1);
  }
}
