import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';

import type { InvitationDto } from '@rampart/collab/api/accounts';

import { ROLE_LABELS } from '../../shared/teams/team-abilities';

/** Open invitations of a team (owners only), each with a button to withdraw it. */
@Component({
  selector: 'rp-pending-invitations',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatListModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (invitations().length) {
      <h3>Waiting for an answer</h3>
      <mat-list aria-label="Pending invitations" data-testid="pending-invitations">
        @for (i of invitations(); track i.id) {
          <mat-list-item>
            <mat-icon matListItemIcon aria-hidden="true">mail</mat-icon>
            <span matListItemTitle>{{ i.email }}</span>
            <span matListItemLine>
              {{ labels[i.role] }} · invited by {{ i.invitedBy }} · expires
              {{ i.expiresAt | date: 'medium' }}
            </span>
            <button
              matListItemMeta
              matIconButton
              type="button"
              [disabled]="busy()"
              [attr.aria-label]="'Withdraw the invitation to ' + i.email"
              (click)="withdraw.emit(i)"
            >
              <mat-icon>cancel_schedule_send</mat-icon>
            </button>
          </mat-list-item>
        }
      </mat-list>
    }
  `,
  styles: `
    h3 {
      font: var(--mat-sys-title-medium);
      margin: 20px 0 4px;
    }
  `,
})
export class PendingInvitations {
  readonly invitations = input.required<readonly InvitationDto[]>();
  readonly busy = input(false);
  readonly withdraw = output<InvitationDto>();
  protected readonly labels = ROLE_LABELS;
}
