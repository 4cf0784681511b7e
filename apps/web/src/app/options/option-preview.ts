import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { OptionPreview } from '@seinework/contracts';
import { figure } from './figure';
import { KEY_INDICATORS } from './option-words';

/** The engine's deterministic run of an option in brief: key indicators and each fleet's catch, before and after. */
@Component({
  selector: 'sw-option-preview',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <table class="figures" aria-label="Key indicators, before and after">
      <thead>
        <tr><th scope="col">Indicator</th><th scope="col">Baseline</th><th scope="col">With the option</th><th scope="col">Difference</th></tr>
      </thead>
      <tbody>
        @for (row of indicators(); track row.key) {
          <tr>
            <th scope="row">{{ row.label }}</th>
            <td>{{ row.format(row.baseline) }}</td>
            <td>{{ row.format(row.option) }}</td>
            <td>{{ row.format(row.difference, true) }}</td>
          </tr>
        }
      </tbody>
    </table>
    <table class="figures" aria-label="Catch of each fleet, before and after">
      <thead>
        <tr><th scope="col">Fleet</th><th scope="col">Catch, baseline ({{ unit() }})</th><th scope="col">Catch with the option</th><th scope="col">Tonnes a year, before → after</th></tr>
      </thead>
      <tbody>
        @for (fleet of preview().fleets; track fleet.fleet) {
          <tr>
            <th scope="row">{{ fleet.fleet }}</th>
            <td>{{ figure(fleet.baseline?.catch ?? 0) }}</td>
            <td>{{ figure(fleet.option?.catch ?? 0) }}</td>
            <td>{{ tonnes(fleet.baseline?.tonnes) }} → {{ tonnes(fleet.option?.tonnes) }}</td>
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    .figures { border-collapse: collapse; width: 100%; margin-bottom: 16px; font-variant-numeric: tabular-nums; }
    th, td { padding: 6px 10px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: right; }
    th[scope='row'], thead th:first-child { text-align: left; font-weight: 400; }
    thead th { font-weight: 500; font-size: 0.8125rem; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class OptionPreviewTables {
  readonly preview = input.required<OptionPreview>();
  readonly unit = input.required<string>();

  protected readonly figure = figure;
  protected readonly indicators = computed(() =>
    KEY_INDICATORS.flatMap(({ key, label, inFlowUnit, share }) => {
      const row = this.preview().indicators.find((i) => i.key === key);
      if (!row) return [];
      // a share's difference is in percentage points
      const format = share ? (value: number | null, signed = false) => (value === null ? '—' : `${figure(100 * value, signed)} ${signed ? 'points' : '%'}`) : figure;
      return [{ ...row, label: inFlowUnit ? `${label} (${this.unit()})` : label, format }];
    }),
  );

  protected tonnes(value: number | null | undefined): string {
    return value === null || value === undefined ? '—' : Math.round(value).toLocaleString('en-GB');
  }
}
