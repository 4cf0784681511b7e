import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe, PercentPipe } from '@angular/common';
import type { CompartmentBalance } from './imbalance';

/** Each compartment's inputs against its outputs, as the editor's tables stand; out-of-balance rows stand out. */
@Component({
  selector: 'sw-imbalance-panel',
  imports: [DecimalPipe, PercentPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="imbalance-title" class="panel">
      <h2 id="imbalance-title">Balance of each compartment</h2>
      <p class="summary" role="status" aria-live="polite">
        @if (unbalancedCount() === 0) {
          <span class="ok">Every compartment is balanced: inputs equal outputs.</span>
        } @else {
          <span class="bad">{{ unbalancedCount() }} of {{ balances().length }} compartments {{ unbalancedCount() === 1 ? 'is' : 'are' }} out of balance.</span>
        }
      </p>
      <div class="table-scroll" tabindex="0" role="region" aria-label="Balance table, scrollable">
        <table aria-label="Balance of each compartment">
          <thead>
            <tr>
              <th scope="col">Compartment</th>
              <th scope="col" class="number">Inputs</th>
              <th scope="col" class="number">Outputs</th>
              <th scope="col" class="number">Difference</th>
              <th scope="col" class="number">Share</th>
            </tr>
          </thead>
          <tbody>
            @for (b of balances(); track b.id) {
              <tr [class.over]="b.overTolerance">
                <th scope="row">{{ b.name || b.id }}</th>
                <td class="number">{{ b.inputs | number: '1.0-3' }}</td>
                <td class="number">{{ b.outputs | number: '1.0-3' }}</td>
                <td class="number">{{ b.imbalance | number: '1.0-3' }}</td>
                <td class="number">
                  @if (b.overTolerance) {
                    <span class="visually-hidden">out of balance by </span>{{ b.relative | percent: '1.1-1' }}
                  } @else {
                    balanced
                  }
                </td>
              </tr>
            }
          </tbody>
        </table>
      </div>
      <p class="help">Inputs are imports and flows in; outputs are flows out, exports and respiration (in {{ unit() }}). The difference is inputs − outputs; its share is taken of the larger side.</p>
    </section>
  `,
  styles: `
    .panel { background: var(--mat-sys-surface-container-low); border-radius: 12px; padding: 4px 16px 12px; }
    h2 { font: var(--mat-sys-title-medium); margin: 12px 0 4px; }
    .summary { margin: 0 0 8px; }
    .ok { color: #2e6b30; font-weight: 500; }
    .bad { color: var(--mat-sys-error); font-weight: 500; }
    .table-scroll { position: relative; overflow-x: auto; }
    table { border-collapse: collapse; width: 100%; font-size: 0.875rem; }
    th, td { padding: 4px 6px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: left; font-weight: normal; }
    thead th { font-weight: 500; color: var(--mat-sys-on-surface-variant); }
    .number { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
    tr.over { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); }
    tr.over th { font-weight: 500; }
    .help { font-size: 0.8125rem; color: var(--mat-sys-on-surface-variant); }
    .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
  `,
})
export class ImbalancePanel {
  readonly balances = input.required<readonly CompartmentBalance[]>();
  readonly unit = input.required<string>();
  protected readonly unbalancedCount = computed(() => this.balances().filter((b) => b.overTolerance).length);
}
