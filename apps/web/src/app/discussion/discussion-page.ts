import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal, viewChild } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import type { CommentItem } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { anchorChoices } from './anchor-choices';
import { CommentCard } from './comment-card';
import { CommentForm, type CommentDraft } from './comment-form';
import { DiscussionStore } from './discussion-store';
import { HideDialog } from './hide-dialog';
import { sharedRunOf } from '../options/shared-run';

/**
 * `/discussions/:optionId`: the discussion of one shared option — the comments on the record,
 * replies one level deep, posting while the discussion is open, following by e-mail, and (staff)
 * hiding a comment with a reason. `?on=indicator:tst` starts a comment about that indicator.
 */
@Component({
  selector: 'sw-discussion-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, CommentCard, CommentForm],
  providers: [DiscussionStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './discussion-page.html',
  styleUrl: './discussion-page.scss',
})
export class DiscussionPage {
  readonly optionId = input.required<string>();
  /** `?on=kind:key` from a result page's "Comment on this". */
  readonly on = input<string | undefined>();

  protected readonly store = inject(DiscussionStore);
  protected readonly session = inject(SessionStore);
  private readonly dialog = inject(MatDialog);
  private readonly newComment = viewChild<CommentForm>('newComment');

  protected readonly replyingTo = signal<CommentItem | null>(null);
  protected readonly choices = computed(() => anchorChoices(this.store.web()));
  /** The run the reader's discussion shows (its share's), else any share's, else the newest run: comment anchors link into its result page. */
  protected readonly runId = computed(() => sharedRunOf(this.store.option(), this.store.discussion()?.audience) ?? this.store.option()?.latestRun?.id ?? null);
  protected readonly canPost = computed(() => this.session.can('comments.post') && (this.store.discussion()?.open ?? false));
  protected readonly canModerate = computed(() => this.session.can('comments.moderate'));
  protected readonly publicShare = computed(() => this.store.option()?.shares.find((s) => s.audience === 'public') ?? null);
  /** Whether the reader sees both discussions of the option (council review and public comment), shown on one page. */
  protected readonly twoDiscussions = computed(() => {
    const audiences = new Set<string>((this.store.option()?.shares ?? []).map((s) => s.audience));
    for (const comment of this.store.page()?.items ?? []) audiences.add(comment.audience);
    return audiences.size > 1;
  });

  ngOnInit(): void {
    void this.store.load(this.optionId());
  }

  protected async post(draft: CommentDraft): Promise<void> {
    if (await this.store.post(draft)) this.newComment()?.clear();
  }

  protected async postReply(draft: CommentDraft): Promise<void> {
    const parent = this.replyingTo();
    if (!parent) return;
    if (await this.store.post({ text: draft.text, parentId: parent.id })) this.replyingTo.set(null);
  }

  protected async hide(comment: CommentItem): Promise<void> {
    const reason = await firstValueFrom(this.dialog.open<HideDialog, unknown, string>(HideDialog, { width: '32rem' }).afterClosed());
    if (reason) await this.store.hide(comment.id, reason);
  }

  protected page(event: PageEvent): void {
    void this.store.showPage(event.pageIndex + 1);
  }
}
