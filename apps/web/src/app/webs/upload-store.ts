import { inject } from '@angular/core';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { UploadProblem, WebSummary } from '@seinework/contracts';
import { WebsApi, type Created, type ExportFormat, type UploadDetails } from './webs-api';
import { errorMessage, uploadProblems } from './request-error';

interface UploadState {
  submitting: boolean;
  problems: UploadProblem[];
  error: string | null;
  /** A published web whose export serves as a filled-in example of the layout. */
  example: WebSummary | null;
}

/** Sending a file to become a new web, and what the server found wrong with it. */
export const UploadStore = signalStore(
  withState<UploadState>({ submitting: false, problems: [], error: null, example: null }),
  withMethods((store, api = inject(WebsApi)) => ({
    async findExample(): Promise<void> {
      try {
        const { items } = await firstValueFrom(api.list({ pageSize: 20, sort: 'updatedAt', direction: 'asc' }));
        patchState(store, { example: items.find((w) => w.published) ?? null });
      } catch {
        // the example is a convenience: the layout is described on the page either way
      }
    },
    async upload(files: readonly File[], details: UploadDetails): Promise<Created | null> {
      patchState(store, { submitting: true, problems: [], error: null });
      try {
        const created = await firstValueFrom(api.upload(files, details));
        patchState(store, { submitting: false });
        return created;
      } catch (error) {
        const problems = uploadProblems(error);
        patchState(store, { submitting: false, problems, error: problems.length > 0 ? null : `The upload failed: ${errorMessage(error)}` });
        return null;
      }
    },
    exampleUrl(format: ExportFormat): string | null {
      const example = store.example();
      return example?.published ? api.exportUrl(example.id, example.published.id, format) : null;
    },
  })),
);
