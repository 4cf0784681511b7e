import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { VersionStatus } from '@seinework/contracts';

/** A version's status as a small label: drafts in a quiet tone, published versions in the accent. */
@Component({
  selector: 'sw-version-status',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<span class="status" [class.published]="status() === 'published'">{{ status() === 'published' ? 'Published' : 'Draft' }}</span>`,
  styles: `
    .status {
      display: inline-block;
      padding: 2px 10px;
      border-radius: 12px;
      font-size: 0.8125rem;
      font-weight: 500;
      line-height: 1.5;
      white-space: nowrap;
      background: var(--mat-sys-surface-container-highest);
      color: var(--mat-sys-on-surface-variant);
    }
    .published { background: #cfe6e4; color: #00504f; }
  `,
})
export class VersionStatusChip {
  readonly status = input.required<VersionStatus>();
}
