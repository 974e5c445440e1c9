import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import { io, type Socket } from 'socket.io-client';
import { Awareness, applyAwarenessUpdate, encodeAwarenessUpdate } from 'y-protocols/awareness';
import * as syncProtocol from 'y-protocols/sync';
import * as Y from 'yjs';

import type { SyncError } from '@rampart/collab/sync/errors';
import {
  PLAN_NAMESPACE,
  type ClientToServerEvents,
  type JoinResult,
  type Response,
  type ServerToClientEvents,
  type SyncAck,
  type WireText,
} from '@rampart/collab/sync/events';
import { MessageType } from '@rampart/collab/sync/message-type';
import type { Presence } from '@rampart/collab/sync/presence';
import {
  encodeAwarenessBytes,
  encodeSyncStep1,
  encodeUpdate,
  fromWire,
  toWire,
} from '@rampart/collab/sync/wire-codec';

export type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const REMOTE = { kind: 'remote' } as const;

/**
 * A typed Node client of the live-plan relay for tests and benchmarks: a Y.Doc and awareness
 * kept in sync over a real socket.io connection, re-joining and re-syncing after every
 * reconnect, counting acknowledged updates and collecting error events.
 */
export class TestPlanClient {
  readonly doc = new Y.Doc();
  readonly awareness = new Awareness(this.doc);
  readonly socket: ClientSocket;
  /** Error events received (`plan:message-rejected`, `plan:update-denied`). */
  readonly errors: SyncError[] = [];
  readonly accessChanges: Array<{ role: string | null; readOnly: boolean }> = [];
  /** Updates the server acknowledged as stored, with their seqs. */
  readonly acknowledged: Array<{ update: Uint8Array; seq: number }> = [];
  join: JoinResult | null = null;
  joinError: SyncError | null = null;
  /** Times `plan:loaded` arrived (once per (re)join). */
  loadedCount = 0;
  /** Updates sent on the current connection and not yet acknowledged. */
  unacked = 0;
  private generation = 0;
  /** Acks of updates that added nothing new to the server's copy (repeats). */
  emptyAcks = 0;
  /** Codes of updates the server refused. */
  readonly failedAcks: string[] = [];
  /** Called with the seqs of each acknowledged update (benchmarks time it). */
  onAcknowledged: ((seqs: number[]) => void) | null = null;
  /** Called with each remote update applied (benchmarks time it). */
  onRemoteUpdate: ((update: Uint8Array) => void) | null = null;

  constructor(
    url: string,
    readonly userId: string,
    readonly planId: string,
    opts: {
      /** Session cookie (the full application authenticates by it). */
      cookie?: string;
      autoConnect?: boolean;
      reconnectionDelay?: number;
      query?: Record<string, string>;
    } = {},
  ) {
    this.socket = io(`${url}${PLAN_NAMESPACE}`, {
      transports: ['websocket'],
      autoConnect: opts.autoConnect ?? true,
      reconnectionDelay: opts.reconnectionDelay ?? 100,
      reconnectionDelayMax: 500,
      query: { testUser: userId, ...opts.query },
      forceNew: true,
      ...(opts.cookie ? { extraHeaders: { cookie: opts.cookie } } : {}),
    });
    this.awareness.setLocalState(null);
    this.socket.on('connect', () => this.rejoin());
    // Acks of messages lost with the connection never come; step 2 on reconnect resends them.
    this.socket.on('disconnect', () => {
      this.generation++;
      this.unacked = 0;
    });
    this.socket.on('plan:synced', (planId, payload) => this.receive(planId, payload));
    this.socket.on('plan:loaded', (planId) => {
      if (planId === this.planId) this.loadedCount++;
    });
    this.socket.on('plan:message-rejected', (_p, error) => this.errors.push(error));
    this.socket.on('plan:update-denied', (_p, error) => this.errors.push(error));
    this.socket.on('plan:access-changed', (_p, change) => this.accessChanges.push(change));
    this.doc.on('update', (update: Uint8Array, origin: unknown) => {
      if (origin !== REMOTE && this.socket.connected && this.join) this.sendUpdate(update);
    });
    this.awareness.on(
      'update',
      (change: { added: number[]; updated: number[]; removed: number[] }, origin: unknown) => {
        if (origin === REMOTE || !this.socket.connected || !this.join) return;
        const ids = [...change.added, ...change.updated, ...change.removed];
        this.socket.emit(
          'plan:sync',
          this.planId,
          toWire(encodeAwarenessBytes(encodeAwarenessUpdate(this.awareness, ids))),
        );
      },
    );
  }

  /** Sets this client's presence (sent through the relay). */
  setPresence(presence: Presence): void {
    this.awareness.setLocalState(presence);
  }

