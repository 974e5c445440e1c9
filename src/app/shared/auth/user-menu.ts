import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router, RouterLink } from '@angular/router';

import { askToConfirm } from '../dialogs/confirm-dialog';
import { OfflineCopyRegistry } from '../plan-session/offline-copy-registry';
import { AuthSession } from './auth-session';

/** The question before a sign-out that would discard `count` unsent edits. */
export function discardQuestion(count: number): {
  title: string;
  message: string;
  confirm: string;
} {
  const edits = count === 1 ? '1 edit' : `${count} edits`;
  return {
    title: 'Discard unsent edits?',
    message:
      `${edits} made in this browser ${count === 1 ? 'has' : 'have'} not reached the server ` +
      'yet. Signing out deletes the copies of your plans kept in this browser, and ' +
      `${count === 1 ? 'that edit' : 'those edits'} with them. Cancel to stay signed in: ` +
      'unsent edits are sent as soon as the connection is back.',
    confirm: 'Sign out anyway',
  };
}

/**
 * Toolbar button with the signed-in user's name; its menu changes the password or signs out.
 * Signing out deletes this browser's offline copies of the user's plans, so when some edit in
 * them has not reached the server yet it asks first.
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
  private readonly _dialog = inject(MatDialog);
  private readonly _offlineCopies = inject(OfflineCopyRegistry);

  protected readonly name = computed(() => this._session.user()?.name ?? '');
  protected readonly email = computed(() => this._session.user()?.email ?? '');

  protected async signOut(): Promise<void> {
    const userId = this._session.user()?.id;
    const unsent = userId ? await this._offlineCopies.unsentEdits(userId).catch(() => 0) : 0;
    if (unsent > 0) {
      askToConfirm(this._dialog, discardQuestion(unsent)).subscribe((yes) => {
        if (yes) this._signOutNow();
      });
    } else this._signOutNow();
  }

  private _signOutNow(): void {
    const done = () =>
      void this._router.navigate(['/sign-in'], { queryParams: { notice: 'signed-out' } });
    this._session.signOut().subscribe({ complete: done, error: done });
  }
}
