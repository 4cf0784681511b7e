import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { Observable } from 'rxjs';
import type { OptionDetail, OptionPreview, OptionSummary, RunSummary, ShareSummary, StoredOptionBody, VersionDetail } from '@seinework/contracts';

export interface Created {
  readonly id: string;
}

export interface RunSettings {
  draws?: number;
  cv?: number;
  seed?: number;
}

export interface ShareRequest {
  audience: ShareSummary['audience'];
  closesAt?: string;
  runId?: string;
}

interface Listed<T> {
  items: T[];
  total: number;
}

/** The harvest-option and run routes of the server (apps/server/src/options, apps/server/src/runs). */
@Injectable({ providedIn: 'root' })
export class OptionsApi {
  private readonly http = inject(HttpClient);

  list(webId: string, versionId: string): Observable<Listed<OptionSummary>> {
    return this.http.get<Listed<OptionSummary>>(`${versionPath(webId, versionId)}/options`);
  }

  /** The baseline an option stands on: its WEB.json names the fleets and compartments. */
  version(webId: string, versionId: string): Observable<VersionDetail> {
    return this.http.get<VersionDetail>(versionPath(webId, versionId));
  }

  preview(webId: string, versionId: string, body: StoredOptionBody): Observable<OptionPreview> {
    return this.http.post<OptionPreview>(`${versionPath(webId, versionId)}/options/preview`, body);
  }

  create(webId: string, versionId: string, body: StoredOptionBody): Observable<Created> {
    return this.http.post<Created>(`${versionPath(webId, versionId)}/options`, body);
  }

  detail(id: string): Observable<OptionDetail> {
    return this.http.get<OptionDetail>(optionPath(id));
  }

  update(id: string, body: StoredOptionBody): Observable<unknown> {
    return this.http.put(optionPath(id), body);
  }

  duplicate(id: string): Observable<Created> {
    return this.http.post<Created>(`${optionPath(id)}/duplicate`, {});
  }

  remove(id: string): Observable<unknown> {
    return this.http.delete(optionPath(id));
  }

  runs(optionId: string): Observable<Listed<RunSummary>> {
    return this.http.get<Listed<RunSummary>>(`${optionPath(optionId)}/runs`);
  }

  startRun(optionId: string, settings: RunSettings): Observable<RunSummary> {
    return this.http.post<RunSummary>(`${optionPath(optionId)}/runs`, settings);
  }

  cancelRun(runId: string): Observable<RunSummary> {
    return this.http.post<RunSummary>(`/api/runs/${encodeURIComponent(runId)}/cancel`, {});
  }

  share(optionId: string, request: ShareRequest): Observable<Created> {
    return this.http.post<Created>(`${optionPath(optionId)}/shares`, request);
  }

  withdrawShare(shareId: string): Observable<unknown> {
    return this.http.delete(`/api/shares/${encodeURIComponent(shareId)}`);
  }

  /**
   * A run as it moves, from the server-sent events of `GET /api/runs/:id/events` (`progress` and
   * `status`, each the run in brief). Completes after done, failed or cancelled; unsubscribing
   * closes the stream. EventSource would reconnect on its own after the server ends the stream,
   * so the end of a run closes it here rather than leaving the browser to ask again.
   */
  runEvents(runId: string): Observable<RunSummary> {
    return new Observable<RunSummary>((subscriber) => {
      const source = new EventSource(`/api/runs/${encodeURIComponent(runId)}/events`);
      const receive = (event: MessageEvent<string>) => {
        const run = JSON.parse(event.data) as RunSummary;
        subscriber.next(run);
        if (FINISHED.has(run.status)) subscriber.complete();
      };
      source.addEventListener('progress', receive);
      source.addEventListener('status', receive);
      source.onerror = () => {
        // CLOSED: the server refused the stream (the run went); otherwise the browser is reconnecting
        if (source.readyState === EventSource.CLOSED) subscriber.error(new Error('The run can no longer be followed.'));
      };
      return () => source.close();
    });
  }
}

export const FINISHED: ReadonlySet<RunSummary['status']> = new Set(['done', 'failed', 'cancelled']);

function versionPath(webId: string, versionId: string): string {
  return `/api/webs/${encodeURIComponent(webId)}/versions/${encodeURIComponent(versionId)}`;
}

function optionPath(id: string): string {
  return `/api/options/${encodeURIComponent(id)}`;
}
