import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { DecimalPipe, PercentPipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import type { BalancePreview } from '@seinework/contracts';

const KIND_LABEL = { flow: 'Flow', import: 'Import', export: 'Export', respiration: 'Respiration' } as const;

/** What a balancing would change, number by number, with the choice to take it into the tables or not. */
@Component({
  selector: 'sw-balance-changes',
  imports: [DecimalPipe, PercentPipe, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="balance-changes-title" class="changes">
      <h3 id="balance-changes-title">What balancing would change</h3>
      @if (preview().wasBalanced) {
        <p>The web was already balanced: nothing changes.</p>
      } @else if (rows().length === 0) {
        <p>No number changes by more than rounding.</p>
      } @else {
        <p>{{ rows().length }} {{ rows().length === 1 ? 'number changes' : 'numbers change' }}. Nothing is saved until you take the changes and save a new draft.</p>
        <div class="table-scroll" tabindex="0" role="region" aria-label="Changes made by balancing, scrollable">
          <table aria-label="Changes made by balancing">
            <thead>
              <tr>
                <th scope="col">What</th>
                <th scope="col">From</th>
                <th scope="col">To</th>
                <th scope="col" class="number">Before</th>
                <th scope="col" class="number">After</th>
                <th scope="col" class="number">Change</th>
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track $index) {
                <tr>
                  <td>{{ row.what }}</td>
                  <td>{{ row.from }}</td>
                  <td>{{ row.to }}</td>
                  <td class="number">{{ row.before | number: '1.0-3' }}</td>
                  <td class="number">{{ row.after | number: '1.0-3' }}</td>
                  <td class="number">{{ row.relative === null ? 'new' : (row.relative | percent: '1.1-1') }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
      <div class="actions">
        @if (!preview().wasBalanced) {
          <button mat-flat-button type="button" (click)="accept.emit()">Take these changes</button>
        }
        <button mat-button type="button" (click)="discard.emit()">{{ preview().wasBalanced ? 'Close' : 'Discard' }}</button>
      </div>
    </section>
  `,
  styles: `
    .changes { border: 1px solid var(--mat-sys-primary); border-radius: 12px; padding: 4px 16px 12px; margin-top: 12px; }
    h3 { font: var(--mat-sys-title-medium); margin: 12px 0 4px; }
    .table-scroll { position: relative; overflow-x: auto; max-height: 360px; }
    table { border-collapse: collapse; width: 100%; font-size: 0.875rem; }
    th, td { padding: 4px 8px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: left; }
    thead th { font-weight: 500; color: var(--mat-sys-on-surface-variant); position: sticky; top: 0; background: var(--mat-sys-surface); }
    .number { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
    .actions { display: flex; gap: 8px; margin-top: 12px; }
  `,
})
export class BalanceChanges {
  readonly preview = input.required<BalancePreview>();
  /** Compartment names by id, to show names rather than ids. */
  readonly names = input.required<ReadonlyMap<string, string>>();
  readonly accept = output<void>();
  readonly discard = output<void>();

  protected readonly rows = computed(() => {
    const name = (id: string | null) => (id === null ? 'outside' : (this.names().get(id) ?? id));
    return this.preview().changes.map((c) => ({
      what: c.fleet ? `Harvest by ${c.fleet}` : KIND_LABEL[c.kind],
      from: c.kind === 'import' ? 'outside' : name(c.from),
      to: c.kind === 'export' || c.kind === 'respiration' ? 'outside' : name(c.to),
      before: c.before,
      after: c.after,
      relative: c.before === 0 ? null : (c.after - c.before) / c.before,
    }));
  });
}
