import { Injectable, inject } from '@angular/core';
import { HttpClient, HttpParams } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { ComparisonBrief, OptionBrief } from '@seinework/contracts';

/** The brief routes: the document as JSON for the print page, and the addresses of its PDF. */
@Injectable({ providedIn: 'root' })
export class BriefApi {
  private readonly http = inject(HttpClient);

  optionBrief(optionId: string, runId?: string): Observable<OptionBrief> {
    const params = runId ? new HttpParams().set('run', runId) : undefined;
    return this.http.get<OptionBrief>(`/api/options/${encodeURIComponent(optionId)}/brief`, { params });
  }

  comparisonBrief(runIds: readonly string[]): Observable<ComparisonBrief> {
    return this.http.get<ComparisonBrief>('/api/comparisons/brief', { params: new HttpParams().set('runs', runIds.join(',')) });
  }

  optionPdfUrl(optionId: string, runId?: string): string {
    return `/api/options/${encodeURIComponent(optionId)}/brief.pdf${runId ? `?run=${encodeURIComponent(runId)}` : ''}`;
  }

  comparisonPdfUrl(runIds: readonly string[]): string {
    return `/api/comparisons/brief.pdf?runs=${runIds.map(encodeURIComponent).join(',')}`;
  }
}
