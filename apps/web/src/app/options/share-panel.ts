import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { RunSummary, ShareSummary } from '@seinework/contracts';
import type { ShareRequest } from './options-api';

/** Sharing an option's run for council review or public comment, and withdrawing a share. */
@Component({
  selector: 'sw-share-panel',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './share-panel.html',
  styleUrl: './share-panel.scss',
})
export class SharePanel {
  readonly shares = input.required<readonly ShareSummary[]>();
  /** Finished runs, newest first: a share shows one of them. */
  readonly doneRuns = input.required<readonly RunSummary[]>();
  readonly disabled = input(false);
  readonly shared = output<ShareRequest>();
  readonly withdrawn = output<string>();

  protected readonly pickedRun = signal<string | null>(null);
  /** The day public comment closes (yyyy-mm-dd), optional. */
  protected readonly closesOn = signal('');
  protected readonly runId = computed(() => this.pickedRun() ?? this.doneRuns()[0]?.id ?? null);
  protected readonly sharedWith = computed(() => new Set(this.shares().map((s) => s.audience)));

  /** The run a share shows, in brief, when it is one of the finished runs listed. */
  protected shownRun(share: ShareSummary): string | null {
    const run = this.doneRuns().find((r) => r.id === share.runId);
    return run ? `${run.draws.toLocaleString('en-GB')} draws, seed ${run.seed}` : null;
  }

  protected runLabel(run: RunSummary): string {
    const when = new Date(run.finishedAt ?? run.createdAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });
    return `${run.draws.toLocaleString('en-GB')} draws, cv ${run.cv}, seed ${run.seed} — ${when} UTC`;
  }

  protected shareForReview(): void {
    const runId = this.runId();
    if (runId) this.shared.emit({ audience: 'council', runId });
  }

  protected openForComment(): void {
    const runId = this.runId();
    if (!runId) return;
    // the discussion stays open until the end of the chosen day
    const closesAt = this.closesOn() ? `${this.closesOn()}T23:59:59Z` : undefined;
    this.shared.emit({ audience: 'public', runId, ...(closesAt ? { closesAt } : {}) });
  }
}
