import * as Y from 'yjs';

import { PlanDocumentRepository } from '../../../server/data-access/repositories/plan-document-repository';
import { eventually, isContained, TestPlanClient } from '../../utils/collab-client';
import {
  AccessTable,
  createPlanRow,
  startCollabTestServer,
  type CollabTestServer,
} from '../../utils/collab-test-server';
import { randomInt, seededRandom } from '../../utils/seeded-random';
import { createTestDatabase, type TestDatabase } from '../../utils/test-database';

const CLIENTS = 12;
const STEPS = 400;
const RESTART_AT = 200;
const SIGNALS = ['VIN_24V', 'EN_5V', 'PG_5V', 'EN_3V3', 'PG_3V3', 'EN_1V2', 'RESET_N', 'VREF_2V5'];

function userId(i: number): string {
  return `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`;
}

/** One random edit of the kinds plans see: set/delete a part, add/remove a signal, a note. */
function randomEdit(doc: Y.Doc, random: () => number, step: number): void {
  const parts = doc.getMap<unknown>('parts');
  const signals = doc.getArray<string>('signals');
  const notes = doc.getText('notes');
  const pick = randomInt(random, 5);
  if (pick === 0)
    parts.set(`R${randomInt(random, 30)}`, { ohms: Math.round(random() * 1e5), step });
  else if (pick === 1 && parts.size > 0)
    parts.delete([...parts.keys()][randomInt(random, parts.size)]!);
  else if (pick === 2)
    signals.insert(randomInt(random, signals.length + 1), [
      SIGNALS[randomInt(random, SIGNALS.length)]!,
    ]);
  else if (pick === 3 && signals.length > 0) signals.delete(randomInt(random, signals.length), 1);
  else notes.insert(randomInt(random, notes.length + 1), `s${step} `);
}

/** The fuzzed content; top-level types must be named to appear (Yjs creates them lazily). */
function content(doc: Y.Doc): unknown {
  return {
    parts: doc.getMap('parts').toJSON(),
    signals: doc.getArray('signals').toJSON(),
    notes: doc.getText('notes').toString(),
  };
}

describe('live plan relay: convergence', () => {
  let db: TestDatabase;
  let server: CollabTestServer;
  const access = new AccessTable('editor');

  beforeAll(async () => {
    db = await createTestDatabase();
    // A small compaction threshold so compaction runs in the middle of the edits too.
    server = await startCollabTestServer({
      databaseUrl: db.url,
      access,
      options: { compactAfterUpdates: 60 },
    });
  });

  afterAll(async () => {
    await server.stop();
    await db.drop();
  });

  it(`${CLIENTS} clients, random edits, disconnects and a server restart → all docs and PostgreSQL identical, every acknowledged update present`, async () => {
    const planId = await createPlanRow(server.dataSource, 'motor-drive-fuzz');
    const random = seededRandom(5_3_3_1_2);
    const clients = Array.from(
      { length: CLIENTS },
      (_, i) => new TestPlanClient(server.url, userId(i), planId),
    );
    try {
      await Promise.all(clients.map((c) => c.ready()));
      for (let step = 0; step < STEPS; step++) {
        if (step === RESTART_AT) {
          const port = server.port;
          await server.stop();
          server = await startCollabTestServer({
            databaseUrl: db.url,
            access,
            port,
            options: { compactAfterUpdates: 60 },
          });
        }
        const c = clients[randomInt(random, CLIENTS)]!;
        const roll = random();
        if (roll < 0.04 && c.socket.connected) c.socket.disconnect();
        else if (roll < 0.1 && !c.socket.connected) c.socket.connect();
        else randomEdit(c.doc, random, step);
        if (step % 10 === 0) await new Promise((r) => setTimeout(r, 5));
      }
      for (const c of clients) if (!c.socket.connected) c.socket.connect();

      const repo = new PlanDocumentRepository(server.dataSource);
      const storedJson = async (): Promise<unknown> => {
        const stored = await repo.load(planId);
        const doc = new Y.Doc();
        Y.applyUpdate(doc, stored.state);
        for (const u of stored.updates) Y.applyUpdate(doc, u.update);
        return content(doc);
      };
      await eventually(
        () => {
          for (const c of clients) {
            expect(c.socket.connected).toBe(true);
            expect(c.unacked).toBe(0);
            expect(content(c.doc)).toEqual(content(clients[0]!.doc));
          }
        },
        20_000,
        100,
      );
      let final: unknown = null;
      await eventually(() => undefined);
      for (let attempt = 0; attempt < 50; attempt++) {
        final = await storedJson();
        if (JSON.stringify(final) === JSON.stringify(content(clients[0]!.doc))) break;
        await new Promise((r) => setTimeout(r, 100));
      }
      expect(final).toEqual(content(clients[0]!.doc));

      const stored = await repo.load(planId);
      const storedDoc = new Y.Doc();
      Y.applyUpdate(storedDoc, stored.state);
      for (const u of stored.updates) Y.applyUpdate(storedDoc, u.update);
      const acknowledged = clients.flatMap((c) => c.acknowledged);
      // Offline edits travel merged in one step 2, so acks are fewer than edits and vary with
      // timing; this only checks that many acknowledged updates were put to the test.
      expect(acknowledged.length).toBeGreaterThan(30);
      for (const a of acknowledged) expect(isContained(storedDoc, a.update)).toBe(true);
      // The doc really holds content from many clients, not an empty plan everywhere.
      expect(Object.keys(storedDoc.getMap('parts').toJSON()).length).toBeGreaterThan(3);
    } finally {
      for (const c of clients) c.close();
    }
  }, 60_000);
});
