import type { Logger } from '../logger';
import type { AccessChange, Authorize } from './collab-types';
import { isReadOnlyRole } from '@rampart/collab/sync/read-only-roles';
import { leaveRoom, type SocketSession } from './plan-socket-handlers';
import type { RoomRegistry } from './room-registry';

/** Tells a socket its session ended and closes it. */
export function endSession(session: SocketSession, log: Logger): void {
  log.info(`[collab] socket ${session.socket.id}: session ended, disconnecting`);
  session.socket.emit('plan:session-ended', {
    code: 'unauthenticated',
    message: 'Your session ended; sign in again.',
  });
  session.socket.disconnect(true);
}

/**
 * Applies an access change to the user's live sockets in this process at once: sign-out closes
 * them; a revoked plan is left (presence removed); a changed role switches read-only on or off
 * before the next message is handled.
 */
export async function applyAccessChange(
  change: AccessChange,
  sessions: ReadonlyMap<string, SocketSession>,
  registry: RoomRegistry,
  authorize: Authorize,
  log: Logger,
): Promise<void> {
  const mine = [...sessions.values()].filter((s) => s.socket.data.userId === change.userId);
  for (const session of mine) {
    if (change.signedOut) {
      endSession(session, log);
      continue;
    }
    const plans = [...session.joined.keys()].filter((p) => !change.planId || p === change.planId);
    for (const planId of plans) {
      const membership = session.joined.get(planId);
      if (!membership) continue;
      // Until the new role is known, treat the socket as read-only: a revoke must not leak.
      membership.readOnly = true;
      let role;
      try {
        role = await authorize(change.userId, planId);
      } catch (err) {
        log.error(`[collab] plan ${planId}: re-checking access failed; leaving the room`, err);
        role = null;
      }
      if (role === null) {
        leaveRoom(session, planId, registry);
        session.socket.emit('plan:access-changed', planId, { role: null, readOnly: true });
        continue;
      }
      membership.role = role;
      membership.readOnly = isReadOnlyRole(role);
      session.socket.emit('plan:access-changed', planId, { role, readOnly: membership.readOnly });
    }
  }
}
