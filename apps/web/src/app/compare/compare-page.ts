import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../auth/session-store';
import { Caution } from '../shared/caution';
import { ComparisonCharts } from './comparison-charts';
import { CompareStore } from './compare-store';
import type { ComparedRun } from './compared-run';
import { IndicatorTable } from './indicator-table';
import { PreferencePanel } from './preference-panel';
import { RunPicker } from './run-picker';

/** `/compare`: choose options to compare; `/compare?runs=ID,ID,…`: the comparison (the URL is the whole state, to share). */
@Component({
  selector: 'sw-compare-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, Caution, ComparisonCharts, IndicatorTable, PreferencePanel, RunPicker],
  providers: [CompareStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './compare-page.html',
  styleUrl: './compare-page.scss',
})
export class ComparePage {
  /** Query parameter `?runs=`: the compared runs, comma-separated. */
  readonly runs = input<string>();
  /** Query parameters `?web=&version=`: what the picker starts on. */
  readonly web = input<string>();
  readonly version = input<string>();

  protected readonly store = inject(CompareStore);
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly runIds = computed(() =>
    (this.runs() ?? '')
      .split(',')
      .map((id) => id.trim())
      .filter((id) => id !== ''),
  );
  protected readonly compared = computed((): ComparedRun[] =>
    (this.store.comparison()?.runs ?? []).map((run, i) => ({ runId: run.id, letter: String.fromCharCode(65 + i), optionId: run.optionId, optionName: run.optionName })),
  );
  protected readonly baseline = computed(() => {
    const run = this.store.comparison()?.runs[0];
    const web = this.store.comparedWeb();
    if (!run || !web || web.id !== run.webId) return null;
    return { web, version: web.versions.find((v) => v.id === run.versionId) ?? null };
  });

  constructor() {
    effect(() => {
      const ids = this.runIds();
      untracked(() => {
        if (ids.length > 0) this.store.compare(ids);
        else this.store.loadWebs(this.web(), this.version());
      });
    });
  }

  protected compareRuns(runIds: readonly string[]): void {
    this.router.navigate(['/compare'], { queryParams: { runs: runIds.join(',') } });
  }

  /** Back to the picker, on this baseline, with these options ticked. */
  protected changeSelection(): void {
    const run = this.store.comparison()?.runs[0];
    this.router.navigate(['/compare'], { queryParams: run ? { web: run.webId, version: run.versionId } : {} });
  }

  protected async recordPreference(choice: { optionId: string; reason: string }): Promise<void> {
    await this.store.recordPreference(choice.optionId, choice.reason);
  }
}
