import { Injectable, inject } from '@angular/core';
import { HttpClient, HttpParams } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type {
  Analysis,
  BalancePreview,
  Page,
  VersionDetail,
  VersionSummary,
  Web,
  WebDetail,
  WebListQuery,
  WebSummary,
} from '@seinework/contracts';

/** What the server answers when it stores a new web or a new version. */
export interface Created {
  readonly id: string;
  readonly versionId: string;
}

export type BalanceMethod = BalancePreview['method'];
export type ExportFormat = 'json' | 'csv' | 'xlsx';

/** Name, place and the rest that travel beside an uploaded file. */
export interface UploadDetails {
  readonly name: string;
  readonly unit: string;
  readonly place: string;
  readonly period: string;
  readonly note: string;
}

/** Every route of the Webs API (ARCH7.md). */
@Injectable({ providedIn: 'root' })
export class WebsApi {
  private readonly http = inject(HttpClient);

  list(query: Partial<WebListQuery>): Observable<Page<WebSummary>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<Page<WebSummary>>('/api/webs', { params });
  }

  create(web: Web, details: { place?: string; period?: string; note?: string } = {}): Observable<Created> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(details)) if (value) params = params.set(key, value);
    return this.http.post<Created>('/api/webs', web, { params });
  }

  /** One workbook or WEB.json file, or CSV tables (one combined file or one file per table). */
  upload(files: readonly File[], details: UploadDetails): Observable<Created> {
    const form = new FormData();
    for (const [key, value] of Object.entries(details)) if (value) form.append(key, value);
    // files go last so that the server has read the text fields when it parses them
    for (const file of files) form.append('file', file, file.name);
    return this.http.post<Created>('/api/webs/upload', form);
  }

  web(id: string): Observable<WebDetail> {
    return this.http.get<WebDetail>(`/api/webs/${encodeURIComponent(id)}`);
  }

  version(webId: string, versionId: string): Observable<VersionDetail> {
    return this.http.get<VersionDetail>(versionPath(webId, versionId));
  }

  analysis(webId: string, versionId: string): Observable<Analysis> {
    return this.http.get<Analysis>(`${versionPath(webId, versionId)}/analysis`);
  }

  saveDraft(webId: string, body: { web: Web; note?: string; basedOn?: string }): Observable<Created> {
    return this.http.post<Created>(`/api/webs/${encodeURIComponent(webId)}/versions`, body);
  }

  publish(webId: string, versionId: string): Observable<VersionSummary> {
    return this.http.post<VersionSummary>(`${versionPath(webId, versionId)}/publish`, {});
  }

  clone(webId: string, versionId: string, body: { name: string; place?: string; period?: string }): Observable<Created> {
    return this.http.post<Created>(`${versionPath(webId, versionId)}/clone`, body);
  }

  /** Where the browser downloads a version from (a plain link: the server sends it as an attachment). */
  exportUrl(webId: string, versionId: string, format: ExportFormat): string {
    return `${versionPath(webId, versionId)}/export?format=${format}`;
  }

  balance(web: Web, method: BalanceMethod): Observable<BalancePreview> {
    return this.http.post<BalancePreview>('/api/webs/balance', { web, method });
  }
}

function versionPath(webId: string, versionId: string): string {
  return `/api/webs/${encodeURIComponent(webId)}/versions/${encodeURIComponent(versionId)}`;
}
