import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import { COMMENTS_PAGE_SIZE, type CommentBody, type CommentItem, type CommentPage, type OptionDetail, type Web } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { WebsApi } from '../webs/webs-api';
import { DiscussionApi } from './discussion-api';

/** A comment with its replies on this page; `orphan` when its parent is on an earlier page. */
export interface Thread {
  comment: CommentItem;
  replies: CommentItem[];
  orphan: boolean;
}

/** Top-level comments in order, each with its replies; a reply whose parent is not on the page stands alone, marked. */
export function threads(items: readonly CommentItem[]): Thread[] {
  const byId = new Map<string, Thread>();
  const result: Thread[] = [];
  for (const comment of items) {
    const parent = comment.parentId ? byId.get(comment.parentId) : undefined;
    if (parent) {
      parent.replies.push(comment);
      continue;
    }
    const thread: Thread = { comment, replies: [], orphan: comment.parentId !== null };
    byId.set(comment.id, thread);
    result.push(thread);
  }
  return result;
}

interface DiscussionState {
  optionId: string | null;
  option: OptionDetail | null;
  /** The baseline's WEB.json, for the names of compartments comments point at. */
  web: Web | null;
  page: CommentPage | null;
  loading: boolean;
  error: string | null;
  /** A post, edit, hide or follow in flight. */
  busy: boolean;
  /** What the last post, edit, hide or follow did, or why it was refused. */
  notice: { kind: 'done' | 'problem'; text: string } | null;
}

/** One option's discussion: its comments page by page, posting, replying, editing, hiding and following. */
export const DiscussionStore = signalStore(
  withState<DiscussionState>({ optionId: null, option: null, web: null, page: null, loading: false, error: null, busy: false, notice: null }),
  withComputed(({ page }) => ({
    threads: computed(() => threads(page()?.items ?? [])),
    discussion: computed(() => page()?.discussion ?? null),
    pageCount: computed(() => Math.max(1, Math.ceil((page()?.total ?? 0) / (page()?.pageSize ?? COMMENTS_PAGE_SIZE)))),
  })),
  withMethods((store, api = inject(DiscussionApi), webs = inject(WebsApi)) => {
    const showPage = async (pageNumber: number): Promise<void> => {
      const optionId = store.optionId();
      if (!optionId) return;
      patchState(store, { page: await firstValueFrom(api.comments(optionId, pageNumber)) });
    };

    /**
     * Runs a change, then shows the page it should be seen on; a refusal is kept as a notice. Once the
     * change went through it counts as done, even if the list cannot be read again: saying "failed" then
     * would invite posting the same comment twice.
     */
    const change = async (work: () => Promise<unknown>, done: string, pageAfter: () => number): Promise<boolean> => {
      patchState(store, { busy: true, notice: null });
      try {
        await work();
      } catch (error) {
        patchState(store, { busy: false, notice: { kind: 'problem', text: errorMessage(error) } });
        return false;
      }
      try {
        await showPage(pageAfter());
        patchState(store, { busy: false, notice: { kind: 'done', text: done } });
      } catch (error) {
        patchState(store, { busy: false, notice: { kind: 'done', text: `${done} The comments could not be read again (${errorMessage(error)}): reload the page to see them.` } });
      }
      return true;
    };
    const currentPage = () => store.page()?.page ?? 1;
    const lastPageWithOneMore = () => Math.max(1, Math.ceil(((store.page()?.total ?? 0) + 1) / (store.page()?.pageSize ?? COMMENTS_PAGE_SIZE)));

    return {
      async load(optionId: string, pageNumber = 1): Promise<void> {
        patchState(store, { optionId, loading: true, error: null, notice: null });
        try {
          const [option, page] = await Promise.all([firstValueFrom(api.option(optionId)), firstValueFrom(api.comments(optionId, pageNumber))]);
          patchState(store, { option, page, loading: false });
          // the compartments' names are a nicety: the discussion reads without them
          try {
            const version = await firstValueFrom(webs.version(option.webId, option.versionId));
            patchState(store, { web: version.web });
          } catch {
            patchState(store, { web: null });
          }
        } catch (error) {
          patchState(store, { loading: false, error: errorMessage(error) });
        }
      },

      /** Another page of comments; a failure is a notice, the page shown and anything being typed stay. */
      async showPage(pageNumber: number): Promise<void> {
        patchState(store, { loading: true, notice: null });
        try {
          await showPage(pageNumber);
          patchState(store, { loading: false });
        } catch (error) {
          patchState(store, { loading: false, notice: { kind: 'problem', text: `That page of comments could not be loaded: ${errorMessage(error)}` } });
        }
      },

      /** A new comment (or reply) goes on the last page, where it is shown. */
      post(body: CommentBody): Promise<boolean> {
        const optionId = store.optionId();
        if (!optionId) return Promise.resolve(false);
        return change(() => firstValueFrom(api.post(optionId, body)), body.parentId ? 'Your reply was posted.' : 'Your comment was posted.', lastPageWithOneMore);
      },

      edit(commentId: string, text: string): Promise<boolean> {
        return change(() => firstValueFrom(api.edit(commentId, text)), 'Your comment was changed.', currentPage);
      },

      hide(commentId: string, reason: string): Promise<boolean> {
        return change(() => firstValueFrom(api.hide(commentId, reason)), 'The comment is hidden; its author and staff still see it, marked.', currentPage);
      },

      setFollowing(following: boolean): Promise<boolean> {
        const optionId = store.optionId();
        if (!optionId) return Promise.resolve(false);
        const done = following ? 'You will get an e-mail for each new comment.' : 'You no longer follow this discussion.';
        return change(() => firstValueFrom(api.follow(optionId, following)), done, currentPage);
      },
    };
  }),
);
