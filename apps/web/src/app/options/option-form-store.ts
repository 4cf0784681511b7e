import { computed, inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withComputed, withHooks, withMethods, withState } from '@ngrx/signals';
import { rxMethod } from '@ngrx/signals/rxjs-interop';
import { catchError, EMPTY, firstValueFrom, map, of, pipe, switchMap, tap, timer } from 'rxjs';
import type { AdjustmentProblem, OptionPreview, ResponseRule, StoredOptionBody, UncertaintySettings, Web } from '@seinework/contracts';
import { errorMessage } from '../webs/request-error';
import { newAdjustment, toDraft, toOptionBody, type AdjustmentDraft } from './adjustment-draft';
import { OptionsApi } from './options-api';

/** How long typing must pause before the engine is asked for a preview. */
export const PREVIEW_DELAY_MS = 400;

/** A refused option answers 400 (shape) or 422 (engine) with `{adjustment, problem}` details. */
export function adjustmentProblemsOf(error: unknown): AdjustmentProblem[] | null {
  if (!(error instanceof HttpErrorResponse) || (error.status !== 400 && error.status !== 422)) return null;
  const details = (error.error as { details?: unknown } | null)?.details;
  if (!Array.isArray(details)) return null;
  return details.map((d) => ({ adjustment: typeof d?.adjustment === 'number' ? d.adjustment : null, problem: String(d?.problem ?? d) }));
}

interface OptionFormState {
  webId: string | null;
  versionId: string | null;
  /** The stored option being edited; null for a new one. */
  optionId: string | null;
  /** An option with runs keeps its inputs: it is duplicated instead of edited. */
  frozen: boolean;
  web: Web | null;
  loading: boolean;
  error: string | null;
  name: string;
  purpose: string;
  response: ResponseRule;
  adjustments: AdjustmentDraft[];
  uncertainty: UncertaintySettings;
  preview: OptionPreview | null;
  /** The engine's refusals, each against its adjustment (null: the whole option). */
  problems: AdjustmentProblem[];
  checking: boolean;
  previewError: string | null;
  saving: boolean;
  saveError: string | null;
  /** Changed since it was opened or saved. */
  dirty: boolean;
}

const initial: OptionFormState = {
  webId: null,
  versionId: null,
  optionId: null,
  frozen: false,
  web: null,
  loading: false,
  error: null,
  name: '',
  purpose: '',
  response: 'bottom-up',
  adjustments: [newAdjustment()],
  uncertainty: { draws: 1000, cv: 0.25, seed: 1 },
  preview: null,
  problems: [],
  checking: false,
  previewError: null,
  saving: false,
  saveError: null,
  dirty: false,
};

