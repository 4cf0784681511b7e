import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { OptionSummary } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { OptionsApi } from './options-api';

/** A comparison sets 2 to 6 runs side by side (GET /api/comparisons). */
export const COMPARE_MIN = 2;
export const COMPARE_MAX = 6;

interface OptionListState {
  options: OptionSummary[];
  loading: boolean;
  error: string | null;
  /** Options ticked for comparison. */
  picked: string[];
}

/** The harvest options of one published version, and which of them are picked for a comparison. */
export const OptionListStore = signalStore(
  withState<OptionListState>({ options: [], loading: false, error: null, picked: [] }),
  withComputed(({ options, picked }) => ({
    /** The latest runs of the picked options, in list order: what the compare page is given. */
    compareRuns: computed(() => options().filter((o) => picked().includes(o.id) && o.latestRun?.status === 'done').map((o) => o.latestRun!.id)),
  })),
  withComputed(({ compareRuns }) => ({
    canCompare: computed(() => compareRuns().length >= COMPARE_MIN && compareRuns().length <= COMPARE_MAX),
  })),
  withMethods((store, api = inject(OptionsApi)) => {
    let latest = 0;
    return {
      async load(webId: string, versionId: string): Promise<void> {
        const request = ++latest;
        patchState(store, { loading: true, error: null, picked: [] });
        try {
          const { items } = await firstValueFrom(api.list(webId, versionId));
          if (request === latest) patchState(store, { options: items, loading: false });
        } catch (error) {
          if (request === latest) patchState(store, { options: [], loading: false, error: `The harvest options could not be loaded: ${errorMessage(error)}` });
        }
      },
      /** Only options with a finished run can be compared, and at most six at once. */
      canPick(option: OptionSummary): boolean {
        if (option.latestRun?.status !== 'done') return false;
        return store.picked().includes(option.id) || store.picked().length < COMPARE_MAX;
      },
      togglePick(optionId: string, on: boolean): void {
        const rest = store.picked().filter((id) => id !== optionId);
        patchState(store, { picked: on ? [...rest, optionId] : rest });
      },
    };
  }),
);
