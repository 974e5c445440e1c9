import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { safeReturnUrl } from '../../shared/auth/return-url';
import {
  NEW_PASSWORD_VALIDATORS,
  fieldMessage,
  matchesSibling,
} from '../../shared/forms/field-message';
import { FormCard } from '../../shared/forms/form-card';
import { NewPasswordFields } from '../../shared/forms/new-password-fields';
import { FormMessage } from '../../shared/forms/form-message';
import { SubmitButton } from '../../shared/forms/submit-button';
import { applyServerErrors } from '../../shared/forms/server-errors';

type Field = 'name' | 'email';

/** Create an account (and be signed in), then continue to `returnUrl` (often an invitation). */
@Component({
  selector: 'rp-register',
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
    <rp-form-card
      icon="person_add"
      heading="Create an account"
      subheading="To join a team, use the address your invitation was sent to."
    >
      @if (formError(); as message) {
        <rp-form-message data-testid="form-error">{{ message }}</rp-form-message>
      }
      <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" autocomplete="name" />
          <mat-hint>Shown to your team</mat-hint>
          <mat-error>{{ message('name', 'Name') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>E-mail</mat-label>
          <input matInput formControlName="email" type="email" autocomplete="email" />
          <mat-error>{{ message('email', 'E-mail') }}</mat-error>
        </mat-form-field>
        <rp-new-password-fields label="Password" />
        <div class="actions">
          <rp-submit-button [pending]="pending()" busyLabel="Creating the account"
            >Create account</rp-submit-button
          >
        </div>
      </form>
      <p class="switch">
        Already have an account?
        <a routerLink="/sign-in" [queryParams]="returnParams()">Sign in</a>
      </p>
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
})
export class Register implements OnInit {
  private readonly _session = inject(AuthSession);
  private readonly _router = inject(Router);

  /** `?returnUrl=`: where to go once the account exists. */
  readonly returnUrl = input<string>();
  /** `?email=`: prefilled from an invitation. */
  readonly email = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    password: ['', [...NEW_PASSWORD_VALIDATORS]],
    repeat: ['', [Validators.required, matchesSibling('password')]],
  });
  protected readonly pending = signal(false);
  protected readonly formError = signal<string | null>(null);

  ngOnInit(): void {
    const email = this.email();
    if (email) this.form.controls.email.setValue(email);
  }

  protected returnParams(): Record<string, string> {
    const url = this.returnUrl();
    return url ? { returnUrl: url } : {};
  }

  protected message(name: Field, label: string): string {
    return fieldMessage(this.form.controls[name], label);
  }

  protected submit(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { name, email, password } = this.form.getRawValue();
    this.pending.set(true);
    this.formError.set(null);
    this._session.register(email.trim(), password, name.trim()).subscribe({
      next: () => void this._router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
