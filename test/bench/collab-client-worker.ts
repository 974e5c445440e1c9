/**
 * A forked client process of `npm run bench:collab`: connects the simulated clients it is
 * given, runs one scenario when told to, and reports what it measured over the IPC channel.
 * Started by `collab-client-pool.ts`; never run by hand.
 */
import { io } from 'socket.io-client';
import * as Y from 'yjs';

import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import { encodeSyncStep1, fromWire, toWire } from '@rampart/collab/sync/wire-codec';

import { TestPlanClient, type ClientSocket } from '../utils/collab-client';
import {
  benchNow,
  type ClientSpec,
  type FromWorker,
  type ToWorker,
  type WorkerResult,
} from './collab-client-protocol';

/** The raw socket of an `arrival` client: joins and syncs once, then only timestamps frames. */
class ArrivalClient {
  readonly socket: ClientSocket;
  readonly arrivals: number[] = [];
  recording = false;
  loaded = false;
  failure: string | null = null;

  constructor(url: string, user: string, planId: string) {
    this.socket = io(`${url}${PLAN_NAMESPACE}`, {
      transports: ['websocket'],
      autoConnect: false,
      reconnection: false,
      query: { testUser: user },
      forceNew: true,
    });
    this.socket.on('connect', () => {
      this.socket.emit('plan:join', planId, (res) => {
        if ('error' in res) {
          this.failure = `${user}: join refused: ${res.error.code}`;
          return;
        }
        // An empty state vector: the server answers with the whole plan, then `plan:loaded`.
        this.socket.emit('plan:sync', planId, toWire(encodeSyncStep1(new Y.Doc())));
      });
    });
    this.socket.on('plan:loaded', () => (this.loaded = true));
    this.socket.on('plan:synced', (_planId, payload) => {
      if (!this.recording) return;
      const wire = fromWire(payload);
      // Two header bytes tell an update frame from presence or sync steps; no Yjs decoding.
      if (wire.ok && wire.bytes[0] === MessageType.Sync && wire.bytes[1] === SyncStep.Update) {
        this.arrivals.push(benchNow());
      }
    });
  }

  async ready(timeoutMs: number): Promise<void> {
    const start = Date.now();
    while (!this.loaded) {
      if (this.failure) throw new Error(this.failure);
      if (Date.now() - start > timeoutMs) throw new Error('arrival client not ready');
      await new Promise((r) => setTimeout(r, 10));
    }
  }
}

interface Simulated {
  spec: ClientSpec;
  full: TestPlanClient | null;
  raw: ArrivalClient | null;
}

/** Each editor edits twice a second; each presence client moves its cursor once a second. */
const EDIT_PERIOD_MS = 500;
const PRESENCE_PERIOD_MS = 1000;

let clients: Simulated[] = [];
let result: WorkerResult = emptyResult();
let cpuAtGo = process.cpuUsage();
let wallAtGo = performance.now();
// setInterval and setTimeout both return a Node `Timeout`; clearInterval clears either.
let timers: NodeJS.Timeout[] = [];

function emptyResult(): WorkerResult {
  return { stampLatency: [], ackLatency: [], arrivals: [], edits: 0, cpuCores: 0 };
}

function send(message: FromWorker): void {
  process.send?.(message);
}

/** Records remote edits by the send time stamped in the `bench` map (editors and decoders). */
function timeStamps(client: TestPlanClient): void {
  const map = client.doc.getMap<number>('bench');
  map.observe((event) => {
    if (event.transaction.local) return;
    const now = benchNow();
    for (const key of event.keysChanged) {
      if (key === client.userId) continue;
      result.stampLatency.push(now - map.get(key)!);
    }
  });
}

