import { ChangeDetectionStrategy, Component, inject, type OnInit } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import { ROLES, type Role, type UserSummary } from '@seinework/contracts';
import { ROLE_LABELS } from '../../auth/role-label';
import { SessionStore } from '../../auth/session-store';
import { ListState } from '../list-state';
import { UsersStore } from './users-store';

/** `/admin/users`: everyone with an account; change a role, or stop someone signing in. */
@Component({
  selector: 'sw-users-page',
  imports: [DatePipe, MatFormFieldModule, MatPaginatorModule, MatSelectModule, MatSlideToggleModule, MatTableModule, ListState],
  providers: [UsersStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './users-page.html',
  styleUrl: '../admin-page.scss',
})
export class UsersPage implements OnInit {
  protected readonly store = inject(UsersStore);
  protected readonly session = inject(SessionStore);
  protected readonly roles = ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }));
  protected readonly columns = ['name', 'email', 'role', 'active', 'createdAt'];

  ngOnInit(): void {
    void this.store.load();
  }

  /** An admin cannot demote or deactivate themselves (the server refuses too). */
  protected isSelf(user: UserSummary): boolean {
    return user.id === this.session.user()?.id;
  }

  protected changeRole(user: UserSummary, role: Role): void {
    void this.store.update(user, { role });
  }

  protected changeActive(user: UserSummary, active: boolean): void {
    void this.store.update(user, { active });
  }

  protected showPage(event: PageEvent): void {
    void this.store.showPage(event.pageIndex, event.pageSize);
  }
}
