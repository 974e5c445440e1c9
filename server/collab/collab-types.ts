import type { IncomingMessage } from 'node:http';

import type { Namespace, Socket } from 'socket.io';

import type { Role } from '@rampart/collab/api/accounts';
import type {
  ClientToServerEvents,
  InterServerEvents,
  PlanSocketData,
  ServerToClientEvents,
} from '@rampart/collab/sync/events';

/** The live-plan namespace with its typed events. */
export type PlanNamespace = Namespace<
  ClientToServerEvents,
  ServerToClientEvents,
  InterServerEvents,
  PlanSocketData
>;

export type PlanSocket = Socket<
  ClientToServerEvents,
  ServerToClientEvents,
  InterServerEvents,
  PlanSocketData
>;

/** The signed-in user of a socket. */
export interface CollabUser {
  id: string;
  name: string;
}

/** Finds the signed-in user of a handshake request; null refuses the socket. */
export type Authenticate = (req: IncomingMessage) => Promise<CollabUser | null> | CollabUser | null;

/** The user's effective role on a plan, or null when they may not read it. */
export type Authorize = (userId: string, planId: string) => Promise<Role | null>;

/** Whether the session behind a live socket is still valid. */
export type CheckSession = (req: IncomingMessage) => Promise<boolean>;

/**
 * Something about a user's access changed. `planId` absent: every plan (team role changed,
 * removed from a team). `signedOut`: the user's sessions ended; their sockets close.
 */
export interface AccessChange {
  userId: string;
  planId?: string;
  signedOut?: boolean;
}

/** A source of access changes (the accounts engine's events). Returns an unsubscribe. */
export interface AccessEventSource {
  subscribe(listener: (change: AccessChange) => void): () => void;
}
