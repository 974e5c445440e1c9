import * as encoding from 'lib0/encoding';
import { Awareness, encodeAwarenessUpdate } from 'y-protocols/awareness';
import * as syncProtocol from 'y-protocols/sync';
import * as Y from 'yjs';

import { encodeStateInChunks } from '@rampart/collab/sync/chunk-state';
import { MAX_MESSAGE_BYTES } from '@rampart/collab/sync/limits';
import { MessageType, SyncStep, isWriteStep } from '@rampart/collab/sync/message-type';
import { addsNothing } from '@rampart/collab/sync/update-news';
import {
  decodePlanBytes,
  decodePlanMessage,
  encodeAwarenessBytes,
  encodeSyncStep1,
  encodeSyncStep2,
  encodeUpdate,
  fromWire,
  toWire,
} from '@rampart/collab/sync/wire-codec';

function docWithPart(id: string, value: number): Y.Doc {
  const doc = new Y.Doc();
  doc.getMap('parts').set(id, { value });
  return doc;
}

describe('wire codec', () => {
  it('MessageType and SyncStep numbers → match y-protocols (sync 0 / awareness 1; steps 0,1,2)', () => {
    // y-protocols/sync.js exports the step numbers; y-websocket uses 0 = sync, 1 = awareness.
    expect(SyncStep.Step1).toBe(syncProtocol.messageYjsSyncStep1);
    expect(SyncStep.Step2).toBe(syncProtocol.messageYjsSyncStep2);
    expect(SyncStep.Update).toBe(syncProtocol.messageYjsUpdate);
    expect([MessageType.Sync, MessageType.Awareness]).toEqual([0, 1]);
    expect([SyncStep.Step1, SyncStep.Step2, SyncStep.Update].map(isWriteStep)).toEqual([
      false,
      true,
      true,
    ]);
  });

  it('encodeSyncStep1 / encodeSyncStep2 / encodeUpdate → decode back to the same step and bytes', () => {
    const doc = docWithPart('R1', 100_000);
    const step1 = decodePlanBytes(encodeSyncStep1(doc));
    expect(step1).toMatchObject({
      ok: true,
      message: { type: MessageType.Sync, step: SyncStep.Step1 },
    });
    const step2 = decodePlanBytes(encodeSyncStep2(doc));
    expect(step2).toMatchObject({ ok: true, message: { step: SyncStep.Step2 } });
    const update = Y.encodeStateAsUpdate(doc);
    const decoded = decodePlanBytes(encodeUpdate(update));
    expect(
      decoded.ok &&
        decoded.message.type === MessageType.Sync &&
        'update' in decoded.message &&
        decoded.message.update,
    ).toEqual(update);
  });

  it('decodePlanBytes(truncated, trailing, unknown type, non-binary) → malformed with a reason', () => {
    const good = encodeUpdate(Y.encodeStateAsUpdate(docWithPart('C1', 1e-6)));
    expect(decodePlanBytes(good.slice(0, good.length - 2))).toMatchObject({
      ok: false,
      code: 'malformed',
    });
    expect(decodePlanBytes(new Uint8Array([...good, 7]))).toMatchObject({
      ok: false,
      reason: 'trailing bytes',
    });
    expect(decodePlanBytes(new Uint8Array([9, 0]))).toMatchObject({
      ok: false,
      reason: 'unknown message type 9',
    });
    expect(decodePlanBytes(new Uint8Array(MAX_MESSAGE_BYTES + 1))).toMatchObject({
      ok: false,
      code: 'too_large',
    });
  });

  it('toWire → the RFC 4648 §10 base64 test vectors; fromWire inverts them', () => {
    // RFC 4648, "The Base16, Base32, and Base64 Data Encodings", section 10 (test vectors).
    const vectors: Array<[string, string]> = [
      ['', ''],
      ['f', 'Zg=='],
      ['fo', 'Zm8='],
      ['foo', 'Zm9v'],
      ['foob', 'Zm9vYg=='],
      ['fooba', 'Zm9vYmE='],
      ['foobar', 'Zm9vYmFy'],
    ];
    for (const [text, base64] of vectors) {
      const bytes = new TextEncoder().encode(text);
      expect(toWire(bytes)).toBe(base64);
      expect(fromWire(base64)).toEqual({ ok: true, bytes });
    }
  });

  it('decodePlanMessage(wire text) → decoded; binary, bad base64, oversized text → rejected', () => {
    const doc = docWithPart('R2', 4700);
    const update = Y.encodeStateAsUpdate(doc);
    const decoded = decodePlanMessage(toWire(encodeUpdate(update)));
    expect(decoded.ok && 'update' in decoded.message && decoded.message.update).toEqual(update);
    expect(decodePlanMessage(encodeUpdate(update))).toMatchObject({
      ok: false,
      reason: 'payload must be a base64 string',
    });
    const wire = toWire(encodeUpdate(update));
    for (const bad of [
      'hello',
      `${wire}=`,
      `${wire.slice(1)}`,
      wire.replace(/.$/, '-'),
      ' AAA',
      'A===',
      '====',
      'AB=C',
      'AAAé',
    ]) {
      expect(decodePlanMessage(bad)).toMatchObject({
        ok: false,
        code: 'malformed',
        reason: 'payload is not valid base64',
      });
    }
    expect(decodePlanMessage('A'.repeat(Math.ceil(MAX_MESSAGE_BYTES / 3) * 4 + 4))).toMatchObject({
      ok: false,
      code: 'too_large',
    });
  });

  it('awareness with a valid presence → entries; with a bad cursorTime → malformed naming the field', () => {
    const doc = new Y.Doc();
    const aw = new Awareness(doc);
    aw.setLocalState({
      user: { id: 'u1', name: 'Ada', colour: '#14507a' },
      viewport: { t0: 0, t1: 0.02 },
    });
    const ok = decodePlanBytes(encodeAwarenessBytes(encodeAwarenessUpdate(aw, [doc.clientID])));
    expect(ok).toMatchObject({
      ok: true,
      message: { type: MessageType.Awareness, entries: [{ clientId: doc.clientID }] },
    });
    aw.setLocalState({ user: { id: 'u1', name: 'Ada', colour: '#14507a' }, cursorTime: 'soon' });
    const bad = decodePlanBytes(encodeAwarenessBytes(encodeAwarenessUpdate(aw, [doc.clientID])));
    expect(bad).toMatchObject({
      ok: false,
      code: 'malformed',
      reason: 'presence cursorTime must be a finite number',
    });
    aw.destroy();
  });

  it('sync message with an unknown step → malformed', () => {
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, MessageType.Sync);
    encoding.writeVarUint(e, 5);
    encoding.writeVarUint8Array(e, new Uint8Array([0, 0]));
    expect(decodePlanBytes(encoding.toUint8Array(e))).toMatchObject({
      ok: false,
      reason: 'unknown sync step 5',
    });
  });
});

