import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { personNameSchema } from '@seinework/contracts';
import { AuthApi } from './auth-api';
import { newPasswordValidators, passwordHint, passwordsMatch, tooShort } from './new-password';
import { problemMessage } from './problem-message';
import { SessionStore } from './session-store';
import { RoleLabelPipe } from './role-label';

/** `/invitation/:token`: the invited person sees who they were invited as, and sets a name and password. */
@Component({
  selector: 'sw-accept-invitation',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, RoleLabelPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './accept-invitation.html',
  styleUrl: './auth-page.scss',
})
export class AcceptInvitation {
  readonly token = input.required<string>();

  private readonly api = inject(AuthApi);
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly invitation = rxResource({ params: () => this.token(), stream: ({ params }) => this.api.invitation(params) });
  protected readonly passwordHint = passwordHint;
  protected readonly tooShort = tooShort;
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      name: ['', [Validators.required, Validators.maxLength(120)]],
      password: ['', newPasswordValidators],
      confirm: ['', Validators.required],
    },
    { validators: passwordsMatch },
  );
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected invitationProblem(): string {
    return problemMessage(this.invitation.error());
  }

  protected async accept(): Promise<void> {
    const name = personNameSchema.safeParse(this.form.controls.name.value);
    if (this.form.invalid || !name.success) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.problem.set(null);
    try {
      const user = await firstValueFrom(this.api.acceptInvitation(this.token(), name.data, this.form.controls.password.value));
      this.session.signedInAs(user);
      await this.router.navigateByUrl('/webs');
    } catch (error) {
      this.problem.set(problemMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
