import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatTooltipModule } from '@angular/material/tooltip';

import type { PresencePeer } from '../../shared/plan-session/plan-session';

/** Who has the plan open: initials on each user's colour, with the name for assistive tech. */
@Component({
  selector: 'rp-presence-avatars',
  imports: [MatTooltipModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ul aria-label="People with this plan open" data-testid="presence">
      @for (p of peers(); track p.clientId) {
        <li
          [style.--rp-avatar]="p.colour"
          [style.--rp-avatar-ink]="p.ink"
          [matTooltip]="p.isSelf ? p.name + ' (you)' : p.name"
          [attr.aria-label]="p.isSelf ? p.name + ' (you)' : p.name"
          [attr.data-user]="p.userId"
        >
          {{ p.initials }}
        </li>
      }
    </ul>
  `,
  styles: `
    ul {
      display: flex;
      margin: 0;
      padding: 0;
      list-style: none;
    }
    li {
      width: 32px;
      height: 32px;
      margin-left: -6px;
      border-radius: 50%;
      display: grid;
      place-items: center;
      font: var(--mat-sys-label-large);
      color: var(--rp-avatar-ink);
      background: var(--rp-avatar);
      border: 2px solid var(--mat-sys-surface);
    }
    li:first-child {
      margin-left: 0;
    }
  `,
})
export class PresenceAvatars {
  readonly peers = input.required<readonly PresencePeer[]>();
}