  /** Sends raw bytes (in wire form) as a `plan:sync` payload and resolves with the ack. */
  sendRaw(payload: Uint8Array, planId = this.planId): Promise<Response<SyncAck>> {
    return this.sendPayload(toWire(payload), planId);
  }

  /** Sends anything as the `plan:sync` payload (bad input tests) and resolves with the ack. */
  sendPayload(payload: unknown, planId = this.planId): Promise<Response<SyncAck>> {
    return this.socket
      .timeout(5000)
      .emitWithAck('plan:sync', planId, payload as unknown as WireText);
  }

  /** Resolves when the socket is connected and joined (and synced once). */
  async ready(timeoutMs = 5000): Promise<void> {
    const start = Date.now();
    while (!(this.join && this.loadedCount > 0 && this.socket.connected)) {
      if (this.joinError) throw new Error(`join refused: ${this.joinError.code}`);
      if (Date.now() - start > timeoutMs) throw new Error(`client ${this.userId} not ready`);
      await new Promise((r) => setTimeout(r, 10));
    }
  }

  close(): void {
    this.socket.disconnect();
    this.doc.destroy();
  }

  private rejoin(): void {
    this.join = null;
    this.socket.emit('plan:join', this.planId, (res) => {
      if ('error' in res) {
        this.joinError = res.error;
        return;
      }
      this.join = res.data;
      this.joinError = null;
      // Re-run sync step 1 after every (re)connect: the server answers with what we lack.
      this.socket.emit('plan:sync', this.planId, toWire(encodeSyncStep1(this.doc)));
      if (this.awareness.getLocalState() !== null) {
        this.socket.emit(
          'plan:sync',
          this.planId,
          toWire(encodeAwarenessBytes(encodeAwarenessUpdate(this.awareness, [this.doc.clientID]))),
        );
      }
    });
  }

  private sendUpdate(update: Uint8Array, framed = encodeUpdate(update)): void {
    this.unacked++;
    const generation = this.generation;
    this.socket.emit('plan:sync', this.planId, toWire(framed), (res) => {
      if (generation === this.generation) this.unacked--;
      if ('data' in res) {
        for (const seq of res.data.stored) this.acknowledged.push({ update, seq });
        if (res.data.stored.length === 0) this.emptyAcks++;
        this.onAcknowledged?.(res.data.stored);
      } else {
        this.failedAcks.push(res.error.code);
      }
    });
  }

  private receive(planId: string, payload: unknown): void {
    const wire = fromWire(payload);
    if (planId !== this.planId) return;
    if (!wire.ok) throw new Error(`relay sent a bad payload: ${wire.reason}`);
    const bytes = wire.bytes;
    const d = decoding.createDecoder(bytes);
    const type = decoding.readVarUint(d);
    if (type === MessageType.Awareness) {
      applyAwarenessUpdate(this.awareness, decoding.readVarUint8Array(d), REMOTE);
      return;
    }
    const reply = encoding.createEncoder();
    encoding.writeVarUint(reply, MessageType.Sync);
    const before = bytes.length;
    syncProtocol.readSyncMessage(d, reply, this.doc, REMOTE);
    if (before > 0 && this.onRemoteUpdate) this.onRemoteUpdate(bytes);
    if (encoding.length(reply) > 1 && this.join) {
      // Our step 2: what the server lacks (offline edits, unacknowledged updates).
      const framed = encoding.toUint8Array(reply);
      const inner = decoding.createDecoder(framed);
      decoding.readVarUint(inner);
      decoding.readVarUint(inner);
      const update = decoding.readVarUint8Array(inner);
      if (this.join.readOnly) this.socket.emit('plan:sync', this.planId, toWire(framed));
      else this.sendUpdate(update, framed);
    }
  }
}

/** Retries `check` until it stops throwing, or throws its last error after `timeoutMs`. */
export async function eventually(
  check: () => void | Promise<void>,
  timeoutMs = 5000,
  stepMs = 20,
): Promise<void> {
  const start = Date.now();
  for (;;) {
    try {
      await check();
      return;
    } catch (err) {
      if (Date.now() - start > timeoutMs) throw err;
      await new Promise((r) => setTimeout(r, stepMs));
    }
  }
}

/** Whether every struct of `update` is within `doc`'s state vector (the update is present). */
export function isContained(doc: Y.Doc, update: Uint8Array): boolean {
  const sv = Y.decodeStateVector(Y.encodeStateVector(doc));
  return Y.decodeUpdate(update).structs.every(
    (s) => (sv.get(s.id.client) ?? 0) >= s.id.clock + s.length,
  );
}
