import { TestBed } from '@angular/core/testing';
import * as Y from 'yjs';
import { Awareness, encodeAwarenessUpdate } from 'y-protocols/awareness';

import { docToPlan, readEntry } from '@rampart/collab/doc/doc-to-plan';
import { localOrigin } from '@rampart/collab/doc/doc-origin';
import { setPartValue } from '@rampart/collab/doc/part-ops';
import { renamePlan } from '@rampart/collab/doc/plan-ops';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { encodeAwarenessBytes } from '@rampart/collab/sync/wire-codec';

import { OfflineCopies } from './offline-copy';
import { PlanSession } from './plan-session';
import { PlanSessions } from './plan-sessions';
import { PlanSocketFactory } from './plan-socket';
import { FakeRelay } from './testing/fake-relay';

const PLAN_ID = '11111111-2222-4333-8444-555555555555';
const ANA = { id: 'u-ana', name: 'Ana Rocha' };

/** A stored plan with one resistor, as the relay would hold it. */
function seedRelay(relay: FakeRelay): void {
  const plan = {
    schemaVersion: 1 as const,
    name: 'Motor-drive slice',
    nets: [{ id: 'v5' }],
    parts: [{ id: 'R4', kind: 'resistor' as const, a: 'v5', b: '0', value: 100_000 }],
    signals: [],
    requirements: [],
  };
  Y.applyUpdate(relay.doc, Y.encodeStateAsUpdate(planToDoc(plan)));
}

const r4 = (doc: Y.Doc) => (readEntry(doc, 'parts', 'R4') as { value: number }).value;

