/**
 * `npm run bench:collab`: the live-plan relay under load, over loopback, against a real
 * PostgreSQL, next to a bare relay (same messages, no auth, no persistence). Prints figures;
 * asserts nothing. Needs TEST_DATABASE_URL (the throwaway cluster `npm test` starts; see
 * DEVELOPERS.md). Scale with flags, e.g. `npm run bench:collab -- --observers=300 --seconds=5`:
 *   --editors=100 --rooms=20 --observers=1000 --presence=500 --open-rooms=500
 *   --log-updates=10000 --seconds=8
 */
import * as Y from 'yjs';

import { demoPlanUpdate } from '@rampart/collab/doc/demo-plan';

import { openDatabase } from '../../server/data-access/data-source';
import { seedPlanDocument } from '../../server/data-access/repositories/plan-document-seed';
import { PlanDocumentRepository } from '../../server/data-access/repositories/plan-document-repository';
import { TestPlanClient } from '../utils/collab-client';
import { createPlanRow } from '../utils/collab-test-server';
import { createTestDatabase } from '../utils/test-database';
import { BenchServer } from './bench-server-process';

function flag(name: string, fallback: number): number {
  const arg = process.argv.find((a) => a.startsWith(`--${name}=`));
  return arg ? Number(arg.split('=')[1]) : fallback;
}

const EDITORS = flag('editors', 100);
const ROOMS = flag('rooms', 20);
const OBSERVERS = flag('observers', 1000);
const PRESENCE = flag('presence', 500);
const OPEN_ROOMS = flag('open-rooms', 500);
const LOG_UPDATES = flag('log-updates', 10_000);
const SECONDS = flag('seconds', 8);

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}

function summary(samples: number[]): { p50: number; p99: number; n: number } {
  const sorted = [...samples].sort((a, b) => a - b);
  return { p50: percentile(sorted, 50), p99: percentile(sorted, 99), n: sorted.length };
}

const ms = (v: number) => `${v.toFixed(2)} ms`;

/** Connects clients 50 at a time (a thousand simultaneous handshakes only measure the queue). */
async function connectAll(clients: TestPlanClient[]): Promise<void> {
  for (let i = 0; i < clients.length; i += 50) {
    const batch = clients.slice(i, i + 50);
    for (const c of batch) c.socket.connect();
    await Promise.all(batch.map((c) => c.ready(60_000)));
  }
}

/** A benchmark client; it connects when `connectAll` says so. */
function benchClient(url: string, user: string, planId: string): TestPlanClient {
  return new TestPlanClient(url, user, planId, { autoConnect: false });
}

/** Watches `bench` map changes made by others and records edit → apply latency. */
function measureLatency(client: TestPlanClient, samples: number[]): void {
  client.doc.getMap<number>('bench').observe((event) => {
    if (event.transaction.local) return;
    const now = performance.now();
    for (const key of event.keysChanged) {
      if (key === client.userId) continue;
      samples.push(now - client.doc.getMap<number>('bench').get(key)!);
    }
  });
}

async function sleep(msDelay: number): Promise<void> {
  await new Promise((r) => setTimeout(r, msDelay));
}

/** Scenario: editors spread over rooms, each editing twice a second. */
async function editors(server: BenchServer, plans: string[]) {
  const clients = Array.from({ length: EDITORS }, (_, i) =>
    benchClient(server.url, `e-${i}`, plans[i % plans.length]!),
  );
  await connectAll(clients);
  const latency: number[] = [];
  const ackLatency: number[] = [];
  for (const c of clients) measureLatency(c, latency);
  await server.stats(true);
  const start = performance.now();
  let edits = 0;
  // Acks come back in send order per client, so a queue of send times pairs them.
  const sentAt = new Map<TestPlanClient, number[]>();
  for (const c of clients) {
    sentAt.set(c, []);
    c.onAcknowledged = () => {
      const t = sentAt.get(c)!.shift();
      if (t !== undefined) ackLatency.push(performance.now() - t);
    };
  }
  const timers = clients.map((c, i) =>
    setInterval(
      () => {
        const t = performance.now();
        sentAt.get(c)!.push(t);
        c.doc.getMap<number>('bench').set(c.userId, t);
        edits++;
      },
      500 + (i % 7),
    ),
  );
  await sleep(SECONDS * 1000);
  timers.forEach(clearInterval);
  await sleep(500);
  const stats = await server.stats();
  const elapsed = (performance.now() - start) / 1000;
  clients.forEach((c) => c.close());
  return {
    latency: summary(latency),
    ack: summary(ackLatency),
    editsPerSecond: edits / elapsed,
    stats,
  };
}

