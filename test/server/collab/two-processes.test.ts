import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

import { Client } from 'pg';

import { openDatabase } from '../../../server/data-access/data-source';
import { eventually, TestPlanClient } from '../../utils/collab-client';
import { AccessTable, createPlanRow, startCollabTestServer } from '../../utils/collab-test-server';
import { createTestDatabase, type TestDatabase } from '../../utils/test-database';

const ROOT = path.resolve(__dirname, '../../..');
const ALICE = '00000000-0000-4000-8000-0000000002a1';
const BOB = '00000000-0000-4000-8000-0000000002b1';

interface RelayProcess {
  child: ChildProcess;
  url: string;
  output: string[];
}

/** Starts `test/utils/collab-process.ts` in its own Node process; resolves once it listens. */
function startProcess(databaseUrl: string, name: string): Promise<RelayProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'test/utils/collab-process.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      PORT: '0',
      ADAPTER_NAME: name,
      ANTI_ENTROPY_MS: '1000',
      TSX_TSCONFIG_PATH: 'tsconfig.server.json',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const output: string[] = [];
  return new Promise((resolve, reject) => {
    const timer = setTimeout(
      () => reject(new Error(`${name} did not start: ${output.join('')}`)),
      30_000,
    );
    child.stderr!.on('data', (d: Buffer) => output.push(d.toString()));
    child.stdout!.on('data', (d: Buffer) => {
      output.push(d.toString());
      const m = /READY (\d+)/.exec(d.toString());
      if (m) {
        clearTimeout(timer);
        resolve({ child, url: `http://127.0.0.1:${m[1]}`, output });
      }
    });
    child.once('exit', (code) =>
      reject(new Error(`${name} exited with ${code}: ${output.join('')}`)),
    );
  });
}

function stopProcess(p: RelayProcess | undefined): Promise<void> {
  if (!p || p.child.exitCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => p.child.kill('SIGKILL'), 10_000);
    p.child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    p.child.kill('SIGTERM');
  });
}

describe('live plan relay: two server processes on one database', () => {
  let db: TestDatabase;
  let first: RelayProcess | undefined;
  let second: RelayProcess | undefined;
  let planId: string;

  beforeAll(async () => {
    db = await createTestDatabase();
    // Migrate and create the plan once, before either process starts.
    const { dataSource } = await openDatabase(db.url);
    planId = await createPlanRow(dataSource, 'motor-drive-two-processes');
    await dataSource.destroy();
    first = await startProcess(db.url, 'adapter-first');
    second = await startProcess(db.url, 'adapter-second');
  }, 60_000);

  afterAll(async () => {
    await Promise.all([stopProcess(first), stopProcess(second)]);
    await db.drop();
  }, 30_000);

  it('edits and presence on one process → reach clients of the other, both ways', async () => {
    const alice = new TestPlanClient(first!.url, ALICE, planId);
    const bob = new TestPlanClient(second!.url, BOB, planId);
    try {
      await Promise.all([alice.ready(), bob.ready()]);
      alice.doc.getMap('parts').set('U1', { kind: 'buck', vout: 5 });
      await eventually(() =>
        expect(bob.doc.getMap('parts').get('U1')).toEqual({ kind: 'buck', vout: 5 }),
      );
      bob.doc.getMap('parts').set('U2', { kind: 'ldo', vout: 3.3 });
      await eventually(() =>
        expect(alice.doc.getMap('parts').get('U2')).toEqual({ kind: 'ldo', vout: 3.3 }),
      );
      alice.setPresence({
        user: { id: ALICE, name: 'Alice', colour: '#14507a' },
        cursorTime: 0.0125,
      });
      await eventually(() =>
        expect(bob.awareness.getStates().get(alice.doc.clientID)).toMatchObject({
          cursorTime: 0.0125,
        }),
      );
    } finally {
      alice.close();
      bob.close();
    }
  }, 30_000);

  it('adapter connection of one process dropped → the missed edit is healed by anti-entropy', async () => {
    const alice = new TestPlanClient(first!.url, ALICE, planId);
    const bob = new TestPlanClient(second!.url, BOB, planId);
    const admin = new Client({ connectionString: db.url });
    await admin.connect();
    try {
      await Promise.all([alice.ready(), bob.ready()]);
      // Kill the second process's LISTEN connection: what the first publishes now is lost.
      const killed = await admin.query(
        `SELECT pg_terminate_backend(pid) FROM pg_stat_activity
          WHERE application_name = 'adapter-second' AND query LIKE 'LISTEN%'`,
      );
      expect(killed.rowCount).toBe(1);
      alice.doc.getMap('parts').set('U3', { kind: 'core', vout: 1.2 });
      await eventually(() => expect(alice.acknowledged.length).toBeGreaterThanOrEqual(1));
      await eventually(
        () => expect(bob.doc.getMap('parts').get('U3')).toEqual({ kind: 'core', vout: 1.2 }),
        10_000,
      );
      expect(second!.output.join('')).toMatch(/anti-entropy reloaded 1 room/);
    } finally {
      await admin.end();
      alice.close();
      bob.close();
    }
  }, 30_000);

  it('snapshot restored on a process with no socket of the plan → the others apply it at once', async () => {
    // A third relay, in this test's process, holds no room of the plan: like an API request
    // that lands on a process none of the plan's editors is connected to.
    const third = await startCollabTestServer({
      databaseUrl: db.url,
      access: new AccessTable('editor'),
      adapter: true,
      adapterName: 'adapter-third',
      // Far beyond the test's wait: only the adapter relay can bring the restore in time.
      options: { antiEntropyMs: 600_000 },
    });
    const alice = new TestPlanClient(first!.url, ALICE, planId);
    const bob = new TestPlanClient(second!.url, BOB, planId);
    const reloads = (p: RelayProcess): number =>
      (p.output.join('').match(/anti-entropy reloaded/g) ?? []).length;
    try {
      await Promise.all([alice.ready(), bob.ready()]);
      alice.doc.getMap('parts').set('U4', { kind: 'ldo', vout: 1.8 });
      await eventually(() =>
        expect(bob.doc.getMap('parts').get('U4')).toEqual({ kind: 'ldo', vout: 1.8 }),
      );
      const snapshot = await third.relay.snapshots.create(planId, ALICE, 'Before the 2.5 V change');
      alice.doc.getMap('parts').set('U4', { kind: 'ldo', vout: 2.5 });
      await eventually(() =>
        expect(bob.doc.getMap('parts').get('U4')).toEqual({ kind: 'ldo', vout: 2.5 }),
      );
      const before = [reloads(first!), reloads(second!)];
      expect(third.relay.registry.get(planId)).toBeUndefined();
      const seq = await third.relay.snapshots.restore(planId, snapshot.id, ALICE);
      expect(seq).toBeGreaterThan(0);
      for (const c of [alice, bob]) {
        await eventually(() =>
          expect(c.doc.getMap('parts').get('U4')).toEqual({ kind: 'ldo', vout: 1.8 }),
        );
      }
      // Carried by the adapter relay, not healed by a reload from the database.
      expect([reloads(first!), reloads(second!)]).toEqual(before);
    } finally {
      alice.close();
      bob.close();
      await third.stop();
    }
  }, 30_000);
});
