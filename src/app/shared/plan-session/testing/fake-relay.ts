import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import { readSyncMessage } from 'y-protocols/sync';
import * as Y from 'yjs';

import type { Role } from '@rampart/collab/api/accounts';
import { REMOTE_ORIGIN } from '@rampart/collab/doc/doc-origin';
import type { SyncError } from '@rampart/collab/sync/errors';
import type { JoinResult, Response, SyncAck } from '@rampart/collab/sync/events';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import {
  encodeSyncStep1,
  encodeStep2Update,
  fromWire,
  toWire,
} from '@rampart/collab/sync/wire-codec';

import type { PlanClientSocket } from '../plan-socket';

type Handler = (...args: unknown[]) => void;

/**
 * An in-memory stand-in for the relay behind one socket, for specs: it answers `plan:join`,
 * runs the server half of the sync protocol on its own Y.Doc, stores writes and acks them (at
 * once, or only when told to, to observe unsent edits), and drops writes from read-only roles.
 */
export class FakeRelay {
  readonly doc = new Y.Doc();
  role: Role = 'editor';
  /** When false, write acks wait in `heldAcks` until `releaseAcks()`. */
  ackAtOnce = true;
  readonly heldAcks: Array<() => void> = [];
  /** Every client→server event, in order. */
  readonly sent: Array<{ event: string; args: unknown[] }> = [];
  /** Presence bytes received from the client. */
  readonly awarenessReceived: Uint8Array[] = [];
  private readonly _handlers = new Map<string, Set<Handler>>();
  private _connected = false;
  private _seq = 0;

  /** The socket the session under test uses. */
  readonly socket = {
    on: (event: string, h: Handler) => this._on(event, h),
    off: (event: string, h: Handler) => this._handlers.get(event)?.delete(h),
    emit: (event: string, ...args: unknown[]) => this._receive(event, args),
    connect: () => this.connect(),
    disconnect: () => this.disconnect(),
    get connected() {
      return false;
    },
    // Like socket.io: a socket is active while it is connected or trying to connect.
    get active() {
      return true;
    },
  } as unknown as PlanClientSocket;

  constructor() {
    Object.defineProperty(this.socket, 'connected', { get: () => this._connected });
  }

  /** Simulates the transport coming up (first connect or a reconnect). */
  connect(): void {
    this._connected = true;
    this.toClient('connect');
  }

  /** Simulates the transport dropping. */
  disconnect(): void {
    if (!this._connected) return;
    this._connected = false;
    this.toClient('disconnect', 'transport close');
  }

  /** Emits a server→client event; byte arguments go out in wire form (base64), as the relay's. */
  toClient(event: string, ...args: unknown[]): void {
    const wire = args.map((a) => (a instanceof Uint8Array ? toWire(a) : a));
    for (const h of [...(this._handlers.get(event) ?? [])]) h(...wire);
  }

  releaseAcks(): void {
    this.heldAcks.splice(0).forEach((ack) => ack());
  }

  private _on(event: string, h: Handler): void {
    if (!this._handlers.has(event)) this._handlers.set(event, new Set());
    this._handlers.get(event)!.add(h);
  }

  private _receive(event: string, args: unknown[]): void {
    this.sent.push({ event, args });
    if (!this._connected) return;
    const ack = typeof args.at(-1) === 'function' ? (args.at(-1) as Handler) : () => undefined;
    const planId = args[0] as string;
    if (event === 'plan:join') {
      const readOnly = this.role === 'viewer' || this.role === 'reviewer';
      const res: Response<JoinResult> = { data: { planId, role: this.role, readOnly } };
      ack(res);
      this.toClient('plan:synced', planId, encodeSyncStep1(this.doc));
    } else if (event === 'plan:sync') {
      const wire = fromWire(args[1]);
      if (!wire.ok) throw new Error(`client sent a bad payload: ${wire.reason}`);
      this._sync(planId, wire.bytes, ack);
    }
  }

  private _sync(planId: string, bytes: Uint8Array, ack: Handler): void {
    const d = decoding.createDecoder(bytes);
    const type = decoding.readVarUint(d);
    if (type === MessageType.Awareness) {
      this.awarenessReceived.push(bytes);
      ack({ data: { stored: [] } } satisfies Response<SyncAck>);
      return;
    }
    const step = decoding.peekVarUint(d);
    if (step === SyncStep.Step1) {
      const e = encoding.createEncoder();
      readSyncMessage(d, e, this.doc, REMOTE_ORIGIN);
      const reply = decoding.createDecoder(encoding.toUint8Array(e));
      decoding.readVarUint(reply);
      this.toClient('plan:synced', planId, encodeStep2Update(decoding.readVarUint8Array(reply)));
      this.toClient('plan:loaded', planId);
      ack({ data: { stored: [] } });
      return;
    }
    if (this.role === 'viewer' || this.role === 'reviewer') {
      const error: SyncError = { code: 'read_only', message: 'read-only' };
      this.toClient('plan:update-denied', planId, error);
      ack({ error });
      return;
    }
    readSyncMessage(d, encoding.createEncoder(), this.doc, REMOTE_ORIGIN);
    const res: Response<SyncAck> = { data: { stored: [++this._seq] } };
    if (this.ackAtOnce) ack(res);
    else this.heldAcks.push(() => ack(res));
  }
}
