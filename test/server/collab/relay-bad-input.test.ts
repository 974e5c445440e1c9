import * as encoding from 'lib0/encoding';
import { Awareness, encodeAwarenessUpdate } from 'y-protocols/awareness';
import * as Y from 'yjs';

import { MAX_MESSAGE_BYTES } from '@rampart/collab/sync/limits';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import { encodeAwarenessBytes, encodeUpdate, toWire } from '@rampart/collab/sync/wire-codec';

import { eventually } from '../../utils/collab-client';
import { createPlanRow } from '../../utils/collab-test-server';
import { useRelayRoom } from '../../utils/relay-room';
import { randomInt, seededRandom } from '../../utils/seeded-random';

const ATTACKER = '00000000-0000-4000-8000-0000000000a1';
const EDITOR = '00000000-0000-4000-8000-0000000000a2';

/** A valid update framed as a sync message, to truncate and corrupt. */
function validMessage(random: () => number): Uint8Array {
  const doc = new Y.Doc();
  doc
    .getMap('parts')
    .set(`C${randomInt(random, 100)}`, { farads: 1e-6 * random(), dielectric: 'X7R' });
  doc.getArray('signals').push(['EN_3V3', 'PG_5V']);
  const bytes = encodeUpdate(Y.encodeStateAsUpdate(doc));
  doc.destroy();
  return bytes;
}

function frame(type: number, step: number, body: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, type);
  encoding.writeVarUint(e, step);
  encoding.writeVarUint8Array(e, body);
  return encoding.toUint8Array(e);
}

