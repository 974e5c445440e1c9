import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import { applyAwarenessUpdate, removeAwarenessStates, type Awareness } from 'y-protocols/awareness';
import { readSyncMessage } from 'y-protocols/sync';
import type * as Y from 'yjs';

import { REMOTE_ORIGIN } from '@rampart/collab/doc/doc-origin';
import type { Role } from '@rampart/collab/api/accounts';
import type { SyncError } from '@rampart/collab/sync/errors';
import type { JoinResult, Response, SyncAck } from '@rampart/collab/sync/events';
import { MAX_MESSAGE_BYTES } from '@rampart/collab/sync/limits';
import { MessageType } from '@rampart/collab/sync/message-type';
import {
  encodeAwareness,
  encodeSyncStep1,
  encodeUpdate,
  fromWire,
  toWire,
} from '@rampart/collab/sync/wire-codec';

import type { PlanClientSocket } from './plan-socket';

/** What the link reports to its session. */
export interface LinkListener {
  /** Socket (re)connecting or joining; nothing synced yet on this connection. */
  connecting(): void;
  /** Joined with this role. */
  joined(result: JoinResult): void;
  /** The server has sent everything it stores: the local doc holds the stored plan. */
  loaded(): void;
  /** Connection lost (edits keep accumulating locally). */
  offline(): void;
  /** Whether some local change is not yet acknowledged as stored by the server. */
  unsent(hasUnsent: boolean): void;
  /** An error the user should see. */
  error(error: SyncError): void;
  /** Role changed while connected; null: access revoked. */
  accessChanged(role: Role | null, readOnly: boolean): void;
}

/** Delay before re-joining after a transient failure (unavailable, a refused update). */
const RETRY_MS = 2000;

/**
 * Runs the live-plan wire protocol for one plan over one socket: join, y-protocols sync in both
 * directions, awareness, acknowledged updates. After every (re)connect it joins again and re-runs
 * sync step 1, so edits made offline reach the server and missed remote edits arrive.
 *
 * Unsent edits are tracked by version: every local doc change bumps `_localVersion`; each sent
 * write carries the version it covers; a successful ack raises `_ackedVersion`.
 */
export class PlanSyncLink {
  private _joined = false;
  private _readOnly = false;
  private _generation = 0;
  private _localVersion = 0;
  private _ackedVersion = 0;
  private _retry: ReturnType<typeof setTimeout> | undefined;
  private _destroyed = false;
  private readonly _off: Array<() => void> = [];

  constructor(
    private readonly _socket: PlanClientSocket,
    private readonly _planId: string,
    private readonly _doc: Y.Doc,
    private readonly _awareness: Awareness,
    private readonly _listener: LinkListener,
  ) {}

  /** Starts listening; joins at once when the socket is already connected. */
  start(): void {
    const s = this._socket;
    const on = <E extends Parameters<PlanClientSocket['on']>[0]>(
      event: E,
      handler: Parameters<PlanClientSocket['on']>[1],
    ) => {
      s.on(event, handler as never);
      this._off.push(() => s.off(event, handler as never));
    };
    on('connect', () => this._join());
    on('disconnect', () => this._lost());
    on('connect_error', ((err: Error & { data?: SyncError }) => this._refused(err)) as never);
    on('plan:synced', ((planId: string, payload: unknown) => {
      if (planId === this._planId) this._receive(payload);
    }) as never);
    on('plan:loaded', ((planId: string) => {
      if (planId === this._planId) this._listener.loaded();
    }) as never);
    on('plan:update-denied', ((planId: string, error: SyncError) => {
      if (planId === this._planId) this._listener.error(error);
    }) as never);
    on('plan:message-rejected', ((planId: string | null, error: SyncError) => {
      if (planId !== null && planId !== this._planId) return;
      this._listener.error(error);
      if (error.code === 'not_joined' || error.code === 'unavailable') this._scheduleRejoin();
    }) as never);
    on('plan:access-changed', ((
      planId: string,
      change: { role: Role | null; readOnly: boolean },
    ) => {
      if (planId !== this._planId) return;
      this._readOnly = change.readOnly;
      if (change.role === null) this._joined = false;
      this._listener.accessChanged(change.role, change.readOnly);
    }) as never);
    on('plan:session-ended', ((error: SyncError) => this._listener.error(error)) as never);

    const onUpdate = (update: Uint8Array, origin: unknown) => this._localUpdate(update, origin);
    this._doc.on('update', onUpdate);
    this._off.push(() => this._doc.off('update', onUpdate));
    const onAwareness = (
      change: { added: number[]; updated: number[]; removed: number[] },
      origin: unknown,
    ) => {
      if (origin !== 'local') return;
      const mine = [...change.added, ...change.updated].includes(this._doc.clientID);
      if (mine) this._sendAwareness();
    };
    this._awareness.on('update', onAwareness);
    this._off.push(() => this._awareness.off('update', onAwareness));
    this._listener.connecting();
    if (s.connected) this._join();
    // A handshake refused before we listened left the socket inactive: try once more, now that
    // `connect_error` reaches us and can say why.
    else if (!s.active) s.connect();
  }

