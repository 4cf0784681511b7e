import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { RoleLabelPipe } from '../auth/role-label';
import { SessionStore } from '../auth/session-store';

/**
 * `/welcome`: where someone lands whose role reads no webs (stakeholders, until options are opened
 * for public comment), instead of a list they would only be refused.
 */
@Component({
  selector: 'sw-welcome',
  imports: [RouterLink, RoleLabelPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (session.user(); as user) {
      <section aria-labelledby="welcome-title">
        <h1 id="welcome-title">Welcome, {{ user.name }}</h1>
        <p>
          You are signed in with the role {{ user.role | roleLabel }}. Harvest options the council opens for public comment will
          be listed here, each with the web it changes and what it would do, so that you can read them and comment on the record.
        </p>
        <p class="nothing" role="status">Nothing is open for public comment yet.</p>
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
    .nothing {
      padding: 24px;
      border-radius: 12px;
      text-align: center;
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface-variant);
    }
    a {
      color: var(--mat-sys-primary);
    }
  `,
})
export class Welcome {
  protected readonly session = inject(SessionStore);
}
