import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { Router, RouterLink } from '@angular/router';
import { switchMap } from 'rxjs';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { fieldMessage } from '../../shared/forms/field-message';
import { FormMessage } from '../../shared/forms/form-message';
import { applyServerErrors } from '../../shared/forms/server-errors';
import { ROLE_LABELS } from '../../shared/teams/team-abilities';
import { TeamDirectory } from '../../shared/teams/team-directory';

const DENIED: Record<string, string> = {
  team: 'You are not a member of that team. Ask one of its owners for an invitation.',
  role: 'Your role in that team does not open that page.',
};

/** `/teams`: the caller's teams, and a form to start a new one. */
@Component({
  selector: 'rp-teams',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCardModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatListModule,
    FormMessage,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h1>Your teams</h1>
    @if (deniedText(); as text) {
      <rp-form-message data-testid="denied">{{ text }}</rp-form-message>
    }
    @if (memberships().length) {
      <mat-nav-list aria-label="Your teams">
        @for (m of memberships(); track m.teamId) {
          <a mat-list-item [routerLink]="['/teams', m.teamId]">
            <mat-icon matListItemIcon aria-hidden="true">groups</mat-icon>
            <span matListItemTitle>{{ m.teamName }}</span>
            <span matListItemLine>{{ roleLabels[m.role] }}</span>
          </a>
        }
      </mat-nav-list>
    } @else {
      <p class="empty" data-testid="no-teams">
        You are not in a team yet. Open the invitation link a team owner e-mailed you, or start a
        team below.
      </p>
    }
    <mat-card appearance="outlined" class="create">
      <mat-card-header
        ><mat-card-title><h2>Start a team</h2></mat-card-title></mat-card-header
      >
      <mat-card-content>
        @if (formError(); as message) {
          <rp-form-message>{{ message }}</rp-form-message>
        }
        <form [formGroup]="form" (ngSubmit)="create()" novalidate>
          <mat-form-field>
            <mat-label>Team name</mat-label>
            <input matInput formControlName="name" />
            <mat-hint>For example: Motor-drive controller bring-up</mat-hint>
            <mat-error>{{ nameMessage() }}</mat-error>
          </mat-form-field>
          <button matButton="tonal" type="submit" [disabled]="pending()">
            <mat-icon>add</mat-icon> Create team
          </button>
        </form>
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    :host {
      display: block;
      max-width: 720px;
      margin: 0 auto;
      padding: 24px 16px;
    }
    h1 {
      font: var(--mat-sys-headline-medium);
    }
    h2 {
      font: inherit;
      margin: 0;
    }
    .empty {
      font: var(--mat-sys-body-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .create {
      margin-top: 24px;
    }
    form {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: baseline;
      padding-top: 12px;
    }
    mat-form-field {
      flex: 1 1 280px;
    }
  `,
})
export class Teams {
  private readonly _session = inject(AuthSession);
  private readonly _directory = inject(TeamDirectory);
  private readonly _router = inject(Router);

  /** `?denied=team|role`, set by `teamRoleGuard` when it turned the user away. */
  readonly denied = input<string>();

  protected readonly roleLabels = ROLE_LABELS;
  protected readonly memberships = computed(() =>
    [...this._session.memberships()].sort((a, b) => a.teamName.localeCompare(b.teamName)),
  );
  protected readonly deniedText = computed(() => DENIED[this.denied() ?? ''] ?? null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
  });
  protected readonly pending = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected nameMessage(): string {
    return fieldMessage(this.form.controls.name, 'Team name');
  }

  protected create(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.pending.set(true);
    this.formError.set(null);
    let teamId = '';
    this._directory
      .createTeam(this.form.controls.name.value.trim())
      .pipe(
        switchMap((team) => {
          teamId = team.id;
          return this._session.refresh();
        }),
      )
      .subscribe({
        next: () => void this._router.navigate(['/teams', teamId]),
        error: (err: unknown) => {
          this.pending.set(false);
          this.formError.set(applyServerErrors(this.form, toApiProblem(err)));
        },
      });
  }
}
