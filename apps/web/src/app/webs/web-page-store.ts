import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { Analysis, VersionDetail, WebDetail } from '@seinework/contracts';
import { WebsApi, type Created, type ExportFormat } from './webs-api';
import { errorMessage } from './request-error';

interface WebPageState {
  detail: WebDetail | null;
  loading: boolean;
  error: string | null;
  selectedId: string | null;
  version: VersionDetail | null;
  versionLoading: boolean;
  versionError: string | null;
  analysis: Analysis | null;
  analysisError: string | null;
  /** A publish or clone under way, and why the last one was refused. */
  busy: boolean;
  actionError: string | null;
}

const initial: WebPageState = {
  detail: null,
  loading: false,
  error: null,
  selectedId: null,
  version: null,
  versionLoading: false,
  versionError: null,
  analysis: null,
  analysisError: null,
  busy: false,
  actionError: null,
};

/** One web: its versions, and the selected version with its analysis. */
export const WebPageStore = signalStore(
  withState<WebPageState>(initial),
  withComputed(({ detail, selectedId, version, analysis }) => ({
    /** Newest version first, as people read a history. */
    versions: computed(() => [...(detail()?.versions ?? [])].sort((a, b) => b.number - a.number)),
    selected: computed(() => detail()?.versions.find((v) => v.id === selectedId()) ?? null),
    /** Each compartment with its trophic level and cycled throughflow, highest level first. */
    positions: computed(() => {
      const web = version()?.web;
      const current = analysis();
      if (!web || !current) return [];
      return web.compartments
        .map((c) => ({ id: c.id, name: c.name, kind: c.kind, trophicLevel: current.trophicLevels[c.id], cycled: current.cycledThroughflow[c.id] }))
        .sort((a, b) => b.trophicLevel - a.trophicLevel);
    }),
    placedOnCurve: computed(() => {
      const current = analysis();
      const number = detail()?.versions.find((v) => v.id === selectedId())?.number;
      return current ? [{ label: `Version ${number ?? ''}`.trim(), relativeAscendency: current.relativeAscendency, robustness: current.robustness }] : [];
    }),
  })),
  withMethods((store, api = inject(WebsApi)) => {
    let latestVersion = 0;
    async function selectVersion(versionId: string): Promise<void> {
      const webId = store.detail()?.id;
      if (!webId) return;
      const request = ++latestVersion;
      patchState(store, { selectedId: versionId, version: null, analysis: null, versionLoading: true, versionError: null, analysisError: null });
      try {
        const version = await firstValueFrom(api.version(webId, versionId));
        if (request !== latestVersion) return;
        patchState(store, { version });
        const analysis = await firstValueFrom(api.analysis(webId, versionId));
        if (request === latestVersion) patchState(store, { analysis, versionLoading: false });
      } catch (error) {
        if (request !== latestVersion) return;
        if (store.version()) patchState(store, { versionLoading: false, analysisError: errorMessage(error) });
        else patchState(store, { versionLoading: false, versionError: `This version could not be loaded: ${errorMessage(error)}` });
      }
    }
    async function load(webId: string, versionId?: string | null): Promise<void> {
      patchState(store, { ...initial, loading: true });
      try {
        const detail = await firstValueFrom(api.web(webId));
        patchState(store, { detail, loading: false });
        const newest = [...detail.versions].sort((a, b) => b.number - a.number);
        const chosen = detail.versions.find((v) => v.id === versionId) ?? newest.find((v) => v.status === 'published') ?? newest[0];
        if (chosen) await selectVersion(chosen.id);
      } catch (error) {
        patchState(store, { loading: false, error: `This web could not be loaded: ${errorMessage(error)}` });
      }
    }
    return {
      load,
      selectVersion,
      async publish(versionId: string): Promise<boolean> {
        const webId = store.detail()?.id;
        if (!webId) return false;
        patchState(store, { busy: true, actionError: null });
        try {
          await firstValueFrom(api.publish(webId, versionId));
          patchState(store, { busy: false });
          await load(webId, versionId);
          return true;
        } catch (error) {
          patchState(store, { busy: false, actionError: `The version was not published: ${errorMessage(error)}` });
          return false;
        }
      },
      async clone(versionId: string, details: { name: string; place?: string; period?: string }): Promise<Created | null> {
        const webId = store.detail()?.id;
        if (!webId) return null;
        patchState(store, { busy: true, actionError: null });
        try {
          const created = await firstValueFrom(api.clone(webId, versionId, details));
          patchState(store, { busy: false });
          return created;
        } catch (error) {
          patchState(store, { busy: false, actionError: `The version was not cloned: ${errorMessage(error)}` });
          return null;
        }
      },
      exportUrl(versionId: string, format: ExportFormat): string {
        return api.exportUrl(store.detail()?.id ?? '', versionId, format);
      },
    };
  }),
);
