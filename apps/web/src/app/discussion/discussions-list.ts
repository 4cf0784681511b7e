import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import type { DiscussionSummary } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { errorMessage } from '../webs/request-error';
import { DiscussionApi } from './discussion-api';

/** `/discussions`: every shared option the signed-in person may read, open ones first, with how much has been said. */
@Component({
  selector: 'sw-discussions-list',
  imports: [DatePipe, RouterLink, MatIconModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (!embedded()) {
      <h1>Discussions</h1>
    }
    @if (!embedded()) {
      <p class="explain">
        {{ readsCouncilReview() ? 'Harvest options shared for council review or opened for public comment.' : 'Harvest options opened for public comment.' }}
        Open a discussion to read the option's result and comment on the record.
      </p>
    }
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the discussions" />
    } @else if (error(); as message) {
      <p class="problem" role="alert">{{ message }}</p>
    } @else if (items().length === 0) {
      <p class="empty" role="status">Nothing is open for comment at the moment.</p>
    } @else {
      <ul class="cards">
        @for (item of items(); track item.shareId) {
          <li>
            <a class="card" [routerLink]="['/discussions', item.optionId]">
              <span class="name">{{ item.optionName }}</span>
              <span class="web">{{ item.webName }}</span>
              <span class="facts">
                <span class="badge" [class.public]="item.audience === 'public'">{{ item.audience === 'public' ? 'Public comment' : 'Council review' }}</span>
                @if (item.open) {
                  <span><mat-icon aria-hidden="true" inline>forum</mat-icon> Open{{ item.closesAt ? ' until ' + (item.closesAt | date: 'd MMM y' : 'UTC') : '' }}</span>
                } @else {
                  <span><mat-icon aria-hidden="true" inline>lock</mat-icon> Closed{{ item.closesAt ? ' on ' + (item.closesAt | date: 'd MMM y' : 'UTC') : '' }}</span>
                }
                <span>{{ item.comments }} {{ item.comments === 1 ? 'comment' : 'comments' }}</span>
              </span>
            </a>
          </li>
        }
      </ul>
    }
  `,
  styles: `
    :host { display: block; max-width: 960px; }
    h1 { font: var(--mat-sys-headline-medium); margin: 0 0 8px; }
    .explain { max-width: 72ch; color: var(--mat-sys-on-surface-variant); }
    .cards { list-style: none; padding: 0; display: grid; gap: 12px; }
    .card { display: grid; gap: 4px; padding: 16px; border-radius: 12px; background: var(--mat-sys-surface-container-low); color: inherit; text-decoration: none; border: 1px solid var(--mat-sys-outline-variant); }
    .card:hover, .card:focus-visible { background: var(--mat-sys-surface-container); }
    .name { font: var(--mat-sys-title-medium); color: var(--mat-sys-primary); overflow-wrap: anywhere; }
    .web { color: var(--mat-sys-on-surface-variant); }
    .facts { display: flex; flex-wrap: wrap; gap: 8px 20px; align-items: center; font-size: 0.875rem; }
    .badge { padding: 2px 10px; border-radius: 999px; background: var(--mat-sys-secondary-container); color: var(--mat-sys-on-secondary-container); }
    .badge.public { background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container); }
    .empty { padding: 24px; border-radius: 12px; text-align: center; background: var(--mat-sys-surface-container); color: var(--mat-sys-on-surface-variant); }
    .problem { color: var(--mat-sys-error); }
  `,
})
export class DiscussionsList {
  /** Inside another page (the welcome page) that has its own heading. */
  readonly embedded = input(false);
  private readonly api = inject(DiscussionApi);
  private readonly session = inject(SessionStore);
  /** Stakeholders read only what is open for public comment, never the council's review. */
  protected readonly readsCouncilReview = computed(() => this.session.can('options.read-shared') || this.session.can('options.read-all'));
  protected readonly items = signal<DiscussionSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  async ngOnInit(): Promise<void> {
    try {
      const { items } = await firstValueFrom(this.api.discussions());
      // open ones first, then the newest share
      this.items.set([...items].sort((a, b) => Number(b.open) - Number(a.open) || b.sharedAt.localeCompare(a.sharedAt)));
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.loading.set(false);
    }
  }
}
