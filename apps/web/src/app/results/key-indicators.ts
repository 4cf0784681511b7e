import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { CsvButton } from '../shared/csv-button';
import { CommentBadge } from './comment-badge';
import { DifferenceBand } from './difference-band';
import { formatValue } from './format';
import { HEADLINE_KEYS } from './indicator-labels';
import { indicatorTable, type IndicatorRow } from './result-tables';

/** Before, after and the difference of each key indicator, with its 5–95 % band and the robust mark. */
@Component({
  selector: 'sw-key-indicators',
  imports: [MatCardModule, MatIconModule, CsvButton, CommentBadge, DifferenceBand],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="cards" aria-label="Key indicators">
      @for (row of headline(); track row.key) {
        <mat-card appearance="outlined" [id]="'indicator-card-' + row.key" class="card" [class.robust-card]="row.robust">
          <mat-card-header>
            <mat-card-title>{{ row.name }}<sw-comment-badge [anchor]="{ kind: 'indicator', key: row.key }" /></mat-card-title>
            <mat-card-subtitle>{{ row.meaning }}</mat-card-subtitle>
          </mat-card-header>
          <mat-card-content>
            <p class="figures">
              <span class="before"><small>Before</small>{{ show(row, row.baseline) }}</span>
              <span class="arrow" aria-hidden="true">→</span>
              <span class="after"><small>After</small>{{ show(row, row.option) }}</span>
              @if (unitOf(row)) {
                <span class="unit">{{ unitOf(row) }}</span>
              }
            </p>
            <p class="change">
              Change <strong>{{ show(row, row.difference, true) }}</strong>
              @if (row.robust) {
                <span class="mark" title="The 5–95 % band of the change excludes zero"><mat-icon aria-hidden="true" inline>verified</mat-icon> Robust</span>
              } @else if (row.band) {
                <span class="not-robust" title="The 5–95 % band of the change includes zero"><mat-icon aria-hidden="true" inline>help</mat-icon> Direction uncertain</span>
              }
            </p>
            @if (row.band; as band) {
              <div class="band">
                <sw-difference-band [band]="band" [robust]="row.robust" />
                <span>9 draws in 10 put the change between {{ show(row, band.p5, true) }} and {{ show(row, band.p95, true) }}</span>
              </div>
            } @else {
              <p class="band">No draws were run: no band.</p>
            }
          </mat-card-content>
        </mat-card>
      }
    </section>
    <p class="legend">
      <strong>How to read this.</strong> “Before” is the baseline web, “after” the web once the option is applied.
      @if (draws()) {
        The bar is the band in which 90 % of the {{ draws() }} draws put the change (from the 5 % to the 95 % draw), the dark tick its middle draw,
        and the dashed line is no change.
        <span class="mark"><mat-icon aria-hidden="true" inline>verified</mat-icon> Robust</span> means the whole band lies on one side of zero: the direction of the change holds across the uncertainty in the data.
        <span class="not-robust"><mat-icon aria-hidden="true" inline>help</mat-icon> Direction uncertain</span> means the band includes zero: the data cannot tell whether the indicator goes up or down.
      } @else {
        This run had no uncertainty draws, so no band can say whether a change is robust.
      }
    </p>
    <div class="table-head">
      <h3>Every indicator</h3>
      <sw-csv-button [table]="table()" label="every indicator" [prefix]="prefix()" />
    </div>
    <div class="scroll" tabindex="0" role="region" aria-label="Every indicator, scrollable">
      <table class="dense" aria-label="Every indicator before and after the option">
        <thead>
          <tr><th scope="col">Indicator</th><th scope="col">Before</th><th scope="col">After</th><th scope="col">Change</th><th scope="col">5–95 % band of the change</th><th scope="col">Robust</th></tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.key) {
            <tr [id]="'indicator-' + row.key">
              <th scope="row" [title]="row.meaning">{{ row.name }}<sw-comment-badge [anchor]="{ kind: 'indicator', key: row.key }" /></th>
              <td>{{ show(row, row.baseline) }}</td>
              <td>{{ show(row, row.option) }}</td>
              <td>{{ show(row, row.difference, true) }}</td>
              <td>@if (row.band; as band) { {{ show(row, band.p5, true) }} to {{ show(row, band.p95, true) }} } @else { — }</td>
              <td>@if (row.robust) { <span class="mark"><mat-icon aria-hidden="true" inline>verified</mat-icon> Robust</span> } @else if (row.band) { <span class="not-robust">No: band includes zero</span> } @else { — }</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './result-tables.scss',
  styles: `
    .cards { display: grid; grid-template-columns: repeat(auto-fit, minmax(280px, 1fr)); gap: 16px; }
    .figures { display: flex; align-items: flex-end; gap: 12px; margin: 12px 0 4px; font: var(--mat-sys-headline-medium); }
    .figures small { display: block; font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    .after { color: var(--mat-sys-primary); }
    .arrow { color: var(--mat-sys-outline); }
    .change { font: var(--mat-sys-title-medium); margin: 4px 0; }
    .band { display: flex; flex-direction: column; gap: 2px; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); margin: 8px 0 0; }
    .change .mark, .change .not-robust { margin-left: 10px; font: var(--mat-sys-label-large); }
    .unit { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); align-self: flex-end; padding-bottom: 4px; }
    .robust-card { border-color: var(--mat-sys-primary); }
    .legend { font: var(--mat-sys-body-medium); max-width: 80ch; }
  `,
})
export class KeyIndicators {
  readonly rows = input.required<readonly IndicatorRow[]>();
  readonly draws = input<number | null>(null);
  readonly prefix = input('run');
  /** The web's unit of flows, shown beside the amounts that are in it. */
  readonly unit = input('');

  protected readonly headline = computed(() => HEADLINE_KEYS.map((k) => this.rows().find((r) => r.key === k)).filter((r): r is IndicatorRow => !!r));
  protected readonly table = computed(() => indicatorTable(this.rows()));

  protected unitOf(row: IndicatorRow): string {
    return row.key === 'totalCatch' || row.key === 'primaryProductionRequired' ? this.unit() : '';
  }

  protected show(row: IndicatorRow, value: number | null | undefined, signed = false): string {
    return formatValue(value, row.format, row.decimals, signed);
  }
}
