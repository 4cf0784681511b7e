import { computed, inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { OptionDetail, RunDetail, VersionDetail } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { ResultsApi } from './results-api';
import type { HarvestSensitivity, ScenarioDocument } from './result-document';
import { dependenceChanges, fitnessRows, fleetRows, indicatorRows, ladderRows, positionRows, sensitivityRows } from './result-tables';

interface ResultsState {
  run: RunDetail | null;
  loading: boolean;
  error: string | null;
  /** The baseline version (its number and web name); the page works without it. */
  version: VersionDetail | null;
  /** The stored option, for its purpose; the page works without it. */
  option: OptionDetail | null;
  sensitivity: HarvestSensitivity | null;
  sensitivityLoading: boolean;
  sensitivityError: string | null;
}

const initial: ResultsState = { run: null, loading: false, error: null, version: null, option: null, sensitivity: null, sensitivityLoading: false, sensitivityError: null };

/** One run and its result document, with the rows each part of the result page shows. */
export const ResultsStore = signalStore(
  withState<ResultsState>(initial),
  withComputed(({ run, version, option, sensitivity }) => {
    const doc = computed(() => (run()?.status === 'done' && run()?.result ? (run()!.result as ScenarioDocument) : null));
    return {
      doc,
      optionName: computed(() => run()?.inputs.option.name ?? ''),
      purpose: computed(() => option()?.purpose || null),
      webName: computed(() => version()?.web.name ?? null),
      versionNumber: computed(() => version()?.number ?? null),
      indicators: computed(() => (doc() ? indicatorRows(doc()!) : [])),
      fitness: computed(() => (doc() ? fitnessRows(doc()!) : [])),
      fleets: computed(() => (doc() ? fleetRows(doc()!) : [])),
      positions: computed(() => (doc() ? positionRows(doc()!) : [])),
      ladder: computed(() => (doc() ? ladderRows(doc()!) : [])),
      dependence: computed(() => (doc() ? dependenceChanges(doc()!) : [])),
      sensitivityRows: computed(() => (doc() && sensitivity() ? sensitivityRows(sensitivity()!, doc()!) : [])),
      /** Why there is no result to show, for a run that is not done. */
      notDone: computed(() => {
        const current = run();
        if (!current || current.status === 'done') return null;
        if (current.status === 'failed') return `This run failed: ${current.error ?? 'no message was kept'}.`;
        if (current.status === 'cancelled') return 'This run was cancelled before it finished.';
        return `This run is ${current.status} (${current.progress.done} of ${current.progress.total} draws). Reload the page when it is done.`;
      }),
    };
  }),
  withMethods((store, api = inject(ResultsApi)) => {
    let latest = 0;
    async function loadSensitivity(request: number): Promise<void> {
      const version = store.version();
      const run = store.run();
      if (!version || !run) return;
      patchState(store, { sensitivityLoading: true, sensitivityError: null });
      try {
        const sensitivity = await firstValueFrom(api.sensitivity(version.web, run.inputs.option.response));
        if (request === latest) patchState(store, { sensitivity, sensitivityLoading: false });
      } catch (error) {
        if (request === latest) patchState(store, { sensitivityLoading: false, sensitivityError: errorMessage(error) });
      }
    }
    return {
      async load(id: string): Promise<void> {
        const request = ++latest;
        patchState(store, { ...initial, loading: true });
        try {
          const run = await firstValueFrom(api.run(id));
          if (request !== latest) return;
          patchState(store, { run, loading: false });
        } catch (error) {
          if (request !== latest) return;
          const missing = error instanceof HttpErrorResponse && error.status === 404;
          patchState(store, { loading: false, error: missing ? 'No such run: it may have been removed, or it is not shared with you.' : `This run could not be loaded: ${errorMessage(error)}` });
          return;
        }
        // the option's purpose, the baseline's name and number, then its harvest sensitivity: extras, so a refusal leaves the result shown
        const run = store.run()!;
        firstValueFrom(api.option(run.optionId)).then(
          (option) => request === latest && patchState(store, { option }),
          () => undefined,
        );
        try {
          const version = await firstValueFrom(api.version(run.inputs.webId, run.inputs.versionId));
          if (request !== latest) return;
          patchState(store, { version });
        } catch (error) {
          if (request === latest) patchState(store, { sensitivityError: `The baseline could not be read: ${errorMessage(error)}` });
          return;
        }
        if (store.doc()) await loadSensitivity(request);
      },
    };
  }),
);
