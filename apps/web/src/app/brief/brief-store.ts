import { inject } from '@angular/core';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { ComparisonBrief, OptionBrief } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { BriefApi } from './brief-api';

interface BriefState {
  option: OptionBrief | null;
  comparison: ComparisonBrief | null;
  loading: boolean;
  error: string | null;
}

const initial: BriefState = { option: null, comparison: null, loading: false, error: null };

/** The brief on the print page: an option's or a comparison's, loading, or why it could not be made. */
export const BriefStore = signalStore(
  withState<BriefState>(initial),
  withMethods((store, api = inject(BriefApi)) => {
    let latest = 0;
    async function load<T>(request: Promise<T>, apply: (value: T) => Partial<BriefState>): Promise<void> {
      const ticket = ++latest;
      patchState(store, { ...initial, loading: true });
      try {
        const value = await request;
        if (ticket === latest) patchState(store, { ...apply(value), loading: false });
      } catch (error) {
        if (ticket === latest) patchState(store, { loading: false, error: errorMessage(error) });
      }
    }
    return {
      loadOption: (optionId: string, runId?: string) => load(firstValueFrom(api.optionBrief(optionId, runId)), (option) => ({ option })),
      loadComparison: (runIds: readonly string[]) => load(firstValueFrom(api.comparisonBrief(runIds)), (comparison) => ({ comparison })),
    };
  }),
);
