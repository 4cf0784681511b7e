import { ChangeDetectionStrategy, Component, inject, type OnInit } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { ROLES, type InvitationSummary, type Role } from '@seinework/contracts';
import { ROLE_LABELS, RoleLabelPipe } from '../../auth/role-label';
import { ListState } from '../list-state';
import { invitationStatus, STATUS_LABELS } from './invitation-status';
import { InvitationsStore } from './invitations-store';

/** `/admin/invitations`: invite someone with a role; see who has joined; revoke an unused link. */
@Component({
  selector: 'sw-invitations-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatTableModule,
    RoleLabelPipe,
    ListState,
  ],
  providers: [InvitationsStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './invitations-page.html',
  styleUrls: ['../admin-page.scss', './invitations-page.scss'],
})
export class InvitationsPage implements OnInit {
  protected readonly store = inject(InvitationsStore);
  protected readonly roles = ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }));
  protected readonly columns = ['email', 'role', 'invitedBy', 'createdAt', 'status', 'revoke'];
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    role: ['analyst' as Role, Validators.required],
  });

  ngOnInit(): void {
    void this.store.load();
  }

  protected async invite(formDirective: FormGroupDirective): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role } = this.form.getRawValue();
    // resetting through the directive also clears "submitted", so the emptied field shows no error
    if (await this.store.invite(email.trim(), role)) formDirective.resetForm({ email: '', role });
  }

  protected status(invitation: InvitationSummary) {
    return invitationStatus(invitation);
  }

  protected statusLabel(invitation: InvitationSummary): string {
    return STATUS_LABELS[invitationStatus(invitation)];
  }

  protected revoke(invitation: InvitationSummary): void {
    void this.store.revoke(invitation);
  }

  protected showPage(event: PageEvent): void {
    void this.store.showPage(event.pageIndex, event.pageSize);
  }
}
