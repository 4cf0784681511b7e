import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthApi } from './auth-api';
import { problemMessage } from './problem-message';

/** `/reset-password`: ask for a link to set a new password. */
@Component({
  selector: 'sw-reset-password-request',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './reset-password-request.html',
  styleUrl: './auth-page.scss',
})
export class ResetPasswordRequest {
  private readonly api = inject(AuthApi);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly sending = signal(false);
  /** The address a link was asked for (the server answers alike for known and unknown addresses). */
  protected readonly sentTo = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected async requestLink(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const email = this.form.controls.email.value.trim();
    this.sending.set(true);
    this.problem.set(null);
    try {
      await firstValueFrom(this.api.requestPasswordReset(email));
      this.sentTo.set(email);
    } catch (error) {
      this.problem.set(problemMessage(error));
    } finally {
      this.sending.set(false);
    }
  }
}
