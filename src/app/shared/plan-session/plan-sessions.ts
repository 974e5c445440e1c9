import { Injectable, inject } from '@angular/core';

import { OfflineCopies } from './offline-copy';
import { PlanSession, type SessionUser } from './plan-session';
import { PlanSocketFactory } from './plan-socket';

/**
 * Opens live plan sessions. Each session owns its socket, doc and offline copy, so a page opens
 * one on init and closes it on destroy; nothing outlives the page but the offline copy, which
 * stays in this browser until the user signs out.
 */
@Injectable({ providedIn: 'root' })
export class PlanSessions {
  private readonly _sockets = inject(PlanSocketFactory);
  private readonly _offline = inject(OfflineCopies);

  /** Opens `planId` as `user` and starts syncing (after the offline copy has loaded). */
  open(planId: string, user: SessionUser): PlanSession {
    const session = new PlanSession(planId, user, this._sockets.open(), (doc) =>
      this._offline.attach(user.id, planId, doc),
    );
    void session.start();
    return session;
  }
}