/** Scenario: one writer, many read-only observers in one room. */
async function fanOut(server: BenchServer, planId: string) {
  const observers = Array.from({ length: OBSERVERS }, (_, i) =>
    benchClient(server.url, `v-${i}`, planId),
  );
  const writer = benchClient(server.url, 'w-0', planId);
  await connectAll([writer, ...observers]);
  const latency: number[] = [];
  for (const o of observers) measureLatency(o, latency);
  await server.stats(true);
  const timer = setInterval(
    () => writer.doc.getMap<number>('bench').set(writer.userId, performance.now()),
    100,
  );
  await sleep(Math.min(SECONDS, 5) * 1000);
  clearInterval(timer);
  await sleep(1000);
  const stats = await server.stats();
  [writer, ...observers].forEach((c) => c.close());
  return { latency: summary(latency), stats };
}

/** Scenario: many clients moving their cursor once a second. */
async function presence(server: BenchServer, plans: string[]) {
  const clients = Array.from({ length: PRESENCE }, (_, i) =>
    benchClient(server.url, `p-${i}`, plans[i % plans.length]!),
  );
  await connectAll(clients);
  await server.stats(true);
  const timers = clients.map((c, i) =>
    setInterval(
      () => {
        c.setPresence({
          user: { id: c.userId, name: c.userId, colour: '#14507a' },
          cursorTime: Math.random() * 0.02,
        });
      },
      1000 + (i % 13),
    ),
  );
  await sleep(SECONDS * 1000);
  timers.forEach(clearInterval);
  const stats = await server.stats();
  clients.forEach((c) => c.close());
  return { stats };
}

/** Scenario: many rooms open at once, each holding the demo plan. */
async function openRooms(server: BenchServer, plans: string[]) {
  const before = await server.stats();
  const clients = plans.map((p, i) => benchClient(server.url, `o-${i}`, p));
  await connectAll(clients);
  await sleep(1000);
  const after = await server.stats();
  clients.forEach((c) => c.close());
  return { before, after };
}

/** Scenario: a plan with a long update log, loaded before and after compaction. */
async function longLog(repo: PlanDocumentRepository, planId: string) {
  const writer = new Y.Doc();
  const batch: Uint8Array[] = [];
  writer.on('update', (u: Uint8Array) => batch.push(u));
  for (let i = 0; i < LOG_UPDATES; i++) {
    writer.getMap('parts').set(`R${i % 200}`, { value: 1000 + i });
    if (batch.length >= 500)
      await repo.append(
        planId,
        batch.splice(0).map((update) => ({ update, authorId: null })),
      );
  }
  if (batch.length)
    await repo.append(
      planId,
      batch.splice(0).map((update) => ({ update, authorId: null })),
    );
  const loadOnce = async () => {
    const t = performance.now();
    const stored = await repo.load(planId);
    const doc = new Y.Doc();
    Y.applyUpdate(doc, stored.state);
    for (const u of stored.updates) Y.applyUpdate(doc, u.update);
    const elapsed = performance.now() - t;
    doc.destroy();
    return elapsed;
  };
  const beforeMs = await loadOnce();
  const t = performance.now();
  const compaction = await repo.compact(planId);
  const compactMs = performance.now() - t;
  const after: number[] = [];
  for (let i = 0; i < 5; i++) after.push(await loadOnce());
  return {
    beforeMs,
    compactMs,
    afterMs: summary(after).p50,
    stateBytes: compaction.stateBytes,
    merged: compaction.merged,
  };
}

