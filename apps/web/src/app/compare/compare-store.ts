import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { Comparison, OptionSummary, WebDetail, WebSummary } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { CompareApi } from './compare-api';

export const MIN_COMPARED = 2;
export const MAX_COMPARED = 6;

interface CompareState {
  // the picker: a web, one of its published versions, and 2–6 options with a finished run
  webs: WebSummary[];
  websLoading: boolean;
  websError: string | null;
  webId: string | null;
  web: WebDetail | null;
  versionId: string | null;
  options: OptionSummary[];
  optionsLoading: boolean;
  pickError: string | null;
  picked: string[];
  // the comparison the URL names
  runIds: string[];
  comparison: Comparison | null;
  comparedWeb: WebDetail | null;
  loading: boolean;
  error: string | null;
  // recording a preference
  recording: boolean;
  recordError: string | null;
  recordedOptionId: string | null;
}

const initial: CompareState = {
  webs: [],
  websLoading: false,
  websError: null,
  webId: null,
  web: null,
  versionId: null,
  options: [],
  optionsLoading: false,
  pickError: null,
  picked: [],
  runIds: [],
  comparison: null,
  comparedWeb: null,
  loading: false,
  error: null,
  recording: false,
  recordError: null,
  recordedOptionId: null,
};

/** The comparison page: choosing what to compare, the comparison itself, and the council's preferences on it. */
export const CompareStore = signalStore(
  withState<CompareState>(initial),
  withComputed((store) => ({
    publishedVersions: computed(() => (store.web()?.versions ?? []).filter((v) => v.status === 'published')),
    /** Options whose latest run has not finished: they cannot be compared yet. */
    notReady: computed(() => store.options().filter((o) => o.latestRun?.status !== 'done').length),
    canCompare: computed(() => store.picked().length >= MIN_COMPARED && store.picked().length <= MAX_COMPARED),
    /** One letter per compared run (A, B, …), in the order of the URL, for headers, tables and charts. */
    letters: computed(() => new Map((store.comparison()?.runs ?? []).map((run, i) => [run.id, String.fromCharCode(65 + i)]))),
  })),
  withMethods((store, api = inject(CompareApi)) => {
    let latestComparison = 0;
    let latestOptions = 0;

    async function loadOptions(webId: string, versionId: string): Promise<void> {
      const request = ++latestOptions;
      patchState(store, { versionId, options: [], optionsLoading: true, pickError: null });
      try {
        const { items } = await firstValueFrom(api.options(webId, versionId));
        if (request !== latestOptions) return;
        const runs = new Set(items.map((o) => o.latestRun?.id));
        patchState(store, { options: items, optionsLoading: false, picked: store.picked().filter((id) => runs.has(id)) });
      } catch (error) {
        if (request === latestOptions) patchState(store, { optionsLoading: false, pickError: `The options of this version could not be loaded: ${errorMessage(error)}` });
      }
    }

    async function chooseWeb(webId: string, versionId?: string): Promise<void> {
      patchState(store, { webId, web: null, versionId: null, options: [], pickError: null });
      try {
        const web = await firstValueFrom(api.web(webId));
        if (store.webId() !== webId) return;
        patchState(store, { web });
        // the newest published version, unless one was asked for
        const published = web.versions.filter((v) => v.status === 'published');
        const chosen = published.find((v) => v.id === versionId) ?? published[0];
        if (chosen) await loadOptions(webId, chosen.id);
      } catch (error) {
        if (store.webId() === webId) patchState(store, { pickError: `The web could not be loaded: ${errorMessage(error)}` });
      }
    }

    return {
      /** The webs to choose from; with only one, it is chosen straight away. */
      async loadWebs(webId?: string, versionId?: string): Promise<void> {
        patchState(store, { websLoading: true, websError: null });
        try {
          const { items } = await firstValueFrom(api.webs());
          const withBaseline = items.filter((w) => w.published !== null);
          patchState(store, { webs: withBaseline, websLoading: false });
          const chosen = withBaseline.find((w) => w.id === webId) ?? (withBaseline.length === 1 ? withBaseline[0] : undefined);
          if (chosen && store.webId() !== chosen.id) await chooseWeb(chosen.id, versionId);
        } catch (error) {
          patchState(store, { websLoading: false, websError: `The list of webs could not be loaded: ${errorMessage(error)}` });
        }
      },
      chooseWeb,
      chooseVersion(versionId: string): Promise<void> {
        const webId = store.webId();
        return webId ? loadOptions(webId, versionId) : Promise.resolve();
      },
      /** Tick or untick a run; at most six can be ticked. */
      togglePick(runId: string): void {
        const picked = store.picked();
        if (picked.includes(runId)) patchState(store, { picked: picked.filter((id) => id !== runId) });
        else if (picked.length < MAX_COMPARED) patchState(store, { picked: [...picked, runId] });
      },
      /** Show the comparison of these runs (the URL's `runs`); the picker remembers them. */
      async compare(runIds: readonly string[]): Promise<void> {
        const request = ++latestComparison;
        patchState(store, { runIds: [...runIds], picked: [...runIds], comparison: null, loading: true, error: null, recordError: null, recordedOptionId: null });
        try {
          const comparison = await firstValueFrom(api.comparison(runIds));
          if (request !== latestComparison) return;
          patchState(store, { comparison, loading: false });
          const webId = comparison.runs[0]?.webId;
          if (webId && store.comparedWeb()?.id !== webId) {
            const web = await firstValueFrom(api.web(webId));
            if (request === latestComparison) patchState(store, { comparedWeb: web });
          }
        } catch (error) {
          if (request === latestComparison) patchState(store, { loading: false, error: `These runs could not be compared: ${errorMessage(error)}` });
        }
      },
      /** Record the signed-in member's preference among the compared options; true when stored. */
      async recordPreference(optionId: string, reason: string): Promise<boolean> {
        const runIds = store.runIds();
        patchState(store, { recording: true, recordError: null, recordedOptionId: null });
        try {
          await firstValueFrom(api.recordPreference(optionId, { reason, comparedRuns: runIds }));
        } catch (error) {
          patchState(store, { recording: false, recordError: `Your preference was not recorded: ${errorMessage(error)}` });
          return false;
        }
        // the council's preferences as the server now holds them (a new one supersedes the member's old one)
        try {
          const { preferences } = await firstValueFrom(api.comparison(runIds));
          const comparison = store.comparison();
          if (comparison && store.runIds() === runIds) patchState(store, { comparison: { ...comparison, preferences } });
        } catch (error) {
          patchState(store, { recordError: `Your preference was recorded, but the list could not be refreshed: ${errorMessage(error)}` });
        }
        patchState(store, { recording: false, recordedOptionId: optionId });
        return true;
      },
    };
  }),
);
