import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { CsvButton } from '../shared/csv-button';
import { formatAuto, formatValue } from './format';
import { recyclingTable, weakArcRows, weakArcTable } from './result-tables';
import type { ScenarioDocument } from './result-document';

/** Recycling: Finn cycling index before and after, and the weak arcs that close the web's cycles, weakest first. */
@Component({
  selector: 'sw-recycling-section',
  imports: [CsvButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="note">
      The Finn cycling index is the share of all material passing through the compartments that comes round again, e.g. through
      detritus. Each cycle of the web is held open by its weakest link (its smallest flow), the “weak arc”; the arcs below are taken
      away weakest first until no cycle is left.
    </p>
    <div class="table-head">
      <h3>Cycling, before → after</h3>
      <sw-csv-button [table]="summary()" label="the cycling figures" [prefix]="prefix()" />
    </div>
    <div class="scroll">
      <table class="dense summary" aria-label="Cycling before and after the option">
        <thead><tr><th scope="col">Measure</th><th scope="col">Before</th><th scope="col">After</th></tr></thead>
        <tbody>
          <tr><th scope="row">Finn cycling index</th><td>{{ pct(doc().baseline.finnCyclingIndex) }}</td><td>{{ pct(doc().option.finnCyclingIndex) }}</td></tr>
          <tr><th scope="row">Cycled against straight-through throughflow</th><td>{{ ratio(doc().baseline.finnCycledToStraightRatio) }}</td><td>{{ ratio(doc().option.finnCycledToStraightRatio) }}</td></tr>
          <tr><th scope="row">Simple cycles</th><td>{{ count('baseline') }}</td><td>{{ count('option') }}</td></tr>
        </tbody>
      </table>
    </div>
    @for (which of sides; track which) {
      <div class="table-head">
        <h3>Weak arcs {{ which === 'baseline' ? 'before' : 'after' }} the option</h3>
        <sw-csv-button [table]="arcTable(which)" [label]="'the weak arcs ' + (which === 'baseline' ? 'before' : 'after')" [prefix]="prefix()" />
      </div>
      @if (arcs(which).length === 0) {
        <p class="quiet">{{ doc()[which].cycles ? 'This web has no cycles.' : 'The cycle analysis is not in this result.' }}</p>
      } @else {
        <div class="scroll" tabindex="0" role="region" [attr.aria-label]="'Weak arcs ' + which + ', scrollable'">
          <table class="dense arcs" [attr.aria-label]="'Weak arcs and the cycles through them, ' + (which === 'baseline' ? 'before' : 'after') + ' the option'">
            <thead>
              <tr><th scope="col">Weak arc</th><th scope="col">Flow on it <span class="nowrap">({{ unit() }})</span></th><th scope="col">Cycles through it</th><th scope="col" class="text">Longest of those cycles</th></tr>
            </thead>
            <tbody>
              @for (r of arcs(which); track $index) {
                <tr>
                  <th scope="row">{{ r.from }} → {{ r.to }}</th>
                  <td>{{ flow(r.value) }}</td>
                  <td>{{ r.cycles }}</td>
                  <td class="wrap cycle">{{ r.longest }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
    }
  `,
  styleUrl: './result-tables.scss',
  styles: `
    table.summary { width: auto; min-width: min(100%, 560px); }
    table.dense td.cycle { min-width: 24em; }
  `,
})
export class RecyclingSection {
  readonly doc = input.required<ScenarioDocument>();
  readonly unit = input('');
  readonly prefix = input('run');

  protected readonly sides = ['baseline', 'option'] as const;
  protected readonly summary = computed(() => recyclingTable(this.doc()));
  private readonly before = computed(() => weakArcRows(this.doc(), 'baseline'));
  private readonly after = computed(() => weakArcRows(this.doc(), 'option'));

  protected arcs(which: 'baseline' | 'option') {
    return which === 'baseline' ? this.before() : this.after();
  }
  protected arcTable(which: 'baseline' | 'option') {
    return weakArcTable(this.arcs(which), which === 'baseline' ? 'before' : 'after');
  }
  protected count(which: 'baseline' | 'option'): string {
    const cycles = this.doc()[which].cycles;
    if (!cycles) return '—';
    return cycles.capped ? `at least ${cycles.count} (count capped)` : String(cycles.count);
  }
  protected pct(value: number): string {
    return formatValue(value, 'percent', 2);
  }
  protected ratio(value: number | undefined): string {
    return formatValue(value ?? null, 'number', 4);
  }
  protected flow(value: number): string {
    return formatAuto(value);
  }
}
