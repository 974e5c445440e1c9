import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { NEW_PASSWORD_VALIDATORS, matchesSibling } from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { NewPasswordFields } from '../../shared/forms/new-password-fields';
import { FormMessage } from '../../shared/forms/form-message';
import { SubmitButton } from '../../shared/forms/submit-button';
import { applyServerErrors } from '../../shared/forms/server-errors';

/**
 * `/reset-password/<token>` (the mailed link) or `/reset-password?token=…`: choose a new password
 * with the one-time token from the e-mail.
 */
@Component({
  selector: 'rp-reset-password',
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
    <rp-form-card icon="password" heading="Choose a new password">
      @if (!token()) {
        <rp-form-message data-testid="form-error">
          This page needs the link from the reset e-mail.
          <a routerLink="/forgot-password">Ask for a new link</a>.
        </rp-form-message>
      } @else {
        @if (formError(); as message) {
          <rp-form-message data-testid="form-error">
            {{ message }} <a routerLink="/forgot-password">Ask for a new link</a>.
          </rp-form-message>
        }
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <rp-new-password-fields />
          <div class="actions">
            <rp-submit-button [pending]="pending()" busyLabel="Saving"
              >Save password</rp-submit-button
            >
          </div>
        </form>
      }
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
})
export class ResetPassword {
  private readonly _session = inject(AuthSession);
  private readonly _router = inject(Router);

  /** `:token` (or `?token=`) from the e-mailed link. */
  readonly token = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [...NEW_PASSWORD_VALIDATORS]],
    repeat: ['', [Validators.required, matchesSibling('password')]],
  });
  protected readonly pending = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected submit(): void {
    const token = this.token();
    if (this.pending() || !token) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.pending.set(true);
    this.formError.set(null);
    this._session.confirmPasswordReset(token, this.form.controls.password.value).subscribe({
      next: () =>
        void this._router.navigate(['/sign-in'], { queryParams: { notice: 'password-reset' } }),
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
