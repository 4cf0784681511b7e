import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { CsvButton } from '../shared/csv-button';
import { CommentBadge } from './comment-badge';
import { formatValue } from './format';
import { positionTable, type PositionRow } from './result-tables';

/** Each compartment's trophic position before and after, highest first. Rows carry `compartment-<id>` for comment anchors. */
@Component({
  selector: 'sw-positions-table',
  imports: [CsvButton, CommentBadge],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="table-head">
      <h3>Trophic positions</h3>
      <sw-csv-button [table]="table()" label="the trophic positions" [prefix]="prefix()" />
    </div>
    <p class="note">How many feeding steps above plants and detritus each compartment eats, on average (1 = plants and detritus).</p>
    <div class="scroll" tabindex="0" role="region" aria-label="Trophic positions, scrollable">
      <table class="dense positions" aria-label="Trophic positions before and after the option">
        <thead>
          <tr><th scope="col">Compartment</th><th scope="col">Before</th><th scope="col">After</th><th scope="col">Change</th></tr>
        </thead>
        <tbody>
          @for (r of rows(); track r.id) {
            <tr [id]="'compartment-' + r.id">
              <th scope="row">{{ r.name }}<sw-comment-badge [anchor]="{ kind: 'compartment', key: r.id }" /></th>
              <td>{{ n(r.before) }}</td>
              <td>{{ n(r.after) }}</td>
              <td>{{ n(r.change, true) }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './result-tables.scss',
  styles: `table.positions { width: auto; min-width: min(100%, 560px); }`,
})
export class PositionsTable {
  readonly rows = input.required<readonly PositionRow[]>();
  readonly prefix = input('run');

  protected readonly table = computed(() => positionTable(this.rows()));
  protected n(value: number, signed = false): string {
    return formatValue(value, 'number', signed ? 4 : 2, signed);
  }
}
