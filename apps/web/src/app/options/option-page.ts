import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { DatePipe, DecimalPipe } from '@angular/common';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../auth/session-store';
import { Caution } from '../shared/caution';
import { ConfirmDialog, type ConfirmRequest } from './confirm-dialog';
import { FINISHED, type RunSettings, type ShareRequest } from './options-api';
import { OptionStore } from './option-store';
import { adjustmentInWords, RESPONSE_RULES } from './option-words';
import { RunForm } from './run-form';
import { RunStatusChip } from './run-status';
import { SharePanel } from './share-panel';
import { sharedRunOf } from './shared-run';

/** One harvest option: what it does in words, its runs (the live one with its progress), sharing, duplicating and deleting. */
@Component({
  selector: 'sw-option-page',
  imports: [DatePipe, DecimalPipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, Caution, RunForm, RunStatusChip, SharePanel],
  providers: [OptionStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './option-page.html',
  styleUrl: './option-page.scss',
})
export class OptionPage {
  /** Route parameter `:id`. */
  readonly id = input.required<string>();

  protected readonly store = inject(OptionStore);
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly title = inject(Title);

  protected readonly adjustments = computed(() => (this.store.detail()?.option.adjustments ?? []).map((a) => adjustmentInWords(a, this.store.web())));
  protected readonly rule = computed(() => RESPONSE_RULES.find((r) => r.rule === this.store.detail()?.response));
  /** The run a brief is printed for: the one shared with the council or the public, else the latest finished one. */
  protected readonly briefRun = computed(() => sharedRunOf(this.store.detail()) ?? this.store.doneRuns()[0]?.id ?? null);
  protected readonly liveUnfinished = computed(() => {
    const run = this.store.liveRun();
    return run && !FINISHED.has(run.status) ? run : null;
  });

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.store.load(id));
    });
    effect(() => {
      const name = this.store.detail()?.name;
      if (name) this.title.setTitle(`${name} — Seinework`);
    });
  }

  protected percentDone(run: { progress: { done: number; total: number } }): number {
    return run.progress.total > 0 ? (100 * run.progress.done) / run.progress.total : 0;
  }

  protected runOption(settings: RunSettings): void {
    void this.store.startRun(settings);
  }

  protected shareOption(request: ShareRequest): void {
    void this.store.share(request);
  }

  protected async duplicateOption(): Promise<void> {
    const id = await this.store.duplicate();
    if (id) void this.router.navigate(['/options', id, 'edit']);
  }

  protected deleteOption(): void {
    const detail = this.store.detail();
    if (!detail) return;
    this.dialog
      .open<ConfirmDialog, ConfirmRequest, boolean>(ConfirmDialog, {
        data: { title: 'Delete this harvest option?', message: `“${detail.name}”, its runs and its shares will be deleted. This cannot be undone.`, confirm: 'Delete' },
        width: 'min(480px, 95vw)',
      })
      .afterClosed()
      .subscribe(async (confirmed) => {
        if (confirmed && (await this.store.remove())) void this.router.navigate(['/webs', detail.webId], { queryParams: { version: detail.versionId } });
      });
  }
}