describe('live plan relay: bad input', () => {
  // A generous rate limit here: this file tests decoding; the flood test sets its own.
  const relay = useRelayRoom(
    'motor-drive-fuzz',
    { [ATTACKER]: 'editor', [EDITOR]: 'editor' },
    { messagesPerSecond: 100_000, messageBurst: 100_000 },
  );
  const { client, clients } = relay;

  it('1 000 random and truncated messages → each rejected, server up, document unchanged', async () => {
    const editor = client(EDITOR);
    const attacker = client(ATTACKER);
    await Promise.all([editor.ready(), attacker.ready()]);
    editor.doc.getMap('parts').set('U1', { kind: 'buck', vout: 5 });
    await eventually(() => expect(editor.acknowledged).toHaveLength(1));
    const room = relay.server.relay.registry.get(relay.planId)!;
    const before = Y.encodeStateAsUpdate(room.doc);
    const random = seededRandom(20261201);
    const codes = new Map<string, number>();
    for (let i = 0; i < 1000; i++) {
      let payload: Uint8Array;
      const kind = i % 5;
      if (kind === 4) {
        // Text that is not always base64: printable ASCII of any length.
        const text = String.fromCharCode(
          ...Array.from({ length: 1 + randomInt(random, 80) }, () => 32 + randomInt(random, 95)),
        );
        const res = await attacker.sendPayload(text);
        const code = 'error' in res ? res.error.code : 'accepted';
        codes.set(code, (codes.get(code) ?? 0) + 1);
        continue;
      }
      if (kind === 0) {
        payload = new Uint8Array(1 + randomInt(random, 200)).map(() => randomInt(random, 256));
      } else if (kind === 1) {
        const valid = validMessage(random);
        payload = valid.slice(0, randomInt(random, valid.length - 1));
      } else if (kind === 2) {
        // Valid framing around a corrupted and shortened update body: reaches the Yjs decoder.
        const doc = new Y.Doc();
        doc.getMap('parts').set(`R${i}`, { ohms: 4700 });
        const body = Y.encodeStateAsUpdate(doc);
        doc.destroy();
        const cut = body.slice(0, 1 + randomInt(random, body.length - 1));
        for (let k = 0; k < 2; k++) cut[randomInt(random, cut.length)] = randomInt(random, 256);
        payload = frame(MessageType.Sync, SyncStep.Update, cut);
      } else {
        const body = new Uint8Array(randomInt(random, 64)).map(() => randomInt(random, 256));
        payload = frame(MessageType.Awareness, 0, body).slice(1);
      }
      const res = await attacker.sendRaw(payload);
      const code = 'error' in res ? res.error.code : 'accepted';
      codes.set(code, (codes.get(code) ?? 0) + 1);
    }
    // Random bytes may by chance decode as a harmless message (an empty update or a state
    // vector); nothing may change the document.
    expect((codes.get('malformed') ?? 0) + (codes.get('accepted') ?? 0)).toBe(1000);
    expect(codes.get('malformed')).toBeGreaterThan(900);
    expect(Y.encodeStateAsUpdate(room.doc)).toEqual(before);
    // The server still serves the other client.
    editor.doc.getMap('parts').set('U2', { kind: 'ldo', vout: 3.3 });
    await eventually(() => expect(editor.acknowledged).toHaveLength(2));
    await eventually(() =>
      expect(attacker.doc.getMap('parts').get('U2')).toEqual({ kind: 'ldo', vout: 3.3 }),
    );
  });

  it('message above the per-update limit → too_large, socket stays connected', async () => {
    const attacker = clients[1]!;
    const big = frame(MessageType.Sync, SyncStep.Update, new Uint8Array(MAX_MESSAGE_BYTES + 10));
    const res = await attacker.sendRaw(big);
    expect(res).toMatchObject({ error: { code: 'too_large' } });
    expect(attacker.socket.connected).toBe(true);
  });

  it('payload not base64 text, and message for a plan not joined → malformed / not_joined', async () => {
    const attacker = clients[1]!;
    const room = relay.server.relay.registry.get(relay.planId)!;
    const before = Y.encodeStateAsUpdate(room.doc);
    const valid = toWire(validMessage(seededRandom(2)));
    const bad: Array<[unknown, string]> = [
      ['hello', 'not valid base64'],
      [`${valid.slice(0, -2)}*=`, 'not valid base64'],
      [`=${valid}`, 'not valid base64'],
      [validMessage(seededRandom(3)), 'must be a base64 string'], // binary, the old wire form
      [12345, 'must be a base64 string'],
      [{ update: valid }, 'must be a base64 string'],
      [null, 'must be a base64 string'],
    ];
    for (const [payload, reason] of bad) {
      const res = await attacker.sendPayload(payload);
      expect(res).toMatchObject({
        error: { code: 'malformed', message: expect.stringContaining(reason) },
      });
    }
    expect(Y.encodeStateAsUpdate(room.doc)).toEqual(before);
    expect(attacker.socket.connected).toBe(true);
    const res1 = await attacker.sendPayload('hello');
    expect(res1).toMatchObject({ error: { code: 'malformed' } });
    const other = await createPlanRow(relay.server.dataSource, 'motor-drive-other');
    const res2 = await attacker.sendRaw(validMessage(seededRandom(1)), other);
    expect(res2).toMatchObject({ error: { code: 'not_joined' } });
  });

  it('presence for another user, or with bad fields → malformed naming the field', async () => {
    const attacker = clients[1]!;
    const doc = new Y.Doc();
    const aw = new Awareness(doc);
    aw.setLocalState({ user: { id: EDITOR, name: 'Not me', colour: '#000000' } });
    const res = await attacker.sendRaw(
      encodeAwarenessBytes(encodeAwarenessUpdate(aw, [doc.clientID])),
    );
    expect(res).toMatchObject({
      error: { code: 'malformed', message: expect.stringContaining('user.id') },
    });
    aw.setLocalState({ user: { id: ATTACKER, name: 'Me', colour: 'red' } });
    const res2 = await attacker.sendRaw(
      encodeAwarenessBytes(encodeAwarenessUpdate(aw, [doc.clientID])),
    );
    expect(res2).toMatchObject({
      error: { code: 'malformed', message: expect.stringContaining('user.colour') },
    });
    aw.destroy();
    doc.destroy();
  });
});

describe('live plan relay: flood from one socket', () => {
  const relay = useRelayRoom(
    'motor-drive-flood',
    { [ATTACKER]: 'editor', [EDITOR]: 'editor' },
    { messagesPerSecond: 50, messageBurst: 50 },
  );

  it('500 messages at once → the excess is rate_limited, other clients unaffected', async () => {
    const attacker = relay.client(ATTACKER);
    const editor = relay.client(EDITOR);
    await Promise.all([attacker.ready(), editor.ready()]);
    const step1 = frame(MessageType.Sync, SyncStep.Step1, Y.encodeStateVector(attacker.doc));
    const results = await Promise.all(Array.from({ length: 500 }, () => attacker.sendRaw(step1)));
    const limited = results.filter((r) => 'error' in r && r.error.code === 'rate_limited').length;
    expect(limited).toBeGreaterThan(400);
    expect(attacker.errors.filter((e) => e.code === 'rate_limited').length).toBeGreaterThanOrEqual(
      1,
    );
    editor.doc.getMap('parts').set('U4', { kind: 'core', vout: 1.2 });
    await eventually(() => expect(editor.acknowledged).toHaveLength(1));
  });
});
