import { Injectable, inject } from '@angular/core';
import { HttpClient, HttpParams } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { Comparison, OptionSummary, Page, PreferenceSummary, WebDetail, WebSummary } from '@seinework/contracts';

/** What a comparison reads from the server: the webs and options to pick from, the comparison, and preferences. */
@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  webs(): Observable<Page<WebSummary>> {
    return this.http.get<Page<WebSummary>>('/api/webs', { params: new HttpParams().set('pageSize', 100).set('sort', 'name').set('direction', 'asc') });
  }

  web(id: string): Observable<WebDetail> {
    return this.http.get<WebDetail>(`/api/webs/${encodeURIComponent(id)}`);
  }

  options(webId: string, versionId: string): Observable<Page<OptionSummary>> {
    return this.http.get<Page<OptionSummary>>(`/api/webs/${encodeURIComponent(webId)}/versions/${encodeURIComponent(versionId)}/options`);
  }

  comparison(runIds: readonly string[]): Observable<Comparison> {
    return this.http.get<Comparison>('/api/comparisons', { params: new HttpParams().set('runs', runIds.join(',')) });
  }

  recordPreference(optionId: string, body: { reason: string; comparedRuns: readonly string[] }): Observable<{ id: string }> {
    return this.http.post<{ id: string }>(`/api/options/${encodeURIComponent(optionId)}/preferences`, body);
  }

  preferences(optionId: string): Observable<{ items: PreferenceSummary[]; total: number }> {
    return this.http.get<{ items: PreferenceSummary[]; total: number }>(`/api/options/${encodeURIComponent(optionId)}/preferences`);
  }
}
