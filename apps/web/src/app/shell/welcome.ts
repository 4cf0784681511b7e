import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { RoleLabelPipe } from '../auth/role-label';
import { SessionStore } from '../auth/session-store';
import { DiscussionsList } from '../discussion/discussions-list';

/**
 * `/welcome`: where someone lands whose role reads no webs (stakeholders): the options open for
 * public comment, instead of a list they would only be refused.
 */
@Component({
  selector: 'sw-welcome',
  imports: [RouterLink, RoleLabelPipe, DiscussionsList],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (session.user(); as user) {
      <section aria-labelledby="welcome-title">
        <h1 id="welcome-title">Welcome, {{ user.name }}</h1>
        <p>
          You are signed in with the role {{ user.role | roleLabel }}. Harvest options the council opens for public comment are
          listed here, each with the web it changes, so that you can read what it would do and comment on the record.
        </p>
        <h2>Open for comment</h2>
        <sw-discussions-list [embedded]="true" />
        <p>To change your password, open <a routerLink="/account">your account</a>.</p>
      </section>
    }
  `,
  styles: `
    section {
      max-width: 72ch;
    }
    h1 {
      margin: 0 0 16px;
      font: var(--mat-sys-headline-medium);
    }
    h2 {
      margin: 24px 0 0;
      font: var(--mat-sys-title-large);
    }
    a {
      color: var(--mat-sys-primary);
    }
  `,
})
export class Welcome {
  protected readonly session = inject(SessionStore);
}
