import { AbstractControl, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';

/**
 * The one inline message for a control, in plain words naming the field. Order matters: the
 * server's own message wins, then "missing", then format, then length.
 */
export function fieldMessage(control: AbstractControl, label: string): string {
  const e = control.errors;
  if (!e) return '';
  if (typeof e['server'] === 'string') return e['server'];
  if (e['required']) return `${label} is required.`;
  if (e['email']) return `${label} must be an e-mail address like name@example.com.`;
  if (e['minlength']) {
    const { requiredLength } = e['minlength'] as { requiredLength: number };
    return `${label} needs at least ${requiredLength} characters.`;
  }
  if (e['maxlength']) {
    const { requiredLength } = e['maxlength'] as { requiredLength: number };
    return `${label} can have at most ${requiredLength} characters.`;
  }
  if (e['mismatch']) return `${label} does not match.`;
  if (e['sameAsCurrent']) return `${label} must differ from the current password.`;
  return `${label} is not valid.`;
}

/**
 * Validator for a "repeat" control: invalid (`mismatch`) unless it equals the sibling control
 * named `otherName`. Put on the repeat control so the message sits under the field the user
 * fixes; the page re-validates it when the first field changes.
 */
export function matchesSibling(otherName: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const other = control.parent?.get(otherName);
    if (!other || control.value === '' || control.value === other.value) return null;
    return { mismatch: true };
  };
}

/** Validator: invalid (`sameAsCurrent`) when the control equals the sibling `otherName`. */
export function differsFromSibling(otherName: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const other = control.parent?.get(otherName);
    if (!other || control.value === '' || control.value !== other.value) return null;
    return { sameAsCurrent: true };
  };
}

/**
 * Password rules the client checks before sending. The server is the authority; these only
 * spare a round trip. Length bounds: common practice, no source (bcrypt only reads 72 bytes).
 */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 72;

/** Validators of a new password: required, within the length bounds the server enforces. */
export const NEW_PASSWORD_VALIDATORS: readonly ValidatorFn[] = [
  Validators.required,
  Validators.minLength(PASSWORD_MIN_LENGTH),
  Validators.maxLength(PASSWORD_MAX_LENGTH),
];

/**
 * Re-validates `dependent` whenever `source` changes: cross-field checks sit on the field the
 * user fixes (see `matchesSibling`), so they must re-run when the other field moves.
 */
export function revalidateOn(source: AbstractControl, dependent: AbstractControl): void {
  source.valueChanges.subscribe(() => dependent.updateValueAndValidity({ emitEvent: false }));
}
