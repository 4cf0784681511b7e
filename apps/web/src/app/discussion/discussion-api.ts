import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { CommentBody, CommentPage, DiscussionSummary, NotificationPreferences, OptionDetail } from '@seinework/contracts';

/** The discussion routes: comments on a shared option, moderation, following, and the list of discussions. */
@Injectable({ providedIn: 'root' })
export class DiscussionApi {
  private readonly http = inject(HttpClient);

  option(optionId: string): Observable<OptionDetail> {
    return this.http.get<OptionDetail>(`/api/options/${encodeURIComponent(optionId)}`);
  }

  comments(optionId: string, page: number): Observable<CommentPage> {
    return this.http.get<CommentPage>(`/api/options/${encodeURIComponent(optionId)}/comments`, { params: { page } });
  }

  post(optionId: string, body: CommentBody): Observable<{ id: string }> {
    return this.http.post<{ id: string }>(`/api/options/${encodeURIComponent(optionId)}/comments`, body);
  }

  edit(commentId: string, text: string): Observable<unknown> {
    return this.http.patch(`/api/comments/${encodeURIComponent(commentId)}`, { text });
  }

  hide(commentId: string, reason: string): Observable<unknown> {
    return this.http.post(`/api/comments/${encodeURIComponent(commentId)}/hide`, { reason });
  }

  follow(optionId: string, following: boolean): Observable<unknown> {
    const url = `/api/options/${encodeURIComponent(optionId)}/follow`;
    return following ? this.http.put(url, {}) : this.http.delete(url);
  }

  discussions(): Observable<{ items: DiscussionSummary[] }> {
    return this.http.get<{ items: DiscussionSummary[] }>('/api/discussions');
  }

  notificationPreferences(): Observable<NotificationPreferences> {
    return this.http.get<NotificationPreferences>('/api/me/notifications');
  }

  saveNotificationPreferences(preferences: NotificationPreferences): Observable<NotificationPreferences> {
    return this.http.put<NotificationPreferences>('/api/me/notifications', preferences);
  }
}
