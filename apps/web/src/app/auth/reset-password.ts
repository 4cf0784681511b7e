import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthApi } from './auth-api';
import { newPasswordValidators, passwordHint, passwordsMatch, tooShort } from './new-password';
import { problemMessage } from './problem-message';

/** `/reset-password/:token`: the link from the reset message; choose a new password. */
@Component({
  selector: 'sw-reset-password',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './reset-password.html',
  styleUrl: './auth-page.scss',
})
export class ResetPassword {
  readonly token = input.required<string>();

  private readonly api = inject(AuthApi);
  protected readonly passwordHint = passwordHint;
  protected readonly tooShort = tooShort;
  protected readonly form = inject(NonNullableFormBuilder).group(
    { password: ['', newPasswordValidators], confirm: ['', Validators.required] },
    { validators: passwordsMatch },
  );
  protected readonly saving = signal(false);
  protected readonly changed = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async setPassword(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.problem.set(null);
    try {
      await firstValueFrom(this.api.resetPassword(this.token(), this.form.controls.password.value));
      this.changed.set(true);
    } catch (error) {
      this.problem.set(problemMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
