import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { RunStatus } from '@seinework/contracts';

const WORDS: Record<RunStatus, string> = { queued: 'Waiting to run', running: 'Running', done: 'Done', failed: 'Failed', cancelled: 'Cancelled' };

/** A run's status as a small coloured label. */
@Component({
  selector: 'sw-run-status',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<span class="chip" [class]="status() ?? 'none'">{{ words() }}</span>`,
  styles: `
    .chip { display: inline-block; padding: 2px 10px; border-radius: 12px; font-size: 0.8125rem; white-space: nowrap; background: var(--mat-sys-surface-container-high); }
    .done { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    .running, .queued { background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container); }
    .failed { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); }
  `,
})
export class RunStatusChip {
  /** null: the option was never run. */
  readonly status = input.required<RunStatus | null>();
  protected readonly words = computed(() => {
    const status = this.status();
    return status ? WORDS[status] : 'Not run yet';
  });
}
