import { computed, inject } from '@angular/core';
import { patchState, signalStore, withComputed, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { BalancePreview, VersionDetail, VersionSummary } from '@seinework/contracts';
import { WebsApi, type BalanceMethod, type Created } from './webs-api';
import { errorMessage } from './request-error';
import { compartmentBalances } from './imbalance';
import { newRow, tablesToWeb, webToTables, type EditorTable, type EditorTables } from './editor-tables';

const EMPTY: EditorTables = { compartments: [], flows: [], imports: [], exports: [], respiration: [] };

interface EditorState {
  webId: string | null;
  /** The web's own name (a clone's differs from the name inside its WEB.json). */
  webName: string;
  /** The version the edit started from. */
  source: VersionDetail | null;
  tables: EditorTables;
  name: string;
  unit: string;
  note: string;
  /** Changed since loading or saving. */
  dirty: boolean;
  loading: boolean;
  error: string | null;
  saving: boolean;
  actionError: string | null;
  /** The draft saved by this editor (the one "Publish" publishes). */
  saved: Created | null;
  published: VersionSummary | null;
  balanceMethod: BalanceMethod;
  balancing: boolean;
  preview: BalancePreview | null;
  balanceError: string | null;
}

const initial: EditorState = {
  webId: null,
  webName: '',
  source: null,
  tables: EMPTY,
  name: '',
  unit: '',
  note: '',
  dirty: false,
  loading: false,
  error: null,
  saving: false,
  actionError: null,
  saved: null,
  published: null,
  balanceMethod: 'least-change',
  balancing: false,
  preview: null,
  balanceError: null,
};

/** The flow editor: a web being edited as tables, its live balance, balancing, saving and publishing. */
export const EditorStore = signalStore(
  withState<EditorState>(initial),
  withComputed(({ tables, name, unit, source, saved, dirty }) => {
    const read = computed(() => {
      const web = source()?.web;
      return tablesToWeb(tables(), { name: name(), unit: unit(), areaKm2: web?.areaKm2, tonnesPerUnit: web?.tonnesPerUnit });
    });
    const balances = computed(() => compartmentBalances(read().web));
    return {
      web: computed(() => read().web),
      cellProblems: computed(() => read().problems),
      balances,
      unbalanced: computed(() => balances().filter((b) => b.overTolerance)),
      /** The draft "Publish" would publish, while nothing is unsaved: the one saved here, or the draft opened. */
      publishable: computed(() => (dirty() ? null : (saved()?.versionId ?? (source()?.status === 'draft' ? source()!.id : null)))),
      compartmentIds: computed(() => tables().compartments.map((r) => r.cells['id'].trim()).filter((id) => id !== '')),
    };
  }),
  withMethods((store, api = inject(WebsApi)) => {
    const edit = (tables: EditorTables) => patchState(store, { tables, dirty: true, preview: null, published: null });
    return {
      async load(webId: string, versionId: string): Promise<void> {
        patchState(store, { ...initial, webId, loading: true });
        try {
          const [detail, source] = await Promise.all([firstValueFrom(api.web(webId)), firstValueFrom(api.version(webId, versionId))]);
          patchState(store, { webName: detail.name, source, tables: webToTables(source.web), name: source.web.name, unit: source.web.unit, loading: false });
        } catch (error) {
          patchState(store, { loading: false, error: `This version could not be opened: ${errorMessage(error)}` });
        }
      },
      setCell(table: EditorTable, key: number, field: string, value: string): void {
        edit({ ...store.tables(), [table]: store.tables()[table].map((row) => (row.key === key ? { ...row, cells: { ...row.cells, [field]: value } } : row)) });
      },
      addRow(table: EditorTable): void {
        edit({ ...store.tables(), [table]: [...store.tables()[table], newRow(table)] });
      },
      removeRow(table: EditorTable, key: number): void {
        edit({ ...store.tables(), [table]: store.tables()[table].filter((row) => row.key !== key) });
      },
      setNote(note: string): void {
        patchState(store, { note });
      },
      setBalanceMethod(balanceMethod: BalanceMethod): void {
        patchState(store, { balanceMethod, preview: null, balanceError: null });
      },
      async previewBalance(): Promise<void> {
        patchState(store, { balancing: true, preview: null, balanceError: null });
        try {
          const preview = await firstValueFrom(api.balance(store.web(), store.balanceMethod()));
          patchState(store, { balancing: false, preview });
        } catch (error) {
          patchState(store, { balancing: false, balanceError: `The web could not be balanced: ${errorMessage(error)}` });
        }
      },
      acceptBalance(): void {
        const preview = store.preview();
        if (!preview) return;
        edit(webToTables(preview.web));
      },
      discardBalance(): void {
        patchState(store, { preview: null });
      },
      async saveDraft(): Promise<Created | null> {
        const webId = store.webId();
        if (!webId) return null;
        patchState(store, { saving: true, actionError: null });
        try {
          const note = store.note().trim();
          const saved = await firstValueFrom(api.saveDraft(webId, { web: store.web(), basedOn: store.saved()?.versionId ?? store.source()?.id, ...(note ? { note } : {}) }));
          patchState(store, { saving: false, saved, dirty: false, note: '' });
          return saved;
        } catch (error) {
          patchState(store, { saving: false, actionError: `The draft was not saved: ${errorMessage(error)}` });
          return null;
        }
      },
      async publishSaved(): Promise<VersionSummary | null> {
        const webId = store.webId();
        const versionId = store.publishable();
        if (!webId || !versionId) return null;
        patchState(store, { saving: true, actionError: null });
        try {
          const published = await firstValueFrom(api.publish(webId, versionId));
          patchState(store, { saving: false, published });
          return published;
        } catch (error) {
          patchState(store, { saving: false, actionError: `The draft was not published: ${errorMessage(error)}` });
          return null;
        }
      },
      async cloneSource(details: { name: string; place?: string; period?: string }): Promise<Created | null> {
        const webId = store.webId();
        const versionId = store.saved()?.versionId ?? store.source()?.id;
        if (!webId || !versionId) return null;
        patchState(store, { saving: true, actionError: null });
        try {
          const created = await firstValueFrom(api.clone(webId, versionId, details));
          patchState(store, { saving: false });
          return created;
        } catch (error) {
          patchState(store, { saving: false, actionError: `The version was not cloned: ${errorMessage(error)}` });
          return null;
        }
      },
    };
  }),
);
