import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** What a list page shows instead of (or above) its table: loading, a problem with a retry, or nothing yet. */
@Component({
  selector: 'sw-list-state',
  imports: [MatButtonModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="'Loading the ' + what()" />
    }
    @if (error(); as problem) {
      <div class="problem" role="alert">
        <span>{{ problem }}</span>
        <button mat-button type="button" (click)="retry.emit()">Try again</button>
      </div>
    } @else if (empty()) {
      <p class="empty" role="status">{{ emptyText() }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .problem {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
      margin: 8px 0;
      padding: 8px 16px;
      border-radius: 8px;
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .empty {
      margin: 8px 0;
      padding: 24px;
      border-radius: 12px;
      text-align: center;
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ListState {
  readonly what = input.required<string>();
  readonly loading = input(false);
  readonly error = input<string | null>(null);
  readonly empty = input(false);
  readonly emptyText = input('Nothing here yet.');
  readonly retry = output();
}
