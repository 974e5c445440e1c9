import {
  ChangeDetectionStrategy,
  Component,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { ROLES, type InvitationDto, type Role } from '@rampart/collab/api/accounts';

import { toApiProblem } from '../../shared/api/api-error';
import { fieldMessage } from '../../shared/forms/field-message';
import { FormMessage } from '../../shared/forms/form-message';
import { applyServerErrors } from '../../shared/forms/server-errors';
import { ROLE_HINTS, ROLE_LABELS } from '../../shared/teams/team-abilities';
import { TeamDirectory } from '../../shared/teams/team-directory';

/** Invite someone by e-mail with a role; the server sends the mail with a one-time link. */
@Component({
  selector: 'rp-invite-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    FormMessage,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (sentTo(); as address) {
      <rp-form-message tone="success" data-testid="invite-sent">
        Invitation sent to {{ address }}.
      </rp-form-message>
    }
    @if (formError(); as message) {
      <rp-form-message data-testid="invite-error">{{ message }}</rp-form-message>
    }
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate aria-label="Invite a member">
      <mat-form-field class="email">
        <mat-label>E-mail to invite</mat-label>
        <input matInput formControlName="email" type="email" autocomplete="off" />
        <mat-error>{{ message('email', 'E-mail') }}</mat-error>
      </mat-form-field>
      <mat-form-field class="role">
        <mat-label>Role</mat-label>
        <mat-select formControlName="role">
          @for (r of roles; track r) {
            <mat-option [value]="r">{{ labels[r] }}</mat-option>
          }
        </mat-select>
        <mat-hint>{{ hints[form.controls.role.value] }}</mat-hint>
        <mat-error>{{ message('role', 'Role') }}</mat-error>
      </mat-form-field>
      <button matButton="filled" type="submit" [disabled]="pending()">
        <mat-icon>send</mat-icon> Send invitation
      </button>
    </form>
  `,
  styles: `
    form {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: baseline;
    }
    .email {
      flex: 2 1 260px;
    }
    .role {
      flex: 1 1 200px;
    }
  `,
})
export class InviteForm {
  private readonly _directory = inject(TeamDirectory);
  private readonly _formDirective = viewChild.required(FormGroupDirective);

  readonly teamId = input.required<string>();
  /** Emitted with the new invitation once the server accepted it. */
  readonly invited = output<InvitationDto>();

  protected readonly roles = ROLES;
  protected readonly labels = ROLE_LABELS;
  protected readonly hints = ROLE_HINTS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    // Viewer by default: the least a new member can do until an owner decides otherwise.
    role: ['viewer' as Role, [Validators.required]],
  });
  protected readonly pending = signal(false);
  protected readonly sentTo = signal<string | null>(null);
  protected readonly formError = signal<string | null>(null);

  protected message(name: 'email' | 'role', label: string): string {
    return fieldMessage(this.form.controls[name], label);
  }

  protected submit(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { email, role } = this.form.getRawValue();
    this.pending.set(true);
    this.sentTo.set(null);
    this.formError.set(null);
    this._directory.invite(this.teamId(), email.trim(), role).subscribe({
      next: (invitation) => {
        this.pending.set(false);
        this.sentTo.set(invitation.email);
        this._formDirective().resetForm({ email: '', role });
        this.invited.emit(invitation);
      },
      error: (err: unknown) => {
        this.pending.set(false);
        this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
      },
    });
  }
}
