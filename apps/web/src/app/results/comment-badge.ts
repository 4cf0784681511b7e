import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CommentAnchor } from '@seinework/contracts';
import { ResultCommentsStore } from './result-comments-store';
import { commentGroupId } from './result-comments';

/**
 * How many comments of the discussion point at this indicator or compartment, beside its row: a click
 * brings the reader to those comments further down the page. Shows nothing outside a result page or
 * when nobody has commented on it.
 */
@Component({
  selector: 'sw-comment-badge',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (count() > 0) {
      <button type="button" class="badge" (click)="show()" [attr.aria-label]="words() + ': show them'" [title]="words()">
        <mat-icon aria-hidden="true" inline>forum</mat-icon>{{ count() }}
      </button>
    }
  `,
  styles: `
    :host { display: inline; }
    .badge {
      display: inline-flex; align-items: center; gap: 2px; margin-left: 8px; padding: 0 8px;
      border: 0; border-radius: 10px; cursor: pointer; vertical-align: middle;
      font: var(--mat-sys-label-medium); line-height: 20px;
      background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container);
    }
    .badge:hover { background: var(--mat-sys-tertiary); color: var(--mat-sys-on-tertiary); }
    .badge:focus-visible { outline: 2px solid var(--mat-sys-primary); outline-offset: 2px; }
  `,
})
export class CommentBadge {
  readonly anchor = input.required<CommentAnchor>();
  private readonly comments = inject(ResultCommentsStore, { optional: true });

  protected readonly count = computed(() => this.comments?.countFor(this.anchor()) ?? 0);
  protected readonly words = computed(() => (this.count() === 1 ? '1 comment on this' : `${this.count()} comments on this`));

  protected show(): void {
    const group = document.getElementById(commentGroupId(this.anchor()));
    group?.scrollIntoView({ behavior: 'smooth', block: 'start' });
    group?.focus({ preventScroll: true });
  }
}
