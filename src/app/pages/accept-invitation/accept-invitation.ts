import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { switchMap } from 'rxjs';

import type { InvitationPreview } from '@rampart/collab/api/accounts';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { SignOutFlow } from '../../shared/auth/sign-out-flow';
import { FormCard } from '../../shared/forms/form-card';
import { FormMessage } from '../../shared/forms/form-message';
import { ROLE_HINTS, ROLE_LABELS } from '../../shared/teams/team-abilities';
import { TeamDirectory } from '../../shared/teams/team-directory';

/**
 * `/invitations/:token`, the link in the invitation e-mail. Shows what the invitation offers;
 * a signed-out visitor signs in or registers first and comes back here; a signed-in one accepts.
 * If they are signed in as another address the server refuses, and its message is shown.
 */
@Component({
  selector: 'rp-accept-invitation',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    FormCard,
    FormMessage,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <rp-form-card icon="mail" heading="Team invitation">
      @if (loadError(); as message) {
        <rp-form-message data-testid="invitation-error">{{ message }}</rp-form-message>
        <a matButton routerLink="/teams">Go to your teams</a>
      } @else if (preview(); as p) {
        <p class="offer" data-testid="invitation-offer">
          <strong>{{ p.invitedBy }}</strong> invites <strong>{{ p.email }}</strong> to join
          <strong>{{ p.teamName }}</strong> as <strong>{{ labels[p.role] }}</strong>.
        </p>
        <p class="hint">
          {{ hints[p.role] }}. The link works once and expires {{ p.expiresAt | date: 'medium' }}.
        </p>

        @if (acceptError(); as message) {
          <rp-form-message data-testid="accept-error">{{ message }}</rp-form-message>
        }
        @switch (session.status()) {
          @case ('signed-out') {
            <p>Sign in or create an account with {{ p.email }} to accept.</p>
            <div class="actions">
              <a matButton="filled" routerLink="/sign-in" [queryParams]="{ returnUrl: here() }">
                Sign in
              </a>
              <a
                matButton="tonal"
                routerLink="/register"
                [queryParams]="{ returnUrl: here(), email: p.email }"
              >
                Create an account
              </a>
            </div>
          }
          @case ('signed-in') {
            @if (otherAddress() && !acceptError()) {
              <rp-form-message tone="info" data-testid="other-address">
                You are signed in as {{ session.user()?.email }}, but this invitation is for
                {{ p.email }}.
              </rp-form-message>
            }
            <div class="actions">
              <button matButton="filled" type="button" (click)="accept()" [disabled]="pending()">
                <mat-icon>group_add</mat-icon> Accept and join
              </button>
              @if (otherAddress()) {
                <button matButton type="button" (click)="switchAccount()">
                  Sign out and use {{ p.email }}
                </button>
              }
            </div>
          }
          @default {
            <mat-progress-bar mode="indeterminate" aria-label="Checking your session" />
          }
        }
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the invitation" />
      }
    </rp-form-card>
  `,
  styleUrl: '../../shared/forms/account-form.scss',
  styles: `
    .offer {
      font: var(--mat-sys-body-large);
      margin-top: 0;
    }
    .hint {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class AcceptInvitation {
  private readonly _directory = inject(TeamDirectory);
  private readonly _router = inject(Router);
  private readonly _signOut = inject(SignOutFlow);
  protected readonly session = inject(AuthSession);

  /** `:token` from the link. */
  readonly token = input.required<string>();

  protected readonly labels = ROLE_LABELS;
  protected readonly hints = ROLE_HINTS;
  protected readonly preview = signal<InvitationPreview | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly acceptError = signal<string | null>(null);
  protected readonly pending = signal(false);
  protected readonly here = computed(() => `/invitations/${encodeURIComponent(this.token())}`);
  protected readonly otherAddress = computed(() => {
    const invited = this.preview()?.email.toLowerCase();
    const me = this.session.user()?.email.toLowerCase();
    return !!invited && !!me && invited !== me;
  });

  constructor() {
    this.session.ensureLoaded().subscribe({ error: () => undefined });
    effect(() => {
      const token = this.token();
      untracked(() => this._loadPreview(token));
    });
  }

  protected accept(): void {
    if (this.pending()) return;
    this.pending.set(true);
    this.acceptError.set(null);
    let teamId = '';
    this._directory
      .acceptInvitation(this.token())
      .pipe(
        switchMap((team) => {
          teamId = team.id;
          return this.session.refresh();
        }),
      )
      .subscribe({
        next: () => void this._router.navigate(['/teams', teamId]),
        error: (err: unknown) => {
          this.pending.set(false);
          this.acceptError.set(toApiProblem(err).message);
        },
      });
  }

  protected switchAccount(): void {
    this._signOut.signOut().subscribe((signedOut) => {
      if (signedOut) this._goToSignIn();
    });
  }

  private _goToSignIn(): void {
    void this._router.navigate(['/sign-in'], { queryParams: { returnUrl: this.here() } });
  }

  private _loadPreview(token: string): void {
    this.preview.set(null);
    this.loadError.set(null);
    this._directory.previewInvitation(token).subscribe({
      next: (p) => this.preview.set(p),
      error: (err: unknown) => {
        const problem = toApiProblem(err);
        this.loadError.set(
          problem.status === 404
            ? 'This invitation does not exist, was already used, or has expired. Ask the team owner for a new one.'
            : problem.message,
        );
      },
    });
  }
}
