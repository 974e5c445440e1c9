import * as Y from 'yjs';

import {
  PlanDocumentRepository,
  type PendingUpdate,
  type StoredDocument,
} from '../../../server/data-access/repositories/plan-document-repository';
import { eventually, TestPlanClient } from '../../utils/collab-client';
import {
  AccessTable,
  createPlanRow,
  startCollabTestServer,
  type CollabTestServer,
} from '../../utils/collab-test-server';
import { createTestDatabase, type TestDatabase } from '../../utils/test-database';

const EDITOR = '00000000-0000-4000-8000-0000000000e1';

/** A repository whose loads and appends can be slowed down or made to fail. */
class SlowRepository extends PlanDocumentRepository {
  loadDelayMs = 0;
  appendDelayMs = 0;
  failAppends = 0;
  appendCalls = 0;

  override async load(planId: string): Promise<StoredDocument> {
    await new Promise((r) => setTimeout(r, this.loadDelayMs));
    return super.load(planId);
  }

  override async append(planId: string, items: readonly PendingUpdate[]): Promise<number[]> {
    this.appendCalls++;
    await new Promise((r) => setTimeout(r, this.appendDelayMs));
    if (this.failAppends > 0) {
      this.failAppends--;
      throw new Error('simulated: connection to the database lost');
    }
    return super.append(planId, items);
  }
}

function partsOf(stored: StoredDocument): Record<string, unknown> {
  const doc = new Y.Doc();
  Y.applyUpdate(doc, stored.state);
  for (const u of stored.updates) Y.applyUpdate(doc, u.update);
  return doc.getMap('parts').toJSON();
}

describe('live plan rooms: loading, saving, closing, compaction', () => {
  let db: TestDatabase;
  let server: CollabTestServer;
  let repo: SlowRepository;
  const access = new AccessTable('editor');

  beforeAll(async () => {
    db = await createTestDatabase();
    server = await startCollabTestServer({
      databaseUrl: db.url,
      access,
      options: { roomCloseDelayMs: 50, writeRetryMs: 50, compactAfterUpdates: 20 },
      repository: (ds) => (repo = new SlowRepository(ds)),
    });
  });

  afterAll(async () => {
    await server.stop();
    await db.drop();
  });

  beforeEach(() => {
    repo.loadDelayMs = 0;
    repo.appendDelayMs = 0;
    repo.failAppends = 0;
  });

  it('client joins while the stored document is loading → gets the stored content, never an empty plan', async () => {
    const planId = await createPlanRow(server.dataSource, 'lifecycle-load');
    const seed = new Y.Doc();
    seed.getMap('parts').set('U1', { kind: 'buck', vout: 5 });
    await repo.append(planId, [{ update: Y.encodeStateAsUpdate(seed), authorId: null }]);
    repo.loadDelayMs = 400;
    const first = new TestPlanClient(server.url, EDITOR, planId);
    await new Promise((r) => setTimeout(r, 100));
    const second = new TestPlanClient(server.url, EDITOR, planId);
    // Whatever arrives first must already be the stored plan.
    const seenAtFirstSync: unknown[] = [];
    for (const c of [first, second]) {
      c.socket.on('plan:loaded', () => seenAtFirstSync.push(c.doc.getMap('parts').get('U1')));
    }
    try {
      await Promise.all([first.ready(), second.ready()]);
      expect(seenAtFirstSync).toEqual([
        { kind: 'buck', vout: 5 },
        { kind: 'buck', vout: 5 },
      ]);
    } finally {
      first.close();
      second.close();
    }
  });

  it('room closed while a save is in flight → the edit is stored, nothing lost', async () => {
    const planId = await createPlanRow(server.dataSource, 'lifecycle-close');
    const c = new TestPlanClient(server.url, EDITOR, planId);
    await c.ready();
    repo.appendDelayMs = 300;
    const calls = repo.appendCalls;
    c.doc.getMap('parts').set('C7', { farads: 4.7e-6 });
    // The write is in flight (the server has the update; PostgreSQL has not answered yet).
    await eventually(() => expect(repo.appendCalls).toBe(calls + 1));
    c.close();
    // The room outlives its last socket until the write is committed, then unloads.
    await new Promise((r) => setTimeout(r, 100));
    expect(server.relay.registry.has(planId)).toBe(true);
    await eventually(() => expect(server.relay.registry.has(planId)).toBe(false), 3000);
    expect(partsOf(await repo.load(planId))).toEqual({ C7: { farads: 4.7e-6 } });
  });

  it('write fails twice → retried, then stored and acknowledged once', async () => {
    const planId = await createPlanRow(server.dataSource, 'lifecycle-retry');
    const c = new TestPlanClient(server.url, EDITOR, planId);
    try {
      await c.ready();
      repo.failAppends = 2;
      const calls = repo.appendCalls;
      c.doc.getMap('parts').set('R9', { ohms: 100_000 });
      await eventually(() => expect(c.acknowledged).toHaveLength(1), 3000);
      expect(repo.appendCalls - calls).toBe(3);
      expect(partsOf(await repo.load(planId))).toEqual({ R9: { ohms: 100_000 } });
    } finally {
      c.close();
    }
  });

  it('log above the count threshold → compacted into the state row, content kept', async () => {
    const planId = await createPlanRow(server.dataSource, 'lifecycle-compact');
    const c = new TestPlanClient(server.url, EDITOR, planId);
    try {
      await c.ready();
      for (let i = 0; i < 45; i++) {
        c.doc.getMap('parts').set(`R${i}`, { ohms: 1000 + i });
        await eventually(() => expect(c.unacked).toBe(0));
      }
      const stored = await repo.load(planId);
      expect(stored.compactedSeq).toBeGreaterThanOrEqual(20);
      expect(stored.updates.length).toBeLessThan(45);
      expect(Object.keys(partsOf(stored))).toHaveLength(45);
    } finally {
      c.close();
    }
  });

  it('long log found on load → compacted on load', async () => {
    const planId = await createPlanRow(server.dataSource, 'lifecycle-long-log');
    const writer = new Y.Doc();
    const items: PendingUpdate[] = [];
    writer.on('update', (update: Uint8Array) => items.push({ update, authorId: EDITOR }));
    for (let i = 0; i < 30; i++) writer.getMap('parts').set(`C${i}`, { farads: 1e-9 * (i + 1) });
    await repo.append(planId, items);
    expect((await repo.logSize(planId)).count).toBe(30);
    const c = new TestPlanClient(server.url, EDITOR, planId);
    try {
      await c.ready();
      expect(Object.keys(c.doc.getMap('parts').toJSON())).toHaveLength(30);
      await eventually(async () => expect((await repo.logSize(planId)).count).toBe(0), 3000);
    } finally {
      c.close();
    }
  });
});
