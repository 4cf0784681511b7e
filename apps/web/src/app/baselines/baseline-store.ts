import { computed, inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import { BaselineData, type BaselineSummary } from './baseline-data';

interface BaselineState {
  baseline: BaselineSummary | null;
  loading: boolean;
  error: string | null;
}

export const BaselineStore = signalStore(
  withState<BaselineState>({ baseline: null, loading: false, error: null }),
  withComputed(({ baseline }) => ({
    /** Each compartment with its trophic level and cycled throughflow, highest level first. */
    positions: computed(() => {
      const current = baseline();
      if (!current) return [];
      const { analysis } = current;
      return current.compartments
        .map((c) => ({ ...c, trophicLevel: analysis.trophicLevels[c.id], cycled: analysis.cycledThroughflow[c.id] }))
        .sort((a, b) => b.trophicLevel - a.trophicLevel);
    }),
    /** The baseline's place on the fitness curve. */
    placedOnCurve: computed(() => {
      const analysis = baseline()?.analysis;
      return analysis ? [{ label: 'Baseline', relativeAscendency: analysis.relativeAscendency, robustness: analysis.robustness }] : [];
    }),
  })),
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
