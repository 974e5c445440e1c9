/**
 * The live-plan wire contract over socket.io, shared by the server relay and the client session.
 *
 * Flow: connect to `PLAN_NAMESPACE` (the express session cookie authenticates the handshake) →
 * `plan:join` (ack tells the role and whether the socket is read-only) → the server sends its
 * sync step 1 and the current presence in `plan:synced` → the client answers step 1 with step 2
 * and sends its own step 1 through `plan:sync` → the server answers with step 2 (possibly in
 * several chunks). From then on both sides send updates and awareness through the same two
 * events. Every `plan:sync` carrying an update is acknowledged only after the update is stored in
 * PostgreSQL; a client counts unacknowledged updates as "unsent edits". After every reconnect the
 * client joins again and re-runs sync step 1.
 */
import type { Role } from '../api/accounts';
import type { SyncError } from './errors';

/** The socket.io namespace of live plans. */
export const PLAN_NAMESPACE = '/plans';

/** A plan's id (uuid of its catalogue row). */
export type PlanId = string;

/** Either the result or a whitelisted error; every ack has this shape. */
export type Response<T> = { data: T } | { error: SyncError };

/** Binary payload as received: Node gives a `Buffer` (a Uint8Array), browsers an ArrayBuffer. */
export type WireBytes = Uint8Array | ArrayBuffer;

/**
 * A sync or awareness message between client and server: its y-protocols bytes in base64, so a
 * socket.io packet is one text frame (see `wire-codec.ts`).
 */
export type WireText = string;

/** Ack of `plan:join`. */
export interface JoinResult {
  planId: PlanId;
  role: Role;
  /** True for viewers and reviewers: their document updates are dropped by the server. */
  readOnly: boolean;
}

/** Ack of `plan:sync`. */
export interface SyncAck {
  /**
   * Sequence numbers under which the message's updates were stored, in order; empty when the
   * message held no new write (step 1, awareness, an empty step 2).
   */
  stored: number[];
}

/** Events the client sends (imperative). */
export interface ClientToServerEvents {
  'plan:join': (planId: PlanId, ack: (res: Response<JoinResult>) => void) => void;
  'plan:leave': (planId: PlanId, ack: (res: Response<{ planId: PlanId }>) => void) => void;
  /** `payload` = base64 of `[MessageType, …]`, see `wire-codec.ts`. */
  'plan:sync': (planId: PlanId, payload: WireText, ack?: (res: Response<SyncAck>) => void) => void;
}

/** Events the server sends (past tense). */
export interface ServerToClientEvents {
  /** Sync or awareness message for a joined plan (base64 of `[MessageType, …]`). */
  'plan:synced': (planId: PlanId, payload: WireText) => void;
  /** The server finished answering the client's sync step 1: the client holds the stored plan. */
  'plan:loaded': (planId: PlanId) => void;
  /** A document update from a read-only socket was dropped. */
  'plan:update-denied': (planId: PlanId, error: SyncError) => void;
  /** A message was rejected (malformed, too large, not joined, rate limited…). */
  'plan:message-rejected': (planId: PlanId | null, error: SyncError) => void;
  /**
   * The user's access changed while connected: `role` is the new role, or null when revoked (the
   * socket has then left the room).
   */
  'plan:access-changed': (planId: PlanId, change: { role: Role | null; readOnly: boolean }) => void;
  /** The server is about to close the socket (session ended, signed out). */
  'plan:session-ended': (error: SyncError) => void;
}

/** Events between server processes (through the socket.io adapter). */
export interface InterServerEvents {
  /** An update stored by another process, to apply to this process's copy of the room. */
  'plan:relayed': (planId: PlanId, update: WireBytes, seq: number) => void;
  /** A presence update received by another process. */
  'plan:presence-relayed': (planId: PlanId, update: WireBytes) => void;
}

/** Per-socket data the server keeps. */
export interface PlanSocketData {
  userId: string;
  userName: string;
}