  /** Leaves the plan, stops listening and closes the socket. */
  destroy(): void {
    if (this._destroyed) return;
    this._destroyed = true;
    clearTimeout(this._retry);
    if (this._joined && this._socket.connected) {
      this._socket.emit('plan:leave', this._planId, () => undefined);
    }
    this._off.splice(0).forEach((off) => off());
    this._socket.disconnect();
  }

  private _join(): void {
    if (this._destroyed) return;
    const generation = ++this._generation;
    this._joined = false;
    this._listener.connecting();
    this._socket.emit('plan:join', this._planId, (res: Response<JoinResult>) => {
      if (generation !== this._generation || this._destroyed) return;
      if ('error' in res) {
        this._listener.error(res.error);
        if (res.error.code === 'unavailable') this._scheduleRejoin();
        return;
      }
      this._joined = true;
      this._readOnly = res.data.readOnly;
      this._listener.joined(res.data);
      // Our step 1: the server answers with what we lack, then `plan:loaded`.
      this._socket.emit(
        'plan:sync',
        this._planId,
        toWire(encodeSyncStep1(this._doc)),
        () => undefined,
      );
      if (this._awareness.getLocalState() !== null) this._sendAwareness();
    });
  }

  private _lost(): void {
    this._generation++;
    this._joined = false;
    // The server drops our presence on disconnect and will never tell us others left meanwhile.
    const others = [...this._awareness.getStates().keys()].filter(
      (id) => id !== this._doc.clientID,
    );
    removeAwarenessStates(this._awareness, others, 'remote');
    this._listener.offline();
  }

  private _refused(err: Error & { data?: SyncError }): void {
    const error: SyncError = err.data ?? {
      code: 'unavailable',
      message: 'The server cannot be reached.',
    };
    this._listener.error(error);
    this._listener.offline();
    // socket.io does not retry a handshake its middleware refused; retry only transient causes.
    if (err.data?.code === 'unavailable') {
      clearTimeout(this._retry);
      this._retry = setTimeout(() => this._socket.connect(), RETRY_MS);
    }
  }

  private _scheduleRejoin(): void {
    clearTimeout(this._retry);
    this._retry = setTimeout(() => {
      if (this._socket.connected) this._join();
    }, RETRY_MS);
  }

  private _receive(payload: unknown): void {
    const wire = fromWire(payload);
    if (!wire.ok) {
      console.warn('[plan-session] unreadable message from the relay:', wire.reason);
      return;
    }
    try {
      const decoder = decoding.createDecoder(wire.bytes);
      const type = decoding.readVarUint(decoder);
      if (type === MessageType.Awareness) {
        applyAwarenessUpdate(this._awareness, decoding.readVarUint8Array(decoder), 'remote');
        return;
      }
      if (type !== MessageType.Sync) return;
      const encoder = encoding.createEncoder();
      encoding.writeVarUint(encoder, MessageType.Sync);
      const covers = this._localVersion;
      readSyncMessage(decoder, encoder, this._doc, REMOTE_ORIGIN);
      // A server step 1 produced our step 2 in `encoder`: it carries every local change the
      // server lacks, offline edits included. Read-only sockets have nothing to contribute.
      if (encoding.length(encoder) > 1 && !this._readOnly) {
        this._sendWrite(encoding.toUint8Array(encoder), covers);
      }
    } catch (err) {
      // The server validates what it relays; a message we cannot read is a bug, not user input.
      console.warn('[plan-session] unreadable message from the relay', err);
    }
  }

  private _localUpdate(update: Uint8Array, origin: unknown): void {
    if (origin === REMOTE_ORIGIN) return;
    this._localVersion++;
    this._listener.unsent(true);
    if (this._joined && !this._readOnly && this._socket.connected) {
      this._sendWrite(encodeUpdate(update), this._localVersion);
    }
  }

  private _sendWrite(message: Uint8Array, covers: number): void {
    if (message.byteLength > MAX_MESSAGE_BYTES) {
      this._listener.error({
        code: 'too_large',
        message: `This change is too large to send (${message.byteLength} bytes).`,
      });
      return;
    }
    const generation = this._generation;
    this._socket.emit('plan:sync', this._planId, toWire(message), (res: Response<SyncAck>) => {
      if (generation !== this._generation) return;
      if ('error' in res) {
        // Not stored: the next join's step-2 exchange sends it again.
        if (res.error.code !== 'read_only') this._scheduleRejoin();
        return;
      }
      if (covers > this._ackedVersion) this._ackedVersion = covers;
      this._listener.unsent(this._localVersion > this._ackedVersion);
    });
  }

  private _sendAwareness(): void {
    if (!this._joined || !this._socket.connected) return;
    const message = encodeAwareness(this._awareness, [this._doc.clientID]);
    this._socket.emit('plan:sync', this._planId, toWire(message), () => undefined);
  }
}
