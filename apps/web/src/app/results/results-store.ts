import { computed, inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withComputed, withHooks, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom, type Subscription } from 'rxjs';
import type { OptionDetail, RunDetail, VersionDetail } from '@seinework/contracts';
import { FINISHED, OptionsApi } from '../options/options-api';
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
  /** Whether an unfinished run is being followed live, so the page can promise to show the result. */
  following: boolean;
}

const initial: ResultsState = { run: null, loading: false, error: null, version: null, option: null, sensitivity: null, sensitivityLoading: false, sensitivityError: null, following: false };

/** One run and its result document, with the rows each part of the result page shows. */
export const ResultsStore = signalStore(
  withState<ResultsState>(initial),
  withComputed(({ run, version, option, sensitivity, following }) => {
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
        if (!current) return null;
        if (current.status === 'done') return current.result ? null : 'This run is done, but its result was not sent with it: reload the page.';
        if (current.status === 'failed') return `This run failed: ${current.error ?? 'no message was kept'}.`;
        if (current.status === 'cancelled') return 'This run was cancelled before it finished.';
        const where = `This run is ${current.status} (${current.progress.done} of ${current.progress.total} draws).`;
        return following() ? `${where} The result shows here as soon as it is done.` : `${where} Reload the page when it is done.`;
      }),
    };
  }),
  withMethods((store, api = inject(ResultsApi), runs = inject(OptionsApi)) => {
    let latest = 0;
    let live: Subscription | null = null;
    function stopFollowing(): void {
      live?.unsubscribe();
      live = null;
    }
    /** Follows an unfinished run's events; once it ends, reads it again with its result and every table. */
    function follow(request: number, runId: string): void {
      patchState(store, { following: true });
      live = runs.runEvents(runId).subscribe({
        next: (summary) => {
          if (request !== latest) return;
          patchState(store, { run: { ...store.run()!, status: summary.status, progress: summary.progress, error: summary.error } });
          if (FINISHED.has(summary.status)) {
            stopFollowing();
            void finish(request, runId);
          }
        },
        // the stream went (server restarted, run removed): the page falls back to asking for a reload
        error: () => request === latest && patchState(store, { following: false }),
      });
    }
    async function finish(request: number, runId: string): Promise<void> {
      try {
        const run = await firstValueFrom(api.run(runId));
        if (request !== latest) return;
        patchState(store, { run, following: false });
        if (store.doc()) await loadSensitivity(request);
      } catch (error) {
        // the page's one heading is then "No result to show", with why
        if (request === latest) patchState(store, { following: false, run: null, error: `The run finished, but its result could not be read: ${errorMessage(error)}. Reload the page to try again.` });
      }
    }
    async function loadSensitivity(request: number): Promise<void> {
      const version = store.version();
      const run = store.run();
      // asked for both when the baseline arrives and when a followed run finishes: once is enough
      if (!version || !run || store.sensitivityLoading() || store.sensitivity()) return;
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
        stopFollowing();
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
        if (!FINISHED.has(run.status)) follow(request, run.id);
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
      stopFollowing,
    };
  }),
  withHooks({ onDestroy: (store) => store.stopFollowing() }),
);
