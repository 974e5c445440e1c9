import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import {
  NEW_PASSWORD_VALIDATORS,
  revalidateOn,
  differsFromSibling,
  fieldMessage,
  matchesSibling,
} from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { NewPasswordFields } from '../../shared/forms/new-password-fields';
import { FormMessage } from '../../shared/forms/form-message';
import { SubmitButton } from '../../shared/forms/submit-button';
import { applyServerErrors } from '../../shared/forms/server-errors';

/** Change the signed-in user's password (needs the current one). */
@Component({
  selector: 'rp-change-password',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    FormCard,
    NewPasswordFields,
    FormMessage,
    SubmitButton,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <rp-form-card icon="key" heading="Change password">
      @if (saved()) {
        <rp-form-message tone="success" data-testid="saved"
          >Your password was changed.</rp-form-message
        >
      }
      @if (formError(); as message) {
        <rp-form-message data-testid="form-error">{{ message }}</rp-form-message>
      }
      <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>Current password</mat-label>
          <input
            matInput
            formControlName="currentPassword"
            type="password"
            autocomplete="current-password"
          />
          <mat-error>{{ message('currentPassword', 'Current password') }}</mat-error>
        </mat-form-field>
        <rp-new-password-fields passwordName="newPassword" />
        <div class="actions">
          <rp-submit-button [pending]="pending()" busyLabel="Saving"
            >Change password</rp-submit-button
          >
          <a matButton routerLink="/teams">Cancel</a>
        </div>
      </form>
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
})
export class ChangePassword {
  private readonly _session = inject(AuthSession);
  private readonly _formDirective = viewChild.required(FormGroupDirective);

  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', [Validators.required]],
    newPassword: ['', [...NEW_PASSWORD_VALIDATORS, differsFromSibling('currentPassword')]],
    repeat: ['', [Validators.required, matchesSibling('newPassword')]],
  });
  protected readonly pending = signal(false);
  protected readonly saved = signal(false);
  protected readonly formError = signal<string | null>(null);

  constructor() {
    // The repetition follows the new password inside rp-new-password-fields.
    revalidateOn(this.form.controls.currentPassword, this.form.controls.newPassword);
  }

  protected message(name: 'currentPassword', label: string): string {
    return fieldMessage(this.form.controls[name], label);
  }

  protected submit(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.pending.set(true);
    this.saved.set(false);
    this.formError.set(null);
    this._session.changePassword(currentPassword, newPassword).subscribe({
      next: () => {
        this.pending.set(false);
        this.saved.set(true);
        // Reset the directive too, or its "submitted" flag would show every field as missing.
        this._formDirective().resetForm();
      },
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