async function main(): Promise<void> {
  if (!process.env['TEST_DATABASE_URL']) {
    throw new Error(
      'Set TEST_DATABASE_URL to a PostgreSQL cluster the benchmark may create databases in (see DEVELOPERS.md).',
    );
  }
  const database = await createTestDatabase();
  // Every server process started, so a failed run still stops them all.
  const started: BenchServer[] = [];
  const track = (server: BenchServer): BenchServer => {
    started.push(server);
    return server;
  };
  const { dataSource } = await openDatabase(database.url);
  try {
    const repo = new PlanDocumentRepository(dataSource);
    const mk = async (n: number, prefix: string, seed: boolean) => {
      const ids: string[] = [];
      for (let i = 0; i < n; i++) {
        const id = await createPlanRow(dataSource, `${prefix}-${i}`);
        if (seed) await seedPlanDocument(dataSource, id, demoPlanUpdate());
        ids.push(id);
      }
      return ids;
    };
    const editorPlans = await mk(ROOMS, 'editors', true);
    const bareEditorPlans = await mk(ROOMS, 'bare-editors', false);
    const [fanPlan] = await mk(1, 'fan-out', true);
    const presencePlans = await mk(Math.max(1, Math.ceil(PRESENCE / 10)), 'presence', true);
    const roomPlans = await mk(OPEN_ROOMS, 'open-rooms', true);
    const [logPlan] = await mk(1, 'long-log', false);
    const cpus = (await import('node:os')).cpus().length;
    console.log(
      `collab bench: ${cpus} cores, Node ${process.version}; server in its own process; clients in this one`,
    );

    const bare = track(await BenchServer.start('bare', database.url));
    const bareEditors = await editors(bare, bareEditorPlans);
    const bareFan = await fanOut(bare, 'bare-fan-out');
    await bare.stop();

    const full = track(await BenchServer.start('full', database.url));
    const fullEditors = await editors(full, editorPlans);
    const fullFan = await fanOut(full, fanPlan!);
    const fullPresence = await presence(full, presencePlans);
    await full.stop();

    const fresh = track(await BenchServer.start('full', database.url));
    const rooms = await openRooms(fresh, roomPlans);
    await fresh.stop();

    const log = await longLog(repo, logPlan!);

    const line = (label: string, value: string, target = '') =>
      console.log(`${label.padEnd(58)} ${value.padEnd(34)} ${target}`);
    console.log('');
    line(
      `${EDITORS} editors / ${ROOMS} rooms, edit → remote apply (full)`,
      `p50 ${ms(fullEditors.latency.p50)}  p99 ${ms(fullEditors.latency.p99)}`,
      'target p99 ≤ 15 ms',
    );
    line(
      '  same, bare relay',
      `p50 ${ms(bareEditors.latency.p50)}  p99 ${ms(bareEditors.latency.p99)}`,
    );
    line(
      '  overhead ratio full / bare (p50, p99)',
      `${(fullEditors.latency.p50 / bareEditors.latency.p50).toFixed(2)}×  ${(fullEditors.latency.p99 / bareEditors.latency.p99).toFixed(2)}×`,
    );
    line(
      '  edit → durable ack (full)',
      `p50 ${ms(fullEditors.ack.p50)}  p99 ${ms(fullEditors.ack.p99)}`,
    );
    line(
      '  edits stored per second (full)',
      `${fullEditors.editsPerSecond.toFixed(0)} /s (${fullEditors.latency.n} applies)`,
    );
    line(
      '  server CPU / event-loop delay p99 (full)',
      `${fullEditors.stats.cpuCores.toFixed(2)} cores / ${ms(fullEditors.stats.loopP99Ms)}`,
    );
    line(
      `1 writer → ${OBSERVERS} read-only observers (full)`,
      `p50 ${ms(fullFan.latency.p50)}  p99 ${ms(fullFan.latency.p99)}`,
      'target p99 ≤ 50 ms',
    );
    line('  same, bare relay', `p50 ${ms(bareFan.latency.p50)}  p99 ${ms(bareFan.latency.p99)}`);
    line(
      '  overhead ratio full / bare (p99)',
      `${(fullFan.latency.p99 / bareFan.latency.p99).toFixed(2)}×`,
    );
    line(
      '  server CPU / event-loop delay p99 (full)',
      `${fullFan.stats.cpuCores.toFixed(2)} cores / ${ms(fullFan.stats.loopP99Ms)}`,
    );
    line(
      `${PRESENCE} clients sending presence at 1 Hz: server CPU`,
      `${fullPresence.stats.cpuCores.toFixed(2)} cores (loop p99 ${ms(fullPresence.stats.loopP99Ms)})`,
      'target < 0.5 core',
    );
    line(
      `${OPEN_ROOMS} open rooms (demo plan each): server RSS`,
      `${rooms.after.rssMb.toFixed(0)} MB (${rooms.after.rooms} rooms; ${(((rooms.after.rssMb - rooms.before.rssMb) * 1000) / OPEN_ROOMS).toFixed(0)} kB/room)`,
      'target < 500 MB',
    );
    line(`plan with ${LOG_UPDATES} logged updates: load before compaction`, ms(log.beforeMs));
    line('  compaction', `${ms(log.compactMs)} (${log.merged} rows → ${log.stateBytes} bytes)`);
    line('  load after compaction (median of 5)', ms(log.afterMs), 'target ≤ 200 ms');
  } finally {
    await Promise.all(started.map((s) => s.stop()));
    await dataSource.destroy();
    await database.drop();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
