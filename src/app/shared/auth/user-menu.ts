import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router, RouterLink } from '@angular/router';

import { AuthSession } from './auth-session';
import { SignOutFlow } from './sign-out-flow';

/**
 * Toolbar button with the signed-in user's name; its menu changes the password or signs out
 * (through `SignOutFlow`, which asks first when unsent edits would be discarded).
 */
@Component({
  selector: 'rp-user-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button
      matButton
      type="button"
      [matMenuTriggerFor]="menu"
      data-testid="user-menu"
      [attr.aria-label]="'Account of ' + name()"
    >
      <mat-icon>account_circle</mat-icon>
      <span class="name">{{ name() }}</span>
    </button>
    <mat-menu #menu="matMenu" xPosition="before">
      <div class="who" aria-hidden="true">{{ email() }}</div>
      <a mat-menu-item routerLink="/teams"><mat-icon>groups</mat-icon> Your teams</a>
      <a mat-menu-item routerLink="/account/password"> <mat-icon>key</mat-icon> Change password </a>
      <button mat-menu-item type="button" (click)="signOut()">
        <mat-icon>logout</mat-icon> Sign out
      </button>
    </mat-menu>
  `,
  styles: `
    .name {
      max-width: 18ch;
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
    }
    .who {
      padding: 8px 16px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class UserMenu {
  private readonly _session = inject(AuthSession);
  private readonly _router = inject(Router);
  private readonly _signOut = inject(SignOutFlow);

  protected readonly name = computed(() => this._session.user()?.name ?? '');
  protected readonly email = computed(() => this._session.user()?.email ?? '');

  protected signOut(): void {
    this._signOut.signOut().subscribe((signedOut) => {
      if (signedOut)
        void this._router.navigate(['/sign-in'], { queryParams: { notice: 'signed-out' } });
    });
  }
}
