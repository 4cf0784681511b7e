import { inject } from '@angular/core';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { WebListQuery, WebSummary } from '@seinework/contracts';
import { WebsApi, type Created } from './webs-api';
import { errorMessage } from './request-error';

type SortKey = WebListQuery['sort'];

interface WebListState {
  items: WebSummary[];
  total: number;
  page: number;
  pageSize: number;
  sort: SortKey;
  direction: 'asc' | 'desc';
  filter: string;
  loading: boolean;
  error: string | null;
  creating: boolean;
  createError: string | null;
}

const initial: WebListState = {
  items: [],
  total: 0,
  page: 1,
  pageSize: 20,
  sort: 'updatedAt',
  direction: 'desc',
  filter: '',
  loading: false,
  error: null,
  creating: false,
  createError: null,
};

/** The list of webs: sorting, filtering and paging happen on the server, so only one page is held. */
export const WebListStore = signalStore(
  withState<WebListState>(initial),
  withMethods((store, api = inject(WebsApi)) => {
    // Answers can arrive out of order while someone types in the filter; only the last request counts.
    let latest = 0;
    async function load(): Promise<void> {
      const request = ++latest;
      patchState(store, { loading: true, error: null });
      try {
        const { items, total } = await firstValueFrom(
          api.list({ page: store.page(), pageSize: store.pageSize(), sort: store.sort(), direction: store.direction(), filter: store.filter().trim() || undefined }),
        );
        if (request === latest) patchState(store, { items, total, loading: false });
      } catch (error) {
        if (request === latest) patchState(store, { loading: false, error: `The list of webs could not be loaded: ${errorMessage(error)}` });
      }
    }
    return {
      load,
      sortBy(sort: SortKey, direction: 'asc' | 'desc'): Promise<void> {
        patchState(store, { sort, direction, page: 1 });
        return load();
      },
      filterBy(filter: string): Promise<void> {
        patchState(store, { filter, page: 1 });
        return load();
      },
      showPage(page: number, pageSize: number): Promise<void> {
        patchState(store, { page, pageSize });
        return load();
      },
      /** A new web from the text of a WEB.json file; the server checks it as it would any upload. */
      async createFromJson(fileName: string, text: string): Promise<Created | null> {
        patchState(store, { creating: true, createError: null });
        try {
          const web = JSON.parse(text);
          const created = await firstValueFrom(api.create(web));
          patchState(store, { creating: false });
          return created;
        } catch (error) {
          const why = error instanceof SyntaxError ? `it is not valid JSON (${error.message})` : errorMessage(error);
          patchState(store, { creating: false, createError: `No web was made from ${fileName}: ${why}` });
          return null;
        }
      },
    };
  }),
);