async function connect(url: string, specs: ClientSpec[]): Promise<void> {
  clients = specs.map((spec) => {
    if (spec.mode === 'arrival')
      return { spec, full: null, raw: new ArrivalClient(url, spec.user, spec.plan) };
    const full = new TestPlanClient(url, spec.user, spec.plan, { autoConnect: false });
    if (spec.mode === 'editor' || spec.mode === 'decoder') timeStamps(full);
    return { spec, full, raw: null };
  });
  // 25 at a time per worker: simultaneous handshakes would only measure the accept queue.
  for (let i = 0; i < clients.length; i += 25) {
    const batch = clients.slice(i, i + 25);
    for (const c of batch) (c.full?.socket ?? c.raw!.socket).connect();
    await Promise.all(batch.map((c) => (c.full ? c.full.ready(60_000) : c.raw!.ready(60_000))));
  }
}

/**
 * Runs `tick` every `periodMs`, the first time after `phaseMs`. Phases spread evenly over the
 * period: clients started by one `go` would otherwise all fire in the same millisecond, a
 * burst no group of people produces, and the benchmark would measure its own queue.
 */
function every(periodMs: number, phaseMs: number, tick: () => void): void {
  const first = setTimeout(() => {
    tick();
    timers.push(setInterval(tick, periodMs));
  }, phaseMs);
  timers.push(first);
}

function startEditing(client: TestPlanClient, phaseMs: number): void {
  const sentAt: number[] = [];
  // Acks come back in send order per client, so a queue of send times pairs them.
  client.onAcknowledged = () => {
    const t = sentAt.shift();
    if (t !== undefined) result.ackLatency.push(benchNow() - t);
  };
  every(EDIT_PERIOD_MS, phaseMs, () => {
    const t = benchNow();
    sentAt.push(t);
    client.doc.getMap<number>('bench').set(client.userId, t);
    result.edits++;
  });
}

function startPresence(client: TestPlanClient, i: number, phaseMs: number): void {
  every(PRESENCE_PERIOD_MS, phaseMs, () =>
    client.setPresence({
      user: { id: client.userId, name: client.userId, colour: '#14507a' },
      cursorTime: ((i * 7919) % 1000) / 50_000 + (benchNow() % 1000) / 1e6,
    }),
  );
}

function go(seconds: number): void {
  result = emptyResult();
  cpuAtGo = process.cpuUsage();
  wallAtGo = performance.now();
  clients.forEach((c, i) => {
    if (c.raw) c.raw.recording = true;
    // `phase` in [0, 1): this client's place among all clients of the scenario.
    if (c.full && c.spec.mode === 'editor') startEditing(c.full, c.spec.phase * EDIT_PERIOD_MS);
    if (c.full && c.spec.mode === 'presence')
      startPresence(c.full, i, c.spec.phase * PRESENCE_PERIOD_MS);
  });
  // Bounded even if the parent never says stop.
  timers.push(setTimeout(() => timers.forEach(clearInterval), seconds * 1000));
}

function collect(): WorkerResult {
  timers.forEach(clearInterval);
  timers = [];
  const used = process.cpuUsage(cpuAtGo);
  result.cpuCores = (used.user + used.system) / 1000 / (performance.now() - wallAtGo);
  result.arrivals = clients.filter((c) => c.raw).map((c) => c.raw!.arrivals);
  return result;
}

function close(): void {
  for (const c of clients) {
    c.full?.close();
    c.raw?.socket.disconnect();
  }
  clients = [];
}

process.on('message', (message: ToWorker) => {
  const handle = async (): Promise<FromWorker> => {
    switch (message.kind) {
      case 'connect':
        await connect(message.url, message.clients);
        return { kind: 'connected' };
      case 'clock':
        return { kind: 'clock', now: benchNow() };
      case 'go':
        go(message.seconds);
        return { kind: 'going' };
      case 'collect':
        return { kind: 'result', result: collect() };
      case 'close':
        close();
        return { kind: 'closed' };
    }
  };
  handle().then(send, (err: unknown) => send({ kind: 'failed', message: String(err) }));
});

// The parent going away (a crashed run) must not leave this process behind.
process.on('disconnect', () => process.exit(0));
