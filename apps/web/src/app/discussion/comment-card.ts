import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { CommentItem, Web } from '@seinework/contracts';
import type { Role } from '@seinework/contracts/permissions';
import { RoleLabelPipe } from '../auth/role-label';
import { anchorElementId, anchorLabel } from './anchor-choices';
import { CommentForm, type CommentDraft } from './comment-form';
import { CommentText } from './comment-text';

/** One comment: who, when, what it is about, its text (or the mark of a hidden one), and what the reader may do with it. */
@Component({
  selector: 'sw-comment-card',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, RoleLabelPipe, CommentForm, CommentText],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let c = comment();
    <article class="comment" [class.hidden]="c.hidden" [attr.id]="'comment-' + c.id" [attr.aria-label]="'Comment by ' + c.author.name">
      <header>
        <span class="author">{{ c.author.name }}</span>
        <span class="role">{{ asRole(c.author.role) | roleLabel }}</span>
        <time [attr.datetime]="c.createdAt">{{ c.createdAt | date: 'd MMM y, HH:mm' : 'UTC' }} UTC</time>
        @if (c.editedAt) {
          <span class="quiet">(edited)</span>
        }
        @if (showAudience()) {
          <span class="badge" [class.public]="c.audience === 'public'">{{ c.audience === 'public' ? 'Public comment' : 'Council review' }}</span>
        }
      </header>
      @if (c.anchor; as anchor) {
        <p class="about">
          <mat-icon aria-hidden="true" inline>label</mat-icon>
          About
          @if (runId()) {
            <a [routerLink]="['/runs', runId()]" [fragment]="elementId(anchor)">{{ label(anchor) }}</a>
          } @else {
            {{ label(anchor) }}
          }
        </p>
      }
      @if (c.hidden) {
        <p class="hidden-mark" role="note">
          <mat-icon aria-hidden="true" inline>visibility_off</mat-icon>
          @if (c.text === null) {
            This comment was hidden by staff.
          } @else {
            Hidden by staff: only its author and staff see it.
            @if (c.hiddenReason) {
              <span class="reason">Reason: {{ c.hiddenReason }}</span>
            }
          }
        </p>
      }
      @if (editing()) {
        <sw-comment-form label="Your comment" submitLabel="Save changes" [initialText]="c.text ?? ''" [busy]="busy()" [cancellable]="true" (submitted)="saveEdit($event)" (cancelled)="editing.set(false)" />
      } @else if (c.text !== null) {
        <sw-comment-text [text]="c.text" />
      }
      @if (!editing()) {
        <div class="actions">
          @if (canReply() && !c.hidden) {
            <button mat-button type="button" (click)="reply.emit(c)"><mat-icon>reply</mat-icon> Reply</button>
          }
          @if (c.editable) {
            <button mat-button type="button" (click)="editing.set(true)"><mat-icon>edit</mat-icon> Edit</button>
          }
          @if (canModerate() && !c.hidden) {
            <button mat-button type="button" (click)="hide.emit(c)"><mat-icon>visibility_off</mat-icon> Hide</button>
          }
        </div>
      }
    </article>
  `,
  styles: `
    .comment {
      padding: 12px 16px;
      border-radius: 12px;
      background: var(--mat-sys-surface-container-low);
      display: grid;
      gap: 8px;
    }
    .comment.hidden {
      background: var(--mat-sys-surface-container-highest);
      border-left: 4px solid var(--mat-sys-outline);
    }
    header {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 12px;
      align-items: baseline;
    }
    .author {
      font-weight: 500;
      overflow-wrap: anywhere;
    }
    .role,
    time,
    .quiet {
      font-size: 0.8125rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .about,
    .hidden-mark {
      margin: 0;
      font-size: 0.875rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .hidden-mark .reason {
      display: block;
      margin-top: 2px;
      color: var(--mat-sys-on-surface);
      overflow-wrap: anywhere;
    }
    .badge {
      padding: 0 8px;
      border-radius: 999px;
      font-size: 0.75rem;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .badge.public {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .about a {
      color: var(--mat-sys-primary);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 4px;
      margin-left: -12px;
    }
  `,
})
export class CommentCard {
  readonly comment = input.required<CommentItem>();
  readonly web = input<Web | null>(null);
  /** The run the discussion is about: anchors link into its result page. */
  readonly runId = input<string | null>(null);
  /** Mark which discussion the comment belongs to (the page shows both of an option's discussions). */
  readonly showAudience = input(false);
  readonly canReply = input(false);
  readonly canModerate = input(false);
  readonly busy = input(false);
  readonly reply = output<CommentItem>();
  readonly hide = output<CommentItem>();
  readonly edit = output<{ comment: CommentItem; text: string }>();

  protected readonly editing = signal(false);
  protected readonly label = (anchor: NonNullable<CommentItem['anchor']>) => anchorLabel(anchor, this.web());
  protected readonly elementId = anchorElementId;
  protected readonly asRole = (role: string) => role as Role;

  protected saveEdit(draft: CommentDraft): void {
    this.edit.emit({ comment: this.comment(), text: draft.text });
    this.editing.set(false);
  }
}
