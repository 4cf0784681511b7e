import { ChangeDetectionStrategy, Component, ElementRef, inject, input, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from './session-store';
import { safeReturnTo } from './signed-in-guard';

@Component({
  selector: 'sw-sign-in',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-in.html',
  styleUrl: './auth-page.scss',
})
export class SignIn {
  /** Where to go once signed in (`?returnTo=`, set by the guard). */
  readonly returnTo = input<string>();

  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly formDirective = viewChild.required(FormGroupDirective);
  private readonly passwordInput = viewChild.required<ElementRef<HTMLInputElement>>('password');
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });

  protected async signIn(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    if (await this.session.signIn(email.trim(), password)) {
      await this.router.navigateByUrl(safeReturnTo(this.returnTo()));
    } else {
      // a fresh try: empty password, no "required" shouting at it, the cursor back in it
      this.formDirective().resetForm({ email, password: '' });
      this.passwordInput().nativeElement.focus();
    }
  }
}
