import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { CsvButton } from '../shared/csv-button';
import { HeatTable } from './heat-table';
import { fleetEffectsTable } from './result-tables';
import type { ScenarioDocument } from './result-document';

/** Mixed trophic impact of each fleet on each compartment after the option, as a heat map that is a table. */
@Component({
  selector: 'sw-fleet-effects',
  imports: [CsvButton, HeatTable],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="table-head">
      <h3>Effect of each fleet on each compartment</h3>
      <sw-csv-button [table]="table()" label="fleet effects" [prefix]="prefix()" />
    </div>
    <p class="note">
      What a small increase in a fleet's fishing does to each compartment through every food-web path together (mixed trophic
      impact, after the option, from −1 to +1): above zero the compartment gains, below zero it loses.
    </p>
    <sw-heat-table [table]="table()" [decimals]="3" label="Mixed trophic impact of each fleet on each compartment" />
  `,
  styleUrl: './result-tables.scss',
})
export class FleetEffects {
  readonly doc = input.required<ScenarioDocument>();
  readonly prefix = input('run');

  protected readonly table = computed(() => fleetEffectsTable(this.doc()));
}
