import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { CommentAnchor, Web } from '@seinework/contracts';
import type { Role } from '@seinework/contracts/permissions';
import { RoleLabelPipe } from '../auth/role-label';
import { anchorElementId, anchorLabel } from '../discussion/anchor-choices';
import { CommentText } from '../discussion/comment-text';
import { ResultCommentsStore } from './result-comments-store';

/** The id of the block of comments about one anchor, which the badges beside the rows jump to. */
export function commentGroupId(anchor: CommentAnchor): string {
  return `comments-${anchorElementId(anchor)}`;
}

/**
 * "Comments on this result": the discussion's comments that point at an indicator or a compartment,
 * grouped by what they point at, each group linking back to its row and on to the discussion.
 * Reading only: replying, editing and moderating happen on the discussion page.
 */
@Component({
  selector: 'sw-result-comments',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, RoleLabelPipe, CommentText],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="note">
      @if (store.anchoredCount() === 0) {
        No comment in this option's discussion points at an indicator or a compartment yet.
      } @else {
        {{ store.anchoredCount() === 1 ? 'One comment' : store.anchoredCount() + ' comments' }} of this option's discussion
        {{ store.anchoredCount() === 1 ? 'is' : 'are' }} about an indicator or a compartment of the result (replies go with what they answer);
        the <mat-icon aria-hidden="true" inline>forum</mat-icon> marks beside the rows above lead here.
      }
      @if (store.unanchoredCount() > 0) {
        {{ store.unanchoredCount() === 1 ? 'One more comment is' : store.unanchoredCount() + ' more comments are' }} about the option as a whole.
      }
      @if (sharedRunId() && sharedRunId() !== runId()) {
        The discussion is about <a [routerLink]="['/runs', sharedRunId()]">the run shared with it</a>, not necessarily this one.
      }
    </p>
    <p><a mat-stroked-button [routerLink]="['/discussions', optionId()]"><mat-icon aria-hidden="true">forum</mat-icon> Open the discussion</a></p>
    @for (group of store.groups(); track group.token) {
      <section class="group" [id]="groupId(group.anchor)" tabindex="-1" [attr.aria-label]="'Comments about ' + label(group.anchor)">
        <div class="group-head">
          <h3>About {{ label(group.anchor) }}</h3>
          <button mat-button type="button" (click)="showInResult(group.anchor)"><mat-icon aria-hidden="true">north</mat-icon> Show it in the result</button>
          <a mat-button [routerLink]="['/discussions', optionId()]" [queryParams]="{ on: group.token }"><mat-icon aria-hidden="true">reply</mat-icon> Comment on it in the discussion</a>
        </div>
        <ol class="comments">
          @for (c of group.comments; track c.id) {
            <li class="comment" [class.hidden]="c.hidden">
              <header>
                <span class="author">{{ c.author.name }}</span>
                <span class="quiet">{{ asRole(c.author.role) | roleLabel }}</span>
                <time class="quiet" [attr.datetime]="c.createdAt">{{ c.createdAt | date: 'd MMM y, HH:mm' : 'UTC' }} UTC</time>
                @if (c.parentId) {
                  <span class="quiet">(a reply)</span>
                }
              </header>
              @if (c.hidden) {
                <p class="quiet" role="note"><mat-icon aria-hidden="true" inline>visibility_off</mat-icon> Hidden by staff{{ c.hiddenReason ? ': ' + c.hiddenReason : '' }}. Only its author and staff see it.</p>
              }
              <sw-comment-text [text]="c.text ?? ''" />
            </li>
          }
        </ol>
      </section>
    }
  `,
  styles: `
    :host { display: block; }
    .note { max-width: 80ch; }
    .group { margin: 16px 0; padding: 4px 0; border-radius: 8px; scroll-margin-top: 72px; }
    .group:focus { outline: 2px solid var(--mat-sys-primary); outline-offset: 4px; }
    .group-head { display: flex; flex-wrap: wrap; align-items: center; gap: 4px 12px; }
    .group-head h3 { margin: 0; font: var(--mat-sys-title-medium); overflow-wrap: anywhere; }
    .comments { list-style: none; margin: 8px 0 0; padding: 0; display: grid; gap: 8px; max-width: 90ch; }
    .comment { padding: 10px 14px; border-radius: 12px; background: var(--mat-sys-surface-container-low); display: grid; gap: 6px; }
    .comment.hidden { background: var(--mat-sys-surface-container-highest); border-left: 4px solid var(--mat-sys-outline); }
    header { display: flex; flex-wrap: wrap; gap: 4px 12px; align-items: baseline; }
    .author { font-weight: 500; overflow-wrap: anywhere; }
    .quiet { margin: 0; font-size: 0.8125rem; color: var(--mat-sys-on-surface-variant); }
    a:not([mat-button]):not([mat-stroked-button]) { color: var(--mat-sys-primary); }
  `,
})
export class ResultComments {
  readonly optionId = input.required<string>();
  readonly runId = input.required<string>();
  /** The run the option was shared with, when there is one. */
  readonly sharedRunId = input<string | null>(null);
  /** The baseline, for the names of compartments. */
  readonly web = input<Web | null>(null);

  protected readonly store = inject(ResultCommentsStore);

  protected label(anchor: CommentAnchor): string {
    return anchorLabel(anchor, this.web());
  }

  protected groupId(anchor: CommentAnchor): string {
    return commentGroupId(anchor);
  }

  protected asRole(role: string): Role {
    return role as Role;
  }

  /** Back up to the row the comments are about; the fishing-in-balance index lives in the fleet section. */
  protected showInResult(anchor: CommentAnchor): void {
    const row = document.getElementById(anchorElementId(anchor)) ?? (anchor.key === 'fishingInBalance' ? document.getElementById('fleets') : null);
    row?.scrollIntoView({ behavior: 'smooth', block: 'center' });
    markPointedAt(row);
  }
}

/** Briefly marks the row a reader was sent to, so the eye finds it after the scroll. */
export function markPointedAt(element: HTMLElement | null): void {
  if (!element) return;
  element.classList.remove('pointed-at');
  void element.offsetWidth; // restart the fade when the same row is pointed at twice
  element.classList.add('pointed-at');
}
