import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { Observable, from, of, switchMap } from 'rxjs';
import { catchError, defaultIfEmpty, map } from 'rxjs/operators';

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
 * Every way out of an account goes through here (the user menu, "use another account" on an
 * invitation): signing out deletes this browser's offline copies of the user's plans, so when
 * some edit in them has not reached the server yet the user is asked first.
 */
@Injectable({ providedIn: 'root' })
export class SignOutFlow {
  private readonly _session = inject(AuthSession);
  private readonly _dialog = inject(MatDialog);
  private readonly _offlineCopies = inject(OfflineCopyRegistry);

  /**
   * Asks when unsent edits would be lost, then signs out. Emits once: true when signed out (the
   * local state is cleared even if the request failed), false when the user chose to stay.
   */
  signOut(): Observable<boolean> {
    const userId = this._session.user()?.id;
    const unsent = userId
      ? from(this._offlineCopies.unsentEdits(userId)).pipe(catchError(() => of(0)))
      : of(0);
    return unsent.pipe(
      switchMap((count) =>
        count > 0 ? askToConfirm(this._dialog, discardQuestion(count)) : of(true),
      ),
      switchMap((go) =>
        go
          ? this._session.signOut().pipe(
              map(() => true),
              defaultIfEmpty(true),
              catchError(() => of(true)),
            )
          : of(false),
      ),
    );
  }
}
