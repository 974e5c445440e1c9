import {
  AWARENESS_PER_SECOND,
  MESSAGE_BURST,
  MESSAGES_PER_SECOND,
} from '@rampart/collab/sync/limits';

/** Tunables of the live-plan relay. Tests shorten the timers; production keeps the defaults. */
export interface CollabOptions {
  /** Compact a plan's log once this many updates wait in it. @default 500 */
  compactAfterUpdates: number;
  /** …or once the waiting updates hold this many bytes. @default 1_000_000 */
  compactAfterBytes: number;
  /** How often each process checks PostgreSQL for updates its rooms missed. @default 5_000 */
  antiEntropyMs: number;
  /** How often each socket's session is checked again. @default 30_000 */
  sessionRecheckMs: number;
  /** How long a room with no sockets stays open before it is stored and unloaded. @default 2_000 */
  roomCloseDelayMs: number;
  /** First retry delay of a failed write; doubles up to `writeRetryMaxMs`. @default 200 */
  writeRetryMs: number;
  /** @default 5_000 */
  writeRetryMaxMs: number;
  /** Most updates stored in one transaction. @default 200 */
  writeBatchMax: number;
  /** Per-socket message rate. @default MESSAGES_PER_SECOND */
  messagesPerSecond: number;
  /** @default MESSAGE_BURST */
  messageBurst: number;
  /** Presence updates forwarded per client per second. @default AWARENESS_PER_SECOND */
  awarenessPerSecond: number;
  /**
   * Relay an accepted update to the room's other sockets before its COMMIT (the sender's ack
   * still waits for the COMMIT). Off: others see an edit only once it is stored, at the cost
   * of one database round trip and fsync of latency. @default true
   */
  relayBeforeCommit: boolean;
  /**
   * Page origins allowed to open a socket. Empty: only the server's own origin (the `Host`
   * header with http or https). @default []
   */
  allowedOrigins: string[];
}

export const DEFAULT_COLLAB_OPTIONS: CollabOptions = {
  compactAfterUpdates: 500,
  compactAfterBytes: 1_000_000,
  antiEntropyMs: 5_000,
  sessionRecheckMs: 30_000,
  roomCloseDelayMs: 2_000,
  writeRetryMs: 200,
  writeRetryMaxMs: 5_000,
  writeBatchMax: 200,
  messagesPerSecond: MESSAGES_PER_SECOND,
  messageBurst: MESSAGE_BURST,
  awarenessPerSecond: AWARENESS_PER_SECOND,
  relayBeforeCommit: true,
  allowedOrigins: [],
};
