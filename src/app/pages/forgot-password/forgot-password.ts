import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { fieldMessage } from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { FormMessage } from '../../shared/forms/form-message';
import { SubmitButton } from '../../shared/forms/submit-button';
import { applyServerErrors } from '../../shared/forms/server-errors';

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
@Component({
  selector: 'rp-forgot-password',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    FormCard,
    FormMessage,
    SubmitButton,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <rp-form-card
      icon="lock_reset"
      heading="Forgot password"
      subheading="We e-mail you a link to choose a new password."
    >
      @if (sentTo(); as address) {
        <rp-form-message tone="success" data-testid="reset-sent">
          If {{ address }} has a Rampart account, a link is on its way. It works once and expires
          soon.
        </rp-form-message>
      }
      @if (formError(); as message) {
        <rp-form-message data-testid="form-error">{{ message }}</rp-form-message>
      }
      <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>E-mail</mat-label>
          <input matInput formControlName="email" type="email" autocomplete="email" />
          <mat-error>{{ emailMessage() }}</mat-error>
        </mat-form-field>
        <div class="actions">
          <rp-submit-button [pending]="pending()" busyLabel="Sending"
            >Send reset link</rp-submit-button
          >
          <a matButton routerLink="/sign-in">Back to sign in</a>
        </div>
      </form>
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
})
export class ForgotPassword {
  private readonly _session = inject(AuthSession);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
  });
  protected readonly pending = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly sentTo = signal<string | null>(null);

  protected emailMessage(): string {
    return fieldMessage(this.form.controls.email, 'E-mail');
  }

  protected submit(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const email = this.form.controls.email.value.trim();
    this.pending.set(true);
    this.formError.set(null);
    this.sentTo.set(null);
    this._session.requestPasswordReset(email).subscribe({
      next: () => {
        this.pending.set(false);
        this.sentTo.set(email);
      },
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
