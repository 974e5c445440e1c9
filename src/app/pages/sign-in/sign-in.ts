import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { safeReturnUrl } from '../../shared/auth/return-url';
import { fieldMessage } from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { FormMessage } from '../../shared/forms/form-message';
import { SubmitButton } from '../../shared/forms/submit-button';
import { applyServerErrors } from '../../shared/forms/server-errors';

/** Notices other pages send here with `?notice=`. */
const NOTICES: Record<string, string> = {
  'password-reset': 'Your password was changed. Sign in with the new one.',
  'signed-out': 'You are signed out.',
};

/** Sign-in page: e-mail and password, then back to where the user came from. */
@Component({
  selector: 'rp-sign-in',
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
    <rp-form-card icon="lock" heading="Sign in" subheading="Use the account your team invited.">
      @if (noticeText(); as text) {
        <rp-form-message tone="success">{{ text }}</rp-form-message>
      }
      @if (formError(); as message) {
        <rp-form-message data-testid="form-error">{{ message }}</rp-form-message>
      }
      <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>E-mail</mat-label>
          <input matInput formControlName="email" type="email" autocomplete="username" />
          <mat-error>{{ message('email', 'E-mail') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Password</mat-label>
          <input
            matInput
            formControlName="password"
            type="password"
            autocomplete="current-password"
          />
          <mat-error>{{ message('password', 'Password') }}</mat-error>
        </mat-form-field>
        <div class="actions">
          <rp-submit-button [pending]="pending()" busyLabel="Signing in">Sign in</rp-submit-button>
          <a matButton routerLink="/forgot-password">Forgot password?</a>
        </div>
      </form>
      <p class="switch">
        No account yet?
        <a routerLink="/register" [queryParams]="returnParams()">Create one</a>
      </p>
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
})
export class SignIn {
  private readonly _session = inject(AuthSession);
  private readonly _router = inject(Router);

  /** `?returnUrl=`: where to go after signing in (a path on this site only). */
  readonly returnUrl = input<string>();
  /** `?notice=`: a confirmation from the page that sent the user here. */
  readonly notice = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required]],
  });
  protected readonly pending = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected noticeText(): string | null {
    return NOTICES[this.notice() ?? ''] ?? null;
  }

  protected returnParams(): Record<string, string> {
    const url = this.returnUrl();
    return url ? { returnUrl: url } : {};
  }

  protected message(name: 'email' | 'password', label: string): string {
    return fieldMessage(this.form.controls[name], label);
  }

  protected submit(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { email, password } = this.form.getRawValue();
    this.pending.set(true);
    this.formError.set(null);
    this._session.signIn(email.trim(), password).subscribe({
      next: () => void this._router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
