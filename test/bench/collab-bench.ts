/**
 * `npm run bench:collab`: the live-plan relay under load, over loopback, against a real
 * PostgreSQL, next to a bare relay (same messages, no auth, no persistence). Prints figures;
 * asserts nothing. Needs TEST_DATABASE_URL (the throwaway cluster `npm test` starts; see
 * DEVELOPERS.md). Scale with flags, e.g. `npm run bench:collab -- --observers=300 --seconds=5`:
 *   --editors=100 --rooms=20 --observers=1000 --presence=500 --open-rooms=500
 *   --log-updates=10000 --seconds=8 --workers=3 --decode-every=20 --commits=100
 * Clients run in `--workers` forked processes (`collab-client-worker.ts`), each relay server in
 * its own process, PostgreSQL in its own; latencies use a clock comparable across processes.
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
import { ClientPool } from './collab-client-pool';
import { benchNow, type ClientSpec, type WorkerResult } from './collab-client-protocol';
import { printReport } from './collab-bench-report';
import { machineCpuMeter } from './collab-machine-cpu';

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
const WORKERS = flag('workers', 3);
const DECODE_EVERY = flag('decode-every', 20);
const COMMITS = flag('commits', 100);

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}

function summary(samples: number[]): { p50: number; p99: number; n: number } {
  const sorted = [...samples].sort((a, b) => a - b);
  return { p50: percentile(sorted, 50), p99: percentile(sorted, 99), n: sorted.length };
}

async function sleep(msDelay: number): Promise<void> {
  await new Promise((r) => setTimeout(r, msDelay));
}

/** CPU of this (the parent) process between two calls, in cores. */
function cpuMeter(): () => number {
  const cpu = process.cpuUsage();
  const wall = performance.now();
  return () => {
    const used = process.cpuUsage(cpu);
    return (used.user + used.system) / 1000 / (performance.now() - wall);
  };
}

/** Client-side CPU of one scenario: the sum over the workers, and the busiest worker. */
function clientCpu(results: WorkerResult[]): { sum: number; max: number } {
  const each = results.map((r) => r.cpuCores);
  return { sum: each.reduce((a, b) => a + b, 0), max: Math.max(...each) };
}

/** Scenario: editors spread over rooms, each editing twice a second, in the client workers. */
async function editors(pool: ClientPool, server: BenchServer, plans: string[]) {
  const specs: ClientSpec[] = Array.from({ length: EDITORS }, (_, i) => ({
    user: `e-${i}`,
    plan: plans[i % plans.length]!,
    mode: 'editor',
    phase: i / EDITORS,
  }));
  await pool.connect(server.url, specs);
  await sleep(300);
  await server.stats(true);
  const parentCpu = cpuMeter();
  const machineCpu = machineCpuMeter();
  await pool.go(SECONDS);
  await sleep(SECONDS * 1000 + 500);
  const results = await pool.collect();
  const stats = await server.stats();
  const parent = parentCpu();
  const machine = machineCpu();
  await pool.closeClients();
  const edits = results.reduce((n, r) => n + r.edits, 0);
  return {
    latency: summary(results.flatMap((r) => r.stampLatency)),
    ack: summary(results.flatMap((r) => r.ackLatency)),
    editsPerSecond: edits / (SECONDS + 0.5),
    stats,
    clients: clientCpu(results),
    parent,
    machine,
  };
}

/**
 * Scenario: one writer (in this process) probing ten times a second, many read-only observers
 * in one room spread over the workers. One observer in DECODE_EVERY is a full client that
 * times each probe by the stamp it decodes; the others only record when each update frame
 * arrives, and the k-th arrival is paired with the k-th probe sent (one writer, one ordered
 * connection per observer).
 */
