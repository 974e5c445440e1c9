import type { AccessEvents } from '../domain/access-events';
import type { AccessChange, AccessEventSource } from './collab-types';

/**
 * The accounts engine's access events as the relay's `AccessEventSource`: sign-out closes the
 * user's sockets; a team membership change re-checks every plan they have open; a per-plan
 * override re-checks that plan.
 */
export function accessEventSource(events: AccessEvents): AccessEventSource {
  return {
    subscribe(listener: (change: AccessChange) => void): () => void {
      const offs = [
        events.on('signedOut', (userId) => listener({ userId, signedOut: true })),
        events.on('membershipChanged', (userId) => listener({ userId })),
        events.on('planRoleChanged', (userId, planId) => listener({ userId, planId })),
      ];
      return () => offs.forEach((off) => off());
    },
  };
}
