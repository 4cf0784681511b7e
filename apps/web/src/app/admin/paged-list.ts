import { computed } from '@angular/core';
import { patchState, signalStoreFeature, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom, type Observable } from 'rxjs';
import type { Page } from '@seinework/contracts';
import { problemMessage } from '../auth/problem-message';

export interface PagedListState<T> {
  items: T[];
  total: number;
  /** 1-based, as the API counts pages. */
  page: number;
  pageSize: number;
  loading: boolean;
  error: string | null;
}

export type PageSource<T> = (page: number, pageSize: number) => Observable<Page<T>>;

/**
 * One page of a server list with its loading and error state, shared by the admin stores.
 * `source` runs in the store's injection context and returns the data service call.
 */
export function withPagedList<T>(what: string, source: () => PageSource<T>) {
  return signalStoreFeature(
    withState<PagedListState<T>>({ items: [], total: 0, page: 1, pageSize: 20, loading: false, error: null }),
    withComputed(({ items, loading, error }) => ({
      /** Loaded, and nothing there: the page says so instead of showing an empty table. */
      empty: computed(() => !loading() && error() === null && items().length === 0),
    })),
    withMethods((store) => {
      const fetchPage = source();
      const load = async (): Promise<void> => {
        patchState(store, { loading: true, error: null });
        try {
          const answer = await firstValueFrom(fetchPage(store.page(), store.pageSize()));
          patchState(store, { items: answer.items, total: answer.total, loading: false });
        } catch (error) {
          patchState(store, { loading: false, error: `The ${what} could not be loaded: ${problemMessage(error)}` });
        }
      };
      return {
        load,
        /** Another page or page size (from the paginator, whose pages count from 0). */
        async showPage(pageIndex: number, pageSize: number): Promise<void> {
          patchState(store, { page: pageIndex + 1, pageSize });
          await load();
        },
      };
    }),
  );
}
