/**
 * Encoding and strict decoding of `plan:sync` payloads over y-protocols framing and lib0.
 * Decoding never throws: it returns a result naming what was wrong, so the relay can answer a
 * bad message with an error event instead of crashing or half-applying it.
 *
 * On the wire a message is its y-protocols bytes in base64 (`toWire`/`fromWire`). socket.io sends
 * a binary argument as a second websocket frame and encodes that frame once per recipient; a
 * text-only packet is one frame, and a broadcast encodes it once for every recipient in the room
 * (`wsPreEncodedFrame` in socket.io-adapter). Measured in `npm run bench:collab`: see
 * `server/collab/README.md`.
 */
import * as buffer from 'lib0/buffer';
import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import * as awarenessProtocol from 'y-protocols/awareness';
import * as syncProtocol from 'y-protocols/sync';
import * as Y from 'yjs';

import { MAX_AWARENESS_BYTES, MAX_MESSAGE_BYTES } from './limits';
import { MessageType, SyncStep } from './message-type';
import { validatePresence } from './presence';

/** A decoded, validated `plan:sync` payload. */
export type PlanMessage =
  | { type: MessageType.Sync; step: SyncStep.Step1; stateVector: Uint8Array }
  | { type: MessageType.Sync; step: SyncStep.Step2 | SyncStep.Update; update: Uint8Array }
  | { type: MessageType.Awareness; update: Uint8Array; entries: AwarenessEntry[] };

/** One client's entry in an awareness update; `state` null means "this client left". */
export interface AwarenessEntry {
  clientId: number;
  clock: number;
  state: unknown;
}

export type DecodeResult =
  | { ok: true; message: PlanMessage }
  | { ok: false; code: 'malformed' | 'too_large'; reason: string };

/** A message as sent over socket.io: its y-protocols bytes in base64 (RFC 4648, padded). */
export type WirePayload = string;

/** Longest base64 text of a message of MAX_MESSAGE_BYTES bytes. */
const MAX_WIRE_CHARS = Math.ceil(MAX_MESSAGE_BYTES / 3) * 4;

/** Char codes of the RFC 4648 base64 alphabet (A–Z a–z 0–9 + /). */
const ALPHABET = new Uint8Array(128);
for (const c of 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/')
  ALPHABET[c.charCodeAt(0)] = 1;

/**
 * Strict RFC 4648 base64: whole quanta of 4, the alphabet only, `=` padding (one or two) only at
 * the end. A loop over char codes: on a 1 MB message it takes about a sixth of a regular
 * expression's time (measured, Node 20).
 */
function isStrictBase64(s: string): boolean {
  const n = s.length;
  if (n % 4 !== 0) return false;
  let end = n;
  if (n > 0 && s.charCodeAt(n - 1) === 61) end = s.charCodeAt(n - 2) === 61 ? n - 2 : n - 1;
  for (let i = 0; i < end; i++) {
    const c = s.charCodeAt(i);
    if (c > 127 || ALPHABET[c] === 0) return false;
  }
  return true;
}

/** The wire form of a message. */
export function toWire(bytes: Uint8Array): WirePayload {
  return buffer.toBase64(bytes);
}

export type FromWireResult =
  { ok: true; bytes: Uint8Array } | { ok: false; code: 'malformed' | 'too_large'; reason: string };

/** The bytes of a wire payload, or why it is not one. Never throws. */
export function fromWire(payload: unknown): FromWireResult {
  if (typeof payload !== 'string') {
    return { ok: false, code: 'malformed', reason: 'payload must be a base64 string' };
  }
  if (payload.length > MAX_WIRE_CHARS) {
    return { ok: false, code: 'too_large', reason: `message over ${MAX_MESSAGE_BYTES} bytes` };
  }
  if (!isStrictBase64(payload)) {
    return { ok: false, code: 'malformed', reason: 'payload is not valid base64' };
  }
  return { ok: true, bytes: buffer.fromBase64(payload) };
}

/** Normalises binary that socket.io delivers (Buffer, Uint8Array, ArrayBuffer) to a Uint8Array. */
export function toBytes(payload: unknown): Uint8Array | null {
  if (payload instanceof Uint8Array) return payload;
  if (payload instanceof ArrayBuffer) return new Uint8Array(payload);
  return null;
}

/** `[Sync, Step1, stateVector(doc)]`. */
export function encodeSyncStep1(doc: Y.Doc): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MessageType.Sync);
  syncProtocol.writeSyncStep1(e, doc);
  return encoding.toUint8Array(e);
}

/** `[Sync, Step2, update]` where `update` is what a peer with `stateVector` lacks. */
export function encodeSyncStep2(doc: Y.Doc, stateVector?: Uint8Array): Uint8Array {
  return encodeStep2Update(Y.encodeStateAsUpdate(doc, stateVector));
}

