import { computed, inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { CommentAnchor, CommentItem } from '@seinework/contracts';
import { anchorToken } from '../discussion/anchor-choices';
import { DiscussionApi } from '../discussion/discussion-api';
import { errorMessage } from '../webs/request-error';

/** A result page reads at most this many pages of comments (50 each) to place them beside their rows. */
const MAX_PAGES = 20;

/** The comments of the discussion that point at one indicator or compartment, oldest first. */
export interface AnchoredGroup {
  token: string;
  anchor: CommentAnchor;
  comments: CommentItem[];
}

interface ResultCommentsState {
  optionId: string | null;
  items: CommentItem[];
  total: number;
  /** False when the reader has no discussion of this option to see (never shared, or not with them): the page then shows nothing of it. */
  available: boolean;
  loading: boolean;
  error: string | null;
}

const initial: ResultCommentsState = { optionId: null, items: [], total: 0, available: false, loading: false, error: null };

/**
 * The comments of an option's discussion that point at something in its result, for the result page to show
 * beside the indicator or compartment they are about. Comments whose text the reader may not see (hidden by
 * staff, not theirs) are left out: a badge counting words nobody can read would only puzzle.
 */
export const ResultCommentsStore = signalStore(
  withState<ResultCommentsState>(initial),
  withComputed(({ items }) => {
    const readable = computed(() => items().filter((c) => c.text !== null));
    /** What a comment is about: its own anchor, or for a reply its parent's (the answer to a question about the catch is about the catch). */
    const aboutOf = computed(() => {
      const anchorOf = new Map(items().map((c) => [c.id, c.anchor]));
      return (comment: CommentItem): CommentAnchor | null => comment.anchor ?? (comment.parentId ? (anchorOf.get(comment.parentId) ?? null) : null);
    });
    const groups = computed<AnchoredGroup[]>(() => {
      const byToken = new Map<string, AnchoredGroup>();
      const about = aboutOf();
      for (const comment of readable()) {
        const anchor = about(comment);
        if (!anchor) continue;
        const token = anchorToken(anchor);
        const group = byToken.get(token) ?? { token, anchor, comments: [] };
        group.comments.push(comment);
        byToken.set(token, group);
      }
      return [...byToken.values()];
    });
    return {
      groups,
      /** How many readable comments point at each `kind:key`. */
      counts: computed(() => new Map(groups().map((g) => [g.token, g.comments.length]))),
      anchoredCount: computed(() => groups().reduce((sum, g) => sum + g.comments.length, 0)),
      unanchoredCount: computed(() => readable().filter((c) => !aboutOf()(c)).length),
    };
  }),
  withMethods((store, api = inject(DiscussionApi)) => {
    let latest = 0;
    return {
      /** Every page of the option's comments; a 403 or 404 means no discussion for this reader, not an error. */
      async load(optionId: string): Promise<void> {
        const request = ++latest;
        patchState(store, { ...initial, optionId, loading: true });
        const items: CommentItem[] = [];
        try {
          for (let page = 1; page <= MAX_PAGES; page++) {
            const answer = await firstValueFrom(api.comments(optionId, page));
            if (request !== latest) return;
            items.push(...answer.items);
            if (answer.items.length === 0 || items.length >= answer.total) {
              // a withdrawn share leaves its comments readable to those who may still read the option
              const available = answer.discussion.audience !== null || answer.total > 0;
              patchState(store, { items, total: answer.total, available, loading: false });
              return;
            }
          }
          patchState(store, { items, total: items.length, available: true, loading: false });
        } catch (error) {
          if (request !== latest) return;
          const notShared = error instanceof HttpErrorResponse && (error.status === 403 || error.status === 404);
          patchState(store, { loading: false, available: false, error: notShared ? null : `The comments could not be loaded: ${errorMessage(error)}` });
        }
      },
      countFor(anchor: CommentAnchor): number {
        return store.counts().get(anchorToken(anchor)) ?? 0;
      },
    };
  }),
);
