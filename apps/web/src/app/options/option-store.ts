import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { rxMethod } from '@ngrx/signals/rxjs-interop';
import { catchError, EMPTY, finalize, firstValueFrom, pipe, switchMap, tap } from 'rxjs';
import type { OptionDetail, RunSummary, VersionDetail } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { errorMessage } from '../webs/request-error';
import { FINISHED, OptionsApi, type RunSettings, type ShareRequest } from './options-api';

interface OptionState {
  detail: OptionDetail | null;
  /** The version the option stands on; its WEB.json names the compartments in the option's words. */
  baseline: VersionDetail | null;
  loading: boolean;
  error: string | null;
  runs: RunSummary[];
  /** The run being followed as it computes (kept once finished, so the page can say how it ended). */
  liveRun: RunSummary | null;
  following: boolean;
  followError: string | null;
  busy: boolean;
  actionError: string | null;
}

const initial: OptionState = {
  detail: null,
  baseline: null,
  loading: false,
  error: null,
  runs: [],
  liveRun: null,
  following: false,
  followError: null,
  busy: false,
  actionError: null,
};

/** One harvest option: its inputs, its runs (one followed live), its shares, and what can be done with it. */
export const OptionStore = signalStore(
  withState<OptionState>(initial),
  withComputed(({ runs, detail, baseline }) => ({
    web: computed(() => baseline()?.web ?? null),
    /** Runs with a finished result, which a share can show. */
    doneRuns: computed(() => runs().filter((r) => r.status === 'done')),
    frozen: computed(() => (detail()?.frozen ?? false) || runs().length > 0),
  })),
  withMethods((store, api = inject(OptionsApi), session = inject(SessionStore)) => {
    let latest = 0;
    /** The run as it moves: one entry of the runs list, replaced in place. */
    const update = (run: RunSummary) =>
      patchState(store, { liveRun: run, runs: store.runs().map((r) => (r.id === run.id ? run : r)) });

    /** Follows one run's events; a new id switches to that run, null stops following. */
    let current: string | null = null;
    const follow = rxMethod<string | null>(
      pipe(
        tap((runId) => {
          current = runId;
          patchState(store, { following: runId !== null, followError: null });
        }),
        switchMap((runId) =>
          runId === null
            ? EMPTY
            : api.runEvents(runId).pipe(
                tap(update),
                catchError((error: unknown) => {
                  patchState(store, { followError: errorMessage(error) });
                  return EMPTY;
                }),
                // a stream left for another run (or for none) says nothing of the one followed now
                finalize(() => current === runId && patchState(store, { following: false })),
              ),
        ),
      ),
    );

    const act = async <T>(work: () => Promise<T>, failure: string): Promise<T | null> => {
      patchState(store, { busy: true, actionError: null });
      try {
        const answer = await work();
        patchState(store, { busy: false });
        return answer;
      } catch (error) {
        patchState(store, { busy: false, actionError: `${failure}: ${errorMessage(error)}` });
        return null;
      }
    };

    return {
      async load(optionId: string): Promise<void> {
        const request = ++latest;
        follow(null); // the run of the option shown before is not this one's
        patchState(store, { ...initial, loading: true });
        try {
          // a stakeholder reads no list of runs: only the run the public share shows, as the option's latest
          const readsRuns = session.can('options.read-all') || session.can('options.read-shared');
          const [detail, listed] = await Promise.all([firstValueFrom(api.detail(optionId)), readsRuns ? firstValueFrom(api.runs(optionId)) : Promise.resolve(null)]);
          const runs = listed?.items ?? (detail.latestRun ? [detail.latestRun] : []);
          if (request !== latest) return;
          patchState(store, { detail, runs, loading: false });
          const unfinished = runs.find((r) => !FINISHED.has(r.status));
          if (unfinished) {
            patchState(store, { liveRun: unfinished });
            follow(unfinished.id);
          }
          const baseline = await firstValueFrom(api.version(detail.webId, detail.versionId));
          if (request === latest) patchState(store, { baseline });
        } catch (error) {
          if (request !== latest) return;
          // without the baseline the adjustments are shown by their ids: the page stays, and says why
          if (store.detail()) patchState(store, { actionError: `The baseline could not be read, so compartments and fleets show by their ids: ${errorMessage(error)}` });
          else patchState(store, { loading: false, error: `This harvest option could not be loaded: ${errorMessage(error)}` });
        }
      },

      /** Follows a run's server-sent events until it is done, failed or cancelled. */
      follow,

      async startRun(settings: RunSettings): Promise<RunSummary | null> {
        const optionId = store.detail()?.id;
        if (!optionId) return null;
        const run = await act(() => firstValueFrom(api.startRun(optionId, settings)), 'The run was not started');
        if (run) {
          patchState(store, { runs: [run, ...store.runs()], liveRun: run });
          follow(run.id);
        }
        return run;
      },

      async cancelRun(runId: string): Promise<void> {
        const run = await act(() => firstValueFrom(api.cancelRun(runId)), 'The run was not cancelled');
        if (run) update(run);
      },

      duplicate(): Promise<string | null> {
        const optionId = store.detail()?.id;
        if (!optionId) return Promise.resolve(null);
        return act(async () => (await firstValueFrom(api.duplicate(optionId))).id, 'The option was not duplicated');
      },

      async remove(): Promise<boolean> {
        const optionId = store.detail()?.id;
        if (!optionId) return false;
        return (await act(() => firstValueFrom(api.remove(optionId)).then(() => true), 'The option was not deleted')) ?? false;
      },

      async share(request: ShareRequest): Promise<boolean> {
        const optionId = store.detail()?.id;
        if (!optionId) return false;
        // the server answers the new share's id: the option is read again for its shares as stored
        const detail = await act(async () => {
          await firstValueFrom(api.share(optionId, request));
          return firstValueFrom(api.detail(optionId));
        }, 'The option was not shared');
        if (detail) patchState(store, { detail });
        return detail !== null;
      },

      async withdrawShare(shareId: string): Promise<void> {
        const done = await act(() => firstValueFrom(api.withdrawShare(shareId)).then(() => true), 'The share was not withdrawn');
        const detail = store.detail();
        if (done && detail) patchState(store, { detail: { ...detail, shares: detail.shares.filter((s) => s.id !== shareId) } });
      },
    };
  }),
);
