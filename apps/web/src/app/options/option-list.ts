import { ChangeDetectionStrategy, Component, effect, inject, input, untracked } from '@angular/core';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../auth/session-store';
import { OptionListStore, COMPARE_MAX, COMPARE_MIN } from './option-list-store';
import { responseLabel } from './option-words';
import { RunStatusChip } from './run-status';

/** The harvest options built on one published version, with picking for a comparison. */
@Component({
  selector: 'sw-option-list',
  imports: [RouterLink, MatButtonModule, MatCheckboxModule, MatIconModule, MatProgressBarModule, RunStatusChip],
  providers: [OptionListStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './option-list.html',
  styleUrl: './option-list.scss',
})
export class OptionList {
  readonly webId = input.required<string>();
  readonly versionId = input.required<string>();
  readonly versionNumber = input.required<number>();

  protected readonly store = inject(OptionListStore);
  protected readonly session = inject(SessionStore);
  protected readonly responseLabel = responseLabel;
  protected readonly compareMin = COMPARE_MIN;
  protected readonly compareMax = COMPARE_MAX;

  constructor() {
    effect(() => {
      const webId = this.webId();
      const versionId = this.versionId();
      untracked(() => this.store.load(webId, versionId));
    });
  }

  private readonly router = inject(Router);

  protected compareOptions(): void {
    if (this.store.canCompare()) this.router.navigate(['/compare'], { queryParams: { runs: this.store.compareRuns().join(',') } });
  }
}
