import * as Y from 'yjs';

import { localOrigin } from '@rampart/collab/doc/doc-origin';
import { readEntry } from '@rampart/collab/doc/doc-to-plan';
import { setPartValue } from '@rampart/collab/doc/part-ops';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { encodeUpdate } from '@rampart/collab/sync/wire-codec';

import type { OfflineCopy, StoredCopy } from './offline-copy';
import { PlanSession } from './plan-session';
import { FakeRelay } from './testing/fake-relay';

const PLAN_ID = '11111111-2222-4333-8444-555555555555';
const ANA = { id: 'u-ana', name: 'Ana Rocha' };

const plan = {
  schemaVersion: 1 as const,
  name: 'Motor-drive slice',
  nets: [{ id: 'v5' }],
  parts: [{ id: 'R4', kind: 'resistor' as const, a: 'v5', b: '0', value: 100_000 }],
  signals: [],
  requirements: [],
};

const r4 = (doc: Y.Doc) => (readEntry(doc, 'parts', 'R4') as { value: number }).value;

/** An offline copy in memory: it merges `stored` into the doc and records the counts it gets. */
function memoryCopy(stored: Y.Doc | null, unsentEdits: number) {
  const counts: number[] = [];
  const attach = (doc: Y.Doc): OfflineCopy => {
    if (stored) Y.applyUpdate(doc, Y.encodeStateAsUpdate(stored), 'offline-copy');
    const loaded: Promise<StoredCopy> = Promise.resolve({ hasPlan: stored !== null, unsentEdits });
    return { loaded, setUnsentEdits: (n) => counts.push(n), destroy: () => undefined };
  };
  return { attach, counts };
}

const flush = () => new Promise((resolve) => setTimeout(resolve));

describe('PlanSession with an offline copy', () => {
  let relay: FakeRelay;
  let session: PlanSession | undefined;

  beforeEach(() => {
    relay = new FakeRelay();
    Y.applyUpdate(relay.doc, Y.encodeStateAsUpdate(planToDoc(plan)));
  });
  afterEach(() => session?.close());

  it('copy with a plan and 2 unsent edits, relay unreachable → loaded from it, 2 unsent', async () => {
    // The copy: the stored plan plus an edit made offline before the reload.
    const copy = new Y.Doc();
    Y.applyUpdate(copy, Y.encodeStateAsUpdate(relay.doc));
    setPartValue(copy, localOrigin(ANA.id, ANA.name), 'R4', 150_000);
    const offline = memoryCopy(copy, 2);
    session = new PlanSession(PLAN_ID, ANA, relay.socket, offline.attach);
    expect(session.loaded()).toBe(false);
    await session.start();

    expect(session.loaded()).toBe(true);
    expect(session.state()).toBe('connecting');
    expect(r4(session.doc)).toBe(150_000);
    expect(session.hasUnsentEdits()).toBe(true);
    expect(session.unsentEdits()).toBe(2);

    // Back online: the step-2 exchange carries the offline edit; its ack clears the count.
    relay.connect();
    expect(r4(relay.doc)).toBe(150_000);
    expect(session.state()).toBe('synced');
    expect(session.hasUnsentEdits()).toBe(false);
    expect(session.unsentEdits()).toBe(0);
    expect(offline.counts).toEqual([0]);
  });

  it('empty copy → not loaded until the relay has sent the stored plan', async () => {
    session = new PlanSession(PLAN_ID, ANA, relay.socket, memoryCopy(null, 0).attach);
    await session.start();
    expect(session.loaded()).toBe(false);
    expect(session.unsentEdits()).toBe(0);
    relay.connect();
    expect(session.loaded()).toBe(true);
    expect(r4(session.doc)).toBe(100_000);
  });

  it('2 edits offline, 1 undone → 3 unsent, each count kept in the copy; reconnect → 0', async () => {
    const offline = memoryCopy(null, 0);
    session = new PlanSession(PLAN_ID, ANA, relay.socket, offline.attach);
    await session.start();
    relay.connect();
    relay.disconnect();
    session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 120_000));
    session.edit((doc, origin) => setPartValue(doc, origin, 'R4', 130_000));
    session.undo();
    expect(session.unsentEdits()).toBe(3);
    expect(offline.counts).toEqual([1, 2, 3]);

    relay.connect();
    await flush();
    expect(r4(relay.doc)).toBe(120_000);
    expect(session.unsentEdits()).toBe(0);
    expect(offline.counts).toEqual([1, 2, 3, 0]);
  });

  it('remote edits while connected → never counted as unsent', async () => {
    const offline = memoryCopy(null, 0);
    session = new PlanSession(PLAN_ID, ANA, relay.socket, offline.attach);
    await session.start();
    relay.connect();
    const before = Y.encodeStateVector(relay.doc);
    setPartValue(relay.doc, localOrigin('u-ben'), 'R4', 82_000);
    relay.toClient('plan:synced', PLAN_ID, encodeUpdate(Y.encodeStateAsUpdate(relay.doc, before)));
    expect(r4(session.doc)).toBe(82_000);
    expect(session.unsentEdits()).toBe(0);
    expect(offline.counts).toEqual([]);
  });
});
