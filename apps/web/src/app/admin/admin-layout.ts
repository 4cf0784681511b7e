import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatTabsModule } from '@angular/material/tabs';

/** The admin pages under one heading, with a tab per page. */
@Component({
  selector: 'sw-admin-layout',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Administration</h1>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Administration pages">
      @for (page of pages; track page.path) {
        <a mat-tab-link [routerLink]="page.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">{{ page.label }}</a>
      }
    </nav>
    <mat-tab-nav-panel #panel>
      <router-outlet />
    </mat-tab-nav-panel>
  `,
  styles: `
    h1 {
      margin: 0 0 8px;
      font: var(--mat-sys-headline-medium);
    }
    mat-tab-nav-panel {
      display: block;
      padding-top: 24px;
    }
  `,
})
export class AdminLayout {
  protected readonly pages = [
    { path: 'users', label: 'Users' },
    { path: 'invitations', label: 'Invitations' },
    { path: 'audit', label: 'Audit log' },
    { path: 'outbox', label: 'Outbox' },
  ];
}
