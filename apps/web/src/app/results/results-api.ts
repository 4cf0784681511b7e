import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { OptionDetail, RunDetail, VersionDetail, Web } from '@seinework/contracts';
import type { HarvestSensitivity } from './result-document';

/** The routes the result page reads. */
@Injectable({ providedIn: 'root' })
export class ResultsApi {
  private readonly http = inject(HttpClient);

  /** With every n×n table: the page shows diet dependence, fleet effects and cycles. */
  run(id: string): Observable<RunDetail> {
    return this.http.get<RunDetail>(`/api/runs/${encodeURIComponent(id)}`, { params: { tables: 'all' } });
  }

  /** The stored option the run belongs to: its purpose. */
  option(id: string): Observable<OptionDetail> {
    return this.http.get<OptionDetail>(`/api/options/${encodeURIComponent(id)}`);
  }

  /** The baseline version the run stands on: its number and the web as published. */
  version(webId: string, versionId: string): Observable<VersionDetail> {
    return this.http.get<VersionDetail>(`/api/webs/${encodeURIComponent(webId)}/versions/${encodeURIComponent(versionId)}`);
  }

  /** Harvest sensitivity of a web: not part of the run's document, computed on request (stateless). */
  sensitivity(web: Web, response: string): Observable<HarvestSensitivity> {
    return this.http.post<HarvestSensitivity>('/api/options/sensitivity', { web, response });
  }
}
