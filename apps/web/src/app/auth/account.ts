import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthApi } from './auth-api';
import { newPasswordValidators, passwordHint, passwordsMatch, tooShort } from './new-password';
import { problemMessage } from './problem-message';
import { RoleLabelPipe } from './role-label';
import { SessionStore } from './session-store';
import { NotificationSettings } from '../discussion/notification-settings';

/** `/account`: who is signed in, changing the password, and which e-mails to get. */
@Component({
  selector: 'sw-account',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, RoleLabelPipe, NotificationSettings],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './account.html',
  styleUrl: './auth-page.scss',
})
export class Account {
  private readonly api = inject(AuthApi);
  protected readonly session = inject(SessionStore);
  protected readonly passwordHint = passwordHint;
  protected readonly tooShort = tooShort;
  protected readonly form = inject(NonNullableFormBuilder).group(
    { currentPassword: ['', Validators.required], password: ['', newPasswordValidators], confirm: ['', Validators.required] },
    { validators: passwordsMatch },
  );
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly saving = signal(false);
  protected readonly changed = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async changePassword(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, password } = this.form.getRawValue();
    this.saving.set(true);
    this.problem.set(null);
    this.changed.set(false);
    try {
      await firstValueFrom(this.api.changePassword(currentPassword, password));
      this.changed.set(true);
      // through the directive, so the emptied fields are not shown as missing
      this.formDirective().resetForm();
    } catch (error) {
      this.problem.set(problemMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