describe('PlanSessions', () => {
  let relay: FakeRelay;
  let session: PlanSession;

  function open(): PlanSession {
    TestBed.configureTestingModule({
      providers: [
        { provide: PlanSocketFactory, useValue: { open: () => relay.socket } },
        {
          provide: OfflineCopies,
          useValue: {
            attach: () => ({
              loaded: Promise.resolve({ hasPlan: false, unsentEdits: 0 }),
              setUnsentEdits: () => undefined,
              destroy: () => undefined,
            }),
          },
        },
      ],
    });
    session = TestBed.inject(PlanSessions).open(PLAN_ID, ANA);
    return session;
  }

  beforeEach(() => {
    relay = new FakeRelay();
    seedRelay(relay);
  });
  afterEach(() => session?.close());

  it('open then connect → connecting, then synced with the stored plan in the doc', async () => {
    open();
    await Promise.resolve();
    expect(session.state()).toBe('connecting');
    relay.connect();
    expect(session.state()).toBe('synced');
    expect(session.loaded()).toBe(true);
    expect(session.role()).toBe('editor');
    expect(docToPlan(session.doc).name).toBe('Motor-drive slice');
    expect(relay.sent.map((s) => s.event).slice(0, 2)).toEqual(['plan:join', 'plan:sync']);
  });

  it('edit while acks are held → unsent edits until the relay acknowledges', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    relay.ackAtOnce = false;
    session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 120_000));
    expect(session.hasUnsentEdits()).toBe(true);
    expect(r4(relay.doc)).toBe(120_000);
    relay.releaseAcks();
    expect(session.hasUnsentEdits()).toBe(false);
  });

  it('edit while offline → kept, sent on reconnect through the step-2 exchange', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    relay.disconnect();
    expect(session.state()).toBe('offline');
    session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 47_000));
    expect(session.hasUnsentEdits()).toBe(true);
    expect(r4(relay.doc)).toBe(100_000);
    // Meanwhile a collaborator renamed the plan on the server.
    renamePlan(relay.doc, localOrigin('u-ben'), 'Renamed by Ben');
    relay.connect();
    expect(r4(relay.doc)).toBe(47_000);
    expect(docToPlan(session.doc).name).toBe('Renamed by Ben');
    expect(session.state()).toBe('synced');
    expect(session.hasUnsentEdits()).toBe(false);
    const joins = relay.sent.filter((s) => s.event === 'plan:join');
    expect(joins).toHaveLength(2);
  });

  it('remote edit → applied to the doc and not on the local undo stack', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    const before = Y.encodeStateVector(relay.doc);
    setPartValue(relay.doc, localOrigin('u-ben'), 'R4', 82_000);
    const update = Y.encodeStateAsUpdate(relay.doc, before);
    const e = new Uint8Array([0, 2, ...encodeLength(update.length), ...update]);
    relay.toClient('plan:synced', PLAN_ID, e);
    expect(r4(session.doc)).toBe(82_000);
    expect(session.canUndo()).toBe(false);
  });

  it('undo → reverts own edit and sends the revert', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 150_000));
    expect(session.canUndo()).toBe(true);
    expect(session.undo()).toMatchObject({ op: 'setPartValue', after: 150_000 });
    expect(r4(relay.doc)).toBe(100_000);
    expect(session.canRedo()).toBe(true);
  });

  it('viewer → read-only state, edit refused locally with an error, nothing written', async () => {
    relay.role = 'viewer';
    open();
    await Promise.resolve();
    relay.connect();
    expect(session.state()).toBe('read-only');
    expect(session.readOnly()).toBe(true);
    const writes = relay.sent.length;
    expect(session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 1))).toBeNull();
    expect(session.error()?.code).toBe('read_only');
    expect(r4(session.doc)).toBe(100_000);
    expect(relay.sent.length).toBe(writes);
  });

  it('update denied by the relay → error signal carries the message', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    relay.toClient('plan:update-denied', PLAN_ID, {
      code: 'read_only',
      message: 'Your role is read-only.',
    });
    expect(session.error()).toEqual({ code: 'read_only', message: 'Your role is read-only.' });
  });

  it('handshake refused (signed out) → offline with the unauthenticated message', async () => {
    open();
    await Promise.resolve();
    const refusal = Object.assign(new Error('refused'), {
      data: { code: 'unauthenticated', message: 'Sign in to open live plans.' },
    });
    relay.toClient('connect_error', refusal);
    expect(session.state()).toBe('offline');
    expect(session.error()).toEqual({
      code: 'unauthenticated',
      message: 'Sign in to open live plans.',
    });
  });

  it('access revoked while open → offline with a forbidden error', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    relay.toClient('plan:access-changed', PLAN_ID, { role: null, readOnly: true });
    expect(session.state()).toBe('offline');
    expect(session.error()?.code).toBe('forbidden');
  });

  it("another user's presence → listed after self with initials and cursor time", async () => {
    open();
    await Promise.resolve();
    relay.connect();
    const benDoc = new Y.Doc();
    const ben = new Awareness(benDoc);
    ben.setLocalState({ user: { id: 'u-ben', name: 'Ben', colour: '#0072b2' }, cursorTime: 0.004 });
    relay.toClient(
      'plan:synced',
      PLAN_ID,
      encodeAwarenessBytes(encodeAwarenessUpdate(ben, [benDoc.clientID])),
    );
    const peers = session.presence();
    expect(peers.map((p) => [p.initials, p.isSelf, p.cursorTime])).toEqual([
      ['AR', true, null],
      ['BE', false, 0.004],
    ]);
    relay.disconnect();
    expect(session.presence().map((p) => p.userId)).toEqual(['u-ana']);
    benDoc.destroy();
  });

  it('setCursorTime 20 times in a burst → at most one presence message per 100 ms', async () => {
    jest.useFakeTimers();
    try {
      open();
      await Promise.resolve();
      relay.connect();
      const start = relay.awarenessReceived.length;
      for (let i = 0; i < 20; i++) session.setCursorTime(i * 1e-4);
      expect(relay.awarenessReceived.length - start).toBe(1);
      jest.advanceTimersByTime(100);
      expect(relay.awarenessReceived.length - start).toBe(2);
      const own = session.presence().find((p) => p.isSelf);
      expect(own?.cursorTime).toBeCloseTo(19e-4, 10);
    } finally {
      jest.useRealTimers();
    }
  });

  it('close → leaves the plan and disconnects the socket', async () => {
    open();
    await Promise.resolve();
    relay.connect();
    session.close();
    expect(relay.sent.at(-1)?.event).toBe('plan:leave');
    expect(relay.socket.connected).toBe(false);
  });
});

/** lib0 varuint of a length (for hand-built sync messages). */
function encodeLength(n: number): number[] {
  const out: number[] = [];
  while (n > 0x7f) {
    out.push(0x80 | (n & 0x7f));
    n >>>= 7;
  }
  out.push(n);
  return out;
}

describe('PlanSession presence fields', () => {
  it('setSelection then setViewport within 100 ms → one merged presence state with both', () => {
    jest.useFakeTimers();
    const relay = new FakeRelay();
    const session = new PlanSession(PLAN_ID, ANA, relay.socket, () => null);
    try {
      session.setCursorTime(0.001);
      session.setSelection([{ kind: 'part', id: 'R4' }]);
      session.setViewport({ t0: 0, t1: 0.02 });
      jest.advanceTimersByTime(100);
      expect(session.awareness.getLocalState()).toEqual({
        user: { id: 'u-ana', name: 'Ana Rocha', colour: expect.stringMatching(/^#/) },
        cursorTime: 0.001,
        selection: [{ kind: 'part', id: 'R4' }],
        viewport: { t0: 0, t1: 0.02 },
      });
      session.setCursorTime(null);
      jest.advanceTimersByTime(100);
      expect(session.awareness.getLocalState()).not.toHaveProperty('cursorTime');
    } finally {
      session.close();
      jest.useRealTimers();
    }
  });
});