describe('addsNothing', () => {
  it('own state again → true; a new edit → false; a repeated deletion → true; a new deletion → false', () => {
    const doc = docWithPart('R1', 1);
    doc.getMap('parts').set('R2', { value: 2 });
    expect(addsNothing(doc, Y.encodeStateAsUpdate(doc))).toBe(true);
    const other = new Y.Doc();
    Y.applyUpdate(other, Y.encodeStateAsUpdate(doc));
    other.getMap('parts').set('R3', { value: 3 });
    expect(addsNothing(doc, Y.encodeStateAsUpdate(other))).toBe(false);
    Y.applyUpdate(doc, Y.encodeStateAsUpdate(other));
    const before = Y.encodeStateVector(other);
    other.getMap('parts').delete('R1');
    const deletion = Y.encodeStateAsUpdate(other, before);
    expect(addsNothing(doc, deletion)).toBe(false);
    Y.applyUpdate(doc, deletion);
    expect(addsNothing(doc, deletion)).toBe(true);
  });
});

describe('encodeStateInChunks', () => {
  it('state above the chunk size from 20 writers → several chunks, each ≤ size, together the same doc', () => {
    const source = new Y.Doc();
    for (let w = 0; w < 20; w++) {
      const writer = new Y.Doc();
      writer.getText('notes').insert(0, `writer ${w} `.repeat(200));
      Y.applyUpdate(source, Y.encodeStateAsUpdate(writer));
    }
    const full = Y.encodeStateAsUpdate(source).byteLength;
    const chunks = encodeStateInChunks(source, undefined, Math.ceil(full / 5));
    expect(chunks.length).toBeGreaterThanOrEqual(5);
    for (const c of chunks) expect(c.byteLength).toBeLessThanOrEqual(Math.ceil(full / 5) + 64);
    const target = new Y.Doc();
    for (const c of chunks) Y.applyUpdate(target, c);
    expect(target.getText('notes').toString()).toBe(source.getText('notes').toString());
  });

  it('small state → one chunk equal to the full update', () => {
    const doc = docWithPart('U1', 5);
    expect(encodeStateInChunks(doc, undefined, 10_000)).toEqual([Y.encodeStateAsUpdate(doc)]);
  });
});