async function fanOut(pool: ClientPool, server: BenchServer, planId: string) {
  const specs: ClientSpec[] = Array.from({ length: OBSERVERS }, (_, i) => ({
    user: `v-${i}`,
    plan: planId,
    mode: i % DECODE_EVERY === 0 ? 'decoder' : 'arrival',
    phase: 0,
  }));
  await pool.connect(server.url, specs);
  const writer = new TestPlanClient(server.url, 'w-0', planId);
  await writer.ready(60_000);
  // Let the writer's own first step 2 settle before anyone records frames.
  await sleep(500);
  await server.stats(true);
  const parentCpu = cpuMeter();
  const machineCpu = machineCpuMeter();
  const seconds = Math.min(SECONDS, 5);
  await pool.go(seconds + 2);
  const sentAt: number[] = [];
  const timer = setInterval(() => {
    const t = benchNow();
    sentAt.push(t);
    writer.doc.getMap<number>('bench').set(writer.userId, t);
  }, 100);
  await sleep(seconds * 1000);
  clearInterval(timer);
  await sleep(1000);
  const results = await pool.collect();
  const stats = await server.stats();
  const parent = parentCpu();
  const machine = machineCpu();
  writer.close();
  await pool.closeClients();
  const arrivalLatency: number[] = [];
  let incomplete = 0;
  for (const list of results.flatMap((r) => r.arrivals)) {
    if (list.length !== sentAt.length) incomplete++;
    for (let k = 0; k < Math.min(list.length, sentAt.length); k++) {
      arrivalLatency.push(list[k]! - sentAt[k]!);
    }
  }
  const decoders = specs.filter((s) => s.mode === 'decoder').length;
  return {
    decoded: summary(results.flatMap((r) => r.stampLatency)),
    arrival: summary(arrivalLatency),
    all: summary([...arrivalLatency, ...results.flatMap((r) => r.stampLatency)]),
    probes: sentAt.length,
    decoders,
    incomplete,
    stats,
    clients: clientCpu(results),
    parent,
    machine,
  };
}

/** Scenario: many clients moving their cursor once a second. */
async function presence(pool: ClientPool, server: BenchServer, plans: string[]) {
  const specs: ClientSpec[] = Array.from({ length: PRESENCE }, (_, i) => ({
    user: `p-${i}`,
    plan: plans[i % plans.length]!,
    mode: 'presence',
    phase: i / PRESENCE,
  }));
  await pool.connect(server.url, specs);
  await server.stats(true);
  await pool.go(SECONDS);
  await sleep(SECONDS * 1000);
  const results = await pool.collect();
  const stats = await server.stats();
  await pool.closeClients();
  return { stats, clients: clientCpu(results) };
}

/** Scenario: many rooms open at once, each holding the demo plan. */
async function openRooms(pool: ClientPool, server: BenchServer, plans: string[]) {
  const before = await server.stats();
  const specs: ClientSpec[] = plans.map((plan, i) => ({
    user: `o-${i}`,
    plan,
    mode: 'idle',
    phase: 0,
  }));
  await pool.connect(server.url, specs);
  await sleep(1000);
  const after = await server.stats();
  await pool.closeClients();
  return { before, after };
}

/**
 * PostgreSQL alone: one small update appended and committed at a time (what one edit's durable
 * ack waits for at least, without the relay or any client).
 */
async function commitLatency(repo: PlanDocumentRepository, planId: string) {
  const doc = new Y.Doc();
  const updates: Uint8Array[] = [];
  doc.on('update', (u: Uint8Array) => updates.push(u));
  const times: number[] = [];
  for (let i = 0; i < COMMITS; i++) {
    doc.getMap<number>('bench').set('commit', i);
    const t = performance.now();
    await repo.append(planId, [{ update: updates.pop()!, authorId: null }]);
    times.push(performance.now() - t);
  }
  doc.destroy();
  return summary(times);
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
  const pool = ClientPool.start(WORKERS);
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
    const [commitPlan] = await mk(1, 'commit', false);
    const os = await import('node:os');
    const clock = await pool.clockSkew();
    const header = {
      cores: os.cpus().length,
      workers: pool.size,
      decodeEvery: DECODE_EVERY,
      loadAtStart: os.loadavg(),
      clock,
    };

    const commits = await commitLatency(repo, commitPlan!);

    // Both relays stay up and the scenarios alternate between them, so a change in the load of
    // the shared machine during the run hits both sides about equally (an idle relay costs
    // nothing).
    const bare = track(await BenchServer.start('bare', database.url));
    const full = track(await BenchServer.start('full', database.url));
    const bareEditors = await editors(pool, bare, bareEditorPlans);
    const fullEditors = await editors(pool, full, editorPlans);
    const bareFan = await fanOut(pool, bare, 'bare-fan-out');
    const fullFan = await fanOut(pool, full, fanPlan!);
    await bare.stop();
    const fullPresence = await presence(pool, full, presencePlans);
    await full.stop();

    const fresh = track(await BenchServer.start('full', database.url));
    const rooms = await openRooms(pool, fresh, roomPlans);
    await fresh.stop();

    const log = await longLog(repo, logPlan!);
    printReport({
      header,
      loadAtEnd: os.loadavg(),
      sizes: {
        editors: EDITORS,
        rooms: ROOMS,
        observers: OBSERVERS,
        presence: PRESENCE,
        openRooms: OPEN_ROOMS,
        logUpdates: LOG_UPDATES,
      },
      commits,
      bareEditors,
      fullEditors,
      bareFan,
      fullFan,
      fullPresence,
      rooms,
      log,
    });
  } finally {
    pool.stop();
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
