import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import { firstValueFrom } from 'rxjs';
import type { NotificationKind, NotificationPreferences } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { DiscussionApi } from './discussion-api';

const KINDS: readonly { kind: NotificationKind; label: string; hint: string }[] = [
  { kind: 'optionShared', label: 'An option was shared with you', hint: 'when an analyst shares a harvest option for your review or opens it for public comment' },
  { kind: 'newComment', label: 'A new comment on an option you follow', hint: 'you follow a discussion when you comment on it, or with its Follow button' },
  { kind: 'closingSoon', label: 'Public comment closes tomorrow', hint: 'a day before a discussion you follow or took part in closes' },
];

/** The account page's e-mail settings: each kind of notice on or off, saved as soon as it is switched. */
@Component({
  selector: 'sw-notification-settings',
  imports: [MatProgressBarModule, MatSlideToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 id="notifications-title">E-mail notifications</h2>
    @if (preferences(); as current) {
      <ul aria-labelledby="notifications-title">
        @for (item of kinds; track item.kind) {
          <li>
            <mat-slide-toggle [checked]="current[item.kind]" [disabled]="saving()" (change)="toggle(item.kind, $event)">{{ item.label }}</mat-slide-toggle>
            <span class="hint">{{ item.hint }}</span>
          </li>
        }
      </ul>
      <p class="hint">Every notice also carries a link that turns it off without signing in.</p>
    } @else if (!problem()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading your notification settings" />
    }
    @if (saved()) {
      <p class="done" role="status">Saved.</p>
    }
    @if (problem(); as message) {
      <p class="problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    ul { list-style: none; padding: 0; margin: 0; display: grid; gap: 12px; }
    li { display: grid; gap: 2px; }
    .hint { font-size: 0.8125rem; color: var(--mat-sys-on-surface-variant); margin-left: 52px; }
    p.hint { margin: 12px 0 0; }
    .done { color: var(--mat-sys-primary); }
    .problem { color: var(--mat-sys-error); }
  `,
})
export class NotificationSettings {
  private readonly api = inject(DiscussionApi);
  protected readonly kinds = KINDS;
  protected readonly preferences = signal<NotificationPreferences | null>(null);
  protected readonly saving = signal(false);
  protected readonly saved = signal(false);
  protected readonly problem = signal<string | null>(null);

  async ngOnInit(): Promise<void> {
    try {
      this.preferences.set(await firstValueFrom(this.api.notificationPreferences()));
    } catch (error) {
      this.problem.set(errorMessage(error));
    }
  }

  protected async toggle(kind: NotificationKind, change: MatSlideToggleChange): Promise<void> {
    const current = this.preferences();
    if (!current) return;
    this.saving.set(true);
    this.saved.set(false);
    this.problem.set(null);
    try {
      this.preferences.set(await firstValueFrom(this.api.saveNotificationPreferences({ ...current, [kind]: change.checked })));
      this.saved.set(true);
    } catch (error) {
      change.source.checked = current[kind];
      this.problem.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
