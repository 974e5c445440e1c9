import { DatePipe } from '@angular/common';
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
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { Observable, filter, switchMap } from 'rxjs';

import type { InvitationDto, MemberDto, PlanSummaryDto } from '@rampart/collab/api/accounts';

import { toApiProblem } from '../../shared/api/api-error';
import { AuthSession } from '../../shared/auth/auth-session';
import { askToConfirm } from '../../shared/dialogs/confirm-dialog';
import { FormMessage, type FormMessageTone } from '../../shared/forms/form-message';
import { ROLE_LABELS, teamAbilities } from '../../shared/teams/team-abilities';
import { TeamDirectory } from '../../shared/teams/team-directory';
import { InviteForm } from './invite-form';
import { MembersTable, type RoleChoice } from './members-table';
import { PendingInvitations } from './pending-invitations';

/** A result line under the heading, after a role change, removal or failed load. */
interface Notice {
  tone: FormMessageTone;
  text: string;
}

/**
 * `/teams/:teamId`: members (and, for owners, the controls to invite, change roles and remove),
 * the team's plans, and leaving the team. What the caller sees follows their role, from
 * `AuthSession`; the server refuses anything else anyway.
 */
@Component({
  selector: 'rp-team',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatProgressBarModule,
    FormMessage,
    InviteForm,
    MembersTable,
    PendingInvitations,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <header class="head">
      <div>
        <h1>{{ membership()?.teamName }}</h1>
        <p class="role" data-testid="my-role">
          <mat-icon aria-hidden="true">badge</mat-icon>
          Your role: <strong>{{ roleLabel() }}</strong>
        </p>
      </div>
      <button matButton="outlined" type="button" (click)="leave()" [disabled]="busy()">
        <mat-icon>logout</mat-icon> Leave team
      </button>
    </header>

    @if (notice(); as n) {
      <rp-form-message [tone]="n.tone" data-testid="team-notice">{{ n.text }}</rp-form-message>
    }

    <section aria-labelledby="members-heading">
      <h2 id="members-heading">Members</h2>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading members" />
      }
      <rp-members-table
        [members]="members()"
        [canManage]="abilities().canManageMembers"
        [selfId]="selfId()"
        [busy]="busy()"
        (roleChange)="changeRole($event)"
        (remove)="remove($event)"
      />
    </section>

    @if (abilities().canInvite) {
      <section aria-labelledby="invite-heading" data-testid="invite-section">
        <h2 id="invite-heading">Invite by e-mail</h2>
        <rp-invite-form [teamId]="teamId()" (invited)="invited($event)" />
        <rp-pending-invitations
          [invitations]="invitations()"
          [busy]="busy()"
          (withdraw)="withdraw($event)"
        />
      </section>
    }

    <section aria-labelledby="plans-heading">
      <h2 id="plans-heading">Plans</h2>
      @if (plans(); as list) {
        @if (list.length) {
          <mat-nav-list aria-label="Team plans">
            @for (p of list; track p.id) {
              <a mat-list-item [routerLink]="['/plans', p.id]">
                <mat-icon matListItemIcon aria-hidden="true">timeline</mat-icon>
                <span matListItemTitle>{{ p.name }}</span>
                <span matListItemLine>Updated {{ p.updatedAt | date: 'medium' }}</span>
              </a>
            }
          </mat-nav-list>
        } @else {
          <p class="empty">This team has no plans yet.</p>
        }
      } @else {
        <p class="empty">Plans are not available right now.</p>
      }
    </section>
  `,
  styleUrl: './team.scss',
})
export class Team {
  private readonly _session = inject(AuthSession);
  private readonly _directory = inject(TeamDirectory);
  private readonly _dialog = inject(MatDialog);
  private readonly _router = inject(Router);

  /** `:teamId` from the route. */
  readonly teamId = input.required<string>();

  protected readonly membership = computed(() => this._session.membership(this.teamId()));
  protected readonly abilities = computed(() => teamAbilities(this.membership()?.role));
  protected readonly roleLabel = computed(() => {
    const role = this.membership()?.role;
    return role ? ROLE_LABELS[role] : '';
  });
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly selfId = computed(() => this._session.user()?.id ?? null);

  protected readonly members = signal<readonly MemberDto[]>([]);
  protected readonly invitations = signal<readonly InvitationDto[]>([]);
  protected readonly plans = signal<readonly PlanSummaryDto[] | null>(null);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly notice = signal<Notice | null>(null);

  constructor() {
    const title = inject(Title);
    effect(() => {
      const name = this.membership()?.teamName;
      if (name) title.setTitle(`${name} · Rampart`);
    });
    // Reload whenever the route's team or the caller's role in it changes.
    effect(() => {
      const teamId = this.teamId();
      const canInvite = this.abilities().canInvite;
      untracked(() => this._load(teamId, canInvite));
    });
  }

  protected changeRole({ member, role }: RoleChoice): void {
    if (member.role === role) return;
    const isSelf = member.userId === this.selfId();
    this._run(
      this._directory.changeRole(this.teamId(), member.userId, role),
      `${member.name} is now ${ROLE_LABELS[role].toLowerCase()}.`,
      isSelf,
    );
  }

  protected remove(member: MemberDto): void {
    askToConfirm(this._dialog, {
      title: `Remove ${member.name}?`,
      message: `${member.name} (${member.email}) loses access to this team and its plans.`,
      confirm: 'Remove',
    })
      .pipe(filter(Boolean))
      .subscribe(() =>
        this._run(
          this._directory.removeMember(this.teamId(), member.userId),
          `${member.name} was removed from the team.`,
          false,
        ),
      );
  }

  protected leave(): void {
    const self = this.selfId();
    const teamName = this.membership()?.teamName ?? 'this team';
    if (!self) return;
    askToConfirm(this._dialog, {
      title: `Leave ${teamName}?`,
      message: 'You lose access to its plans until an owner invites you again.',
      confirm: 'Leave team',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.busy.set(true);
          return this._directory.removeMember(this.teamId(), self);
        }),
        switchMap(() => this._session.refresh()),
      )
      .subscribe({
        next: () => void this._router.navigate(['/teams']),
        error: (err: unknown) => {
          this.busy.set(false);
          this.notice.set({ tone: 'error', text: toApiProblem(err).message });
        },
      });
  }

  protected invited(invitation: InvitationDto): void {
    this.invitations.update((list) => [invitation, ...list.filter((i) => i.id !== invitation.id)]);
  }

  protected withdraw(invitation: InvitationDto): void {
    this.busy.set(true);
    this.notice.set(null);
    this._directory.withdrawInvitation(this.teamId(), invitation.id).subscribe({
      next: () => {
        this.busy.set(false);
        this.invitations.update((list) => list.filter((i) => i.id !== invitation.id));
        this.notice.set({
          tone: 'success',
          text: `The invitation to ${invitation.email} was withdrawn.`,
        });
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.notice.set({ tone: 'error', text: toApiProblem(err).message });
      },
    });
  }

  /** Sends one change, then reloads the members (the server's word on the result). */
  private _run(request: Observable<unknown>, success: string, refreshSelf: boolean): void {
    this.busy.set(true);
    this.notice.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(false);
        this.notice.set({ tone: 'success', text: success });
        // A change to your own role changes what this page shows: ask who-am-I again.
        if (refreshSelf) this._session.refresh().subscribe();
        this._loadMembers(this.teamId());
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.notice.set({ tone: 'error', text: toApiProblem(err).message });
        // Put the select back to what the server holds.
        this._loadMembers(this.teamId());
      },
    });
  }

  private _load(teamId: string, canInvite: boolean): void {
    this.loading.set(true);
    this._loadMembers(teamId);
    if (canInvite) {
      this._directory.invitations(teamId).subscribe({
        next: (list) => this.invitations.set(list),
        error: () => this.invitations.set([]),
      });
    } else {
      this.invitations.set([]);
    }
    this._directory.plans(teamId).subscribe({
      next: (list) => this.plans.set(list),
      // The plan list is a convenience here; without it the page still works.
      error: () => this.plans.set(null),
    });
  }

  private _loadMembers(teamId: string): void {
    this._directory.members(teamId).subscribe({
      next: (list) => {
        this.members.set(list);
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        this.notice.set({ tone: 'error', text: toApiProblem(err).message });
      },
    });
  }
}