/** The option form: the option being written, its live preview by the engine, and saving it. */
export const OptionFormStore = signalStore(
  withState<OptionFormState>(initial),
  withComputed(({ name, purpose, response, adjustments, uncertainty }) => ({
    /** The option as it would be saved, or the adjustments' missing fields. */
    draft: computed(() =>
      toOptionBody({ name: name().trim(), purpose: purpose().trim() || undefined, response: response(), uncertainty: uncertainty() }, adjustments()),
    ),
  })),
  withComputed(({ draft, web, frozen, name, response }) => ({
    /**
     * What the preview sends: the deterministic run needs neither purpose nor draws, so typing those
     * does not ask the engine again; an unnamed option is previewed under a placeholder name.
     */
    previewBody: computed(
      (): StoredOptionBody | null => {
        const body = draft().body;
        if (!web() || frozen() || !body) return null;
        return { name: name().trim() || 'Untitled option', response: response(), adjustments: body.adjustments };
      },
      // a new object every time the draft changes: equal when it says the same, so that it asks nothing new
      { equal: (a, b) => JSON.stringify(a) === JSON.stringify(b) },
    ),
  })),
  withMethods((store, api = inject(OptionsApi)) => {
    const edit = (change: Partial<OptionFormState>) => patchState(store, { ...change, saveError: null, dirty: true });
    return {
      async startNew(webId: string, versionId: string): Promise<void> {
        patchState(store, { ...initial, webId, versionId, loading: true, uncertainty: { ...initial.uncertainty, seed: newSeed() } });
        try {
          const version = await firstValueFrom(api.version(webId, versionId));
          patchState(store, { web: version.web, loading: false });
        } catch (error) {
          patchState(store, { loading: false, error: `The baseline could not be loaded: ${errorMessage(error)}` });
        }
      },
      async startEdit(optionId: string): Promise<void> {
        patchState(store, { ...initial, optionId, loading: true });
        try {
          const detail = await firstValueFrom(api.detail(optionId));
          const { option } = detail;
          patchState(store, {
            webId: detail.webId,
            versionId: detail.versionId,
            frozen: detail.frozen,
            name: option.name,
            purpose: detail.purpose,
            response: option.response,
            adjustments: option.adjustments.map(toDraft),
            uncertainty: option.uncertainty ?? initial.uncertainty,
          });
          const version = await firstValueFrom(api.version(detail.webId, detail.versionId));
          patchState(store, { web: version.web, loading: false });
        } catch (error) {
          patchState(store, { loading: false, error: `The harvest option could not be loaded: ${errorMessage(error)}` });
        }
      },
      setName: (name: string) => edit({ name }),
      setPurpose: (purpose: string) => edit({ purpose }),
      setResponse: (response: ResponseRule) => edit({ response }),
      setUncertainty: (change: Partial<UncertaintySettings>) => edit({ uncertainty: { ...store.uncertainty(), ...change } }),
      addAdjustment: () => edit({ adjustments: [...store.adjustments(), newAdjustment()] }),
      changeAdjustment: (index: number, draft: AdjustmentDraft) => edit({ adjustments: store.adjustments().map((a, i) => (i === index ? draft : a)) }),
      removeAdjustment: (index: number) => edit({ adjustments: store.adjustments().filter((_, i) => i !== index) }),

      /** Follows the option as it is typed: waits for a pause, then asks the engine (an older answer is dropped). */
      followPreview: rxMethod<StoredOptionBody | null>(
        pipe(
          tap((body) => {
            if (!body) patchState(store, { problems: [], preview: null, checking: false, previewError: null });
          }),
          // each new body (null included) drops the pause and any answer still coming for the one before
          switchMap((body) =>
            body === null
              ? EMPTY
              : timer(PREVIEW_DELAY_MS).pipe(
                  tap(() => patchState(store, { checking: true, previewError: null })),
                  switchMap(() => api.preview(store.webId()!, store.versionId()!, body)),
                  map((preview) => ({ preview, problems: [] as AdjustmentProblem[], previewError: null })),
                  catchError((error: unknown) => {
                    const problems = adjustmentProblemsOf(error);
                    return of(problems ? { preview: null, problems, previewError: null } : { preview: null, problems: [], previewError: errorMessage(error) });
                  }),
                ),
          ),
          tap((answer) => patchState(store, { ...answer, checking: false })),
          catchError(() => EMPTY),
        ),
      ),

      /** Copies a frozen option so that the copy can be edited; the copy's id. */
      async duplicate(): Promise<string | null> {
        const optionId = store.optionId();
        if (!optionId) return null;
        patchState(store, { saving: true, saveError: null });
        try {
          const { id } = await firstValueFrom(api.duplicate(optionId));
          patchState(store, { saving: false });
          return id;
        } catch (error) {
          patchState(store, { saving: false, saveError: `The option was not duplicated: ${errorMessage(error)}` });
          return null;
        }
      },

      /** Stores the option; its id, or null when it was refused (the problems say why). */
      async save(): Promise<string | null> {
        const { body } = store.draft();
        if (!body) {
          patchState(store, { saveError: 'Complete every adjustment before saving.' });
          return null;
        }
        if (!body.name) {
          patchState(store, { saveError: 'Give the option a name.' });
          return null;
        }
        patchState(store, { saving: true, saveError: null });
        try {
          const optionId = store.optionId();
          if (optionId) await firstValueFrom(api.update(optionId, body));
          const id = optionId ?? (await firstValueFrom(api.create(store.webId()!, store.versionId()!, body))).id;
          patchState(store, { saving: false, dirty: false });
          return id;
        } catch (error) {
          const refused = adjustmentProblemsOf(error);
          patchState(store, { saving: false, saveError: `The option was not saved: ${errorMessage(error)}`, ...(refused ? { problems: refused } : {}) });
          return null;
        }
      },
    };
  }),
  withHooks({
    onInit(store) {
      store.followPreview(store.previewBody);
    },
  }),
);

/** A fresh seed per new option, so that two options do not share their draws by accident. */
function newSeed(): number {
  return Math.floor(Math.random() * 1_000_000) + 1;
}
