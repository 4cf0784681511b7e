import { type AbstractControl, type ValidationErrors, type ValidatorFn, Validators } from '@angular/forms';
import { MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH } from '@seinework/contracts';

/** The rules the server applies to a new password (contracts' newPasswordSchema), checked before sending. */
export const newPasswordValidators: ValidatorFn[] = [
  Validators.required,
  Validators.minLength(MIN_PASSWORD_LENGTH),
  Validators.maxLength(MAX_PASSWORD_LENGTH),
];

export const passwordHint = `At least ${MIN_PASSWORD_LENGTH} characters. A short sentence is easy to remember.`;
export const tooShort = `Use at least ${MIN_PASSWORD_LENGTH} characters.`;

/** Group validator: `confirm` must repeat `password`; the error sits on the confirm field so it shows there. */
export const passwordsMatch: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const password = group.get('password');
  const confirm = group.get('confirm');
  if (!password || !confirm) return null;
  const mismatch = confirm.value !== '' && password.value !== confirm.value;
  const others = { ...confirm.errors };
  delete others['mismatch'];
  confirm.setErrors(mismatch ? { ...others, mismatch: true } : Object.keys(others).length > 0 ? others : null);
  return mismatch ? { mismatch: true } : null;
};
