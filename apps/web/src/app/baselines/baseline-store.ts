import { inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import { BaselineData, type BaselineSummary } from './baseline-data';

interface BaselineState {
  baseline: BaselineSummary | null;
  loading: boolean;
  error: string | null;
}

export const BaselineStore = signalStore(
  withState<BaselineState>({ baseline: null, loading: false, error: null }),
  withMethods((store, data = inject(BaselineData)) => ({
    async loadDemo(): Promise<void> {
      patchState(store, { loading: true, error: null });
      try {
        patchState(store, { baseline: await firstValueFrom(data.demoBaseline()), loading: false });
      } catch (error) {
        const message = error instanceof HttpErrorResponse ? (error.error?.error ?? error.message) : String(error);
        patchState(store, { loading: false, error: `The baseline could not be loaded: ${message}` });
      }
    },
  })),
);