/** `[Sync, Step2, update]` for an already computed update (used to send a state in chunks). */
export function encodeStep2Update(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MessageType.Sync);
  encoding.writeVarUint(e, SyncStep.Step2);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}

/** `[Sync, Update, update]`. */
export function encodeUpdate(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MessageType.Sync);
  syncProtocol.writeUpdate(e, update);
  return encoding.toUint8Array(e);
}

/** `[Awareness, awarenessUpdate]` for the given clients of `awareness`. */
export function encodeAwareness(
  awareness: awarenessProtocol.Awareness,
  clients: number[],
): Uint8Array {
  return encodeAwarenessBytes(awarenessProtocol.encodeAwarenessUpdate(awareness, clients));
}

/** `[Awareness, awarenessUpdate]` for an already encoded awareness update. */
export function encodeAwarenessBytes(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MessageType.Awareness);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}

/**
 * Decodes and validates a `plan:sync` wire payload: base64 text, framing fully consumed, updates
 * parseable by Yjs, awareness states valid presence. Never throws.
 */
export function decodePlanMessage(payload: unknown): DecodeResult {
  const wire = fromWire(payload);
  return wire.ok ? decodePlanBytes(wire.bytes) : wire;
}

/** `decodePlanMessage` for bytes already taken off the wire. Never throws. */
export function decodePlanBytes(bytes: Uint8Array): DecodeResult {
  if (bytes.byteLength > MAX_MESSAGE_BYTES) {
    return { ok: false, code: 'too_large', reason: `message over ${MAX_MESSAGE_BYTES} bytes` };
  }
  try {
    const d = decoding.createDecoder(bytes);
    const type = decoding.readVarUint(d);
    if (type === MessageType.Sync) return decodeSync(d);
    if (type === MessageType.Awareness) return decodeAwareness(d);
    return { ok: false, code: 'malformed', reason: `unknown message type ${type}` };
  } catch {
    // lib0 throws on reads past the end: that is a truncated message, not a server fault.
    return { ok: false, code: 'malformed', reason: 'truncated message' };
  }
}

function decodeSync(d: decoding.Decoder): DecodeResult {
  const step = decoding.readVarUint(d);
  const body = decoding.readVarUint8Array(d);
  if (decoding.hasContent(d)) return { ok: false, code: 'malformed', reason: 'trailing bytes' };
  if (step === SyncStep.Step1) {
    // A state vector is a list of (client, clock) pairs; decoding checks its framing.
    Y.decodeStateVector(body);
    return { ok: true, message: { type: MessageType.Sync, step, stateVector: body } };
  }
  if (step === SyncStep.Step2 || step === SyncStep.Update) {
    if (!isParseableUpdate(body)) {
      return { ok: false, code: 'malformed', reason: 'not a valid document update' };
    }
    return { ok: true, message: { type: MessageType.Sync, step, update: body } };
  }
  return { ok: false, code: 'malformed', reason: `unknown sync step ${step}` };
}

/** Whether Yjs can parse `update` completely (structs and delete set) without applying it. */
export function isParseableUpdate(update: Uint8Array): boolean {
  try {
    const decoded = Y.decodeUpdate(update);
    return decoded.structs.every((s) => s.length > 0 && Number.isFinite(s.id.clock));
  } catch {
    return false;
  }
}

function decodeAwareness(d: decoding.Decoder): DecodeResult {
  const update = decoding.readVarUint8Array(d);
  if (decoding.hasContent(d)) return { ok: false, code: 'malformed', reason: 'trailing bytes' };
  if (update.byteLength > MAX_AWARENESS_BYTES) {
    return { ok: false, code: 'too_large', reason: `presence over ${MAX_AWARENESS_BYTES} bytes` };
  }
  const inner = decoding.createDecoder(update);
  const count = decoding.readVarUint(inner);
  const entries: AwarenessEntry[] = [];
  for (let i = 0; i < count; i++) {
    const clientId = decoding.readVarUint(inner);
    const clock = decoding.readVarUint(inner);
    const state: unknown = JSON.parse(decoding.readVarString(inner));
    if (state !== null) {
      const check = validatePresence(state);
      if (!check.ok) {
        return { ok: false, code: 'malformed', reason: `presence ${check.field} ${check.reason}` };
      }
    }
    entries.push({ clientId, clock, state });
  }
  if (decoding.hasContent(inner)) {
    return { ok: false, code: 'malformed', reason: 'trailing bytes in presence' };
  }
  return { ok: true, message: { type: MessageType.Awareness, update, entries } };
}
