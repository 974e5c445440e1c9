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
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import {
  NEW_PASSWORD_VALIDATORS,
  revalidateOn,
  PASSWORD_MIN_LENGTH,
  differsFromSibling,
  fieldMessage,
  matchesSibling,
} from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { FormMessage } from '../../shared/forms/form-message';
import { applyServerErrors } from '../../shared/forms/server-errors';

type Field = 'currentPassword' | 'newPassword' | 'repeat';

/** Change the signed-in user's password (needs the current one). */
@Component({
  selector: 'rp-change-password',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressSpinnerModule,
    FormCard,
    FormMessage,
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
        <mat-form-field>
          <mat-label>New password</mat-label>
          <input
            matInput
            formControlName="newPassword"
            type="password"
            autocomplete="new-password"
          />
          <mat-hint>At least {{ minLength }} characters</mat-hint>
          <mat-error>{{ message('newPassword', 'New password') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Repeat new password</mat-label>
          <input matInput formControlName="repeat" type="password" autocomplete="new-password" />
          <mat-error>{{ message('repeat', 'Repeated password') }}</mat-error>
        </mat-form-field>
        <div class="actions">
          <button matButton="filled" type="submit" [disabled]="pending()">
            @if (pending()) {
              <mat-spinner diameter="18" aria-label="Saving" />
            }
            Change password
          </button>
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

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', [Validators.required]],
    newPassword: ['', [...NEW_PASSWORD_VALIDATORS, differsFromSibling('currentPassword')]],
    repeat: ['', [Validators.required, matchesSibling('newPassword')]],
  });
  protected readonly pending = signal(false);
  protected readonly saved = signal(false);
  protected readonly formError = signal<string | null>(null);

  constructor() {
    const { currentPassword, newPassword, repeat } = this.form.controls;
    revalidateOn(currentPassword, newPassword);
    revalidateOn(newPassword, repeat);
  }

  protected message(name: Field, label: string): string {
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
