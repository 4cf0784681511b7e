import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { Analysis } from '@seinework/contracts';

/** A baseline web with its analysis, as the server sends it. */
export interface BaselineSummary {
  readonly name: string;
  readonly unit: string;
  readonly compartments: readonly { id: string; name: string; kind: string }[];
  readonly analysis: Analysis;
}

@Injectable({ providedIn: 'root' })
export class BaselineData {
  private readonly http = inject(HttpClient);

  demoBaseline(): Observable<BaselineSummary> {
    return this.http.get<BaselineSummary>('/api/demo/baseline');
  }
}
