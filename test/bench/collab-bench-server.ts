/**
 * The server side of `npm run bench:collab`, in its own process so its CPU, memory and event
 * loop are measured apart from the thousands of benchmark clients. `full` = the real relay
 * (PostgreSQL, roles, limits); `bare` = the comparison relay. Prints `READY <port>`; answers
 * `stats` / `reset` lines on stdin with `STATS {json}`.
 * Environment: MODE (full|bare), DATABASE_URL (full).
 */
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createHistogram, monitorEventLoopDelay } from 'node:perf_hooks';
import { createInterface } from 'node:readline';

import * as decoding from 'lib0/decoding';
import { Server as SocketServer } from 'socket.io';
import * as Y from 'yjs';

import { PLAN_NAMESPACE } from '@rampart/collab/sync/events';
import { MAX_PACKET_BYTES } from '@rampart/collab/sync/limits';
import { MessageType, SyncStep } from '@rampart/collab/sync/message-type';
import { fromWire } from '@rampart/collab/sync/wire-codec';

import { attachCollab, type CollabRelay } from '../../server/collab/attach-collab';
import { openDatabase } from '../../server/data-access/data-source';
import { silentLogger } from '../../server/logger';
import { attachBareRelay } from './bare-relay';
import { benchNow } from './collab-client-protocol';

/**
 * The send time a benchmark client stamped into an update frame (`bench` map value, a
 * `benchNow()` reading), or null for any other message.
 */
function sendStamp(payload: unknown): number | null {
  const wire = fromWire(payload);
  if (!wire.ok) return null;
  const bytes = wire.bytes;
  if (bytes[0] !== MessageType.Sync || bytes[1] !== SyncStep.Update) return null;
  try {
    const d = decoding.createDecoder(bytes);
    decoding.readVarUint(d);
    decoding.readVarUint(d);
    for (const s of Y.decodeUpdate(decoding.readVarUint8Array(d)).structs) {
      if (!(s instanceof Y.Item) || !(s.content instanceof Y.ContentAny)) continue;
      const value: unknown = s.content.arr[0];
      // Stamps are epoch milliseconds; anything smaller is not one.
      if (typeof value === 'number' && value > 1e12) return value;
    }
  } catch {
    // A message the relay rejected: not a probe.
  }
  return null;
}

async function main(): Promise<void> {
  const mode = process.env['MODE'] === 'bare' ? 'bare' : 'full';
  const httpServer = createServer();
  const io = new SocketServer(httpServer, {
    serveClient: false,
    maxHttpBufferSize: MAX_PACKET_BYTES,
  });
  let relay: CollabRelay | null = null;
  if (mode === 'full') {
    const { dataSource } = await openDatabase(process.env['DATABASE_URL']!);
    relay = attachCollab(io, {
      dataSource,
      log: silentLogger,
      // Benchmark users: ids starting with "v" watch, everyone else edits.
      authorize: async (userId) => (userId.startsWith('v') ? 'viewer' : 'editor'),
      authenticate: (req) => {
        const user = new URL(req.url ?? '/', 'http://localhost').searchParams.get('testUser');
        return user ? { id: user, name: user } : null;
      },
      // Presence at 1 Hz from 500 clients and 10 edits/s per writer stay within the limits.
      options: { roomCloseDelayMs: 60_000 },
    });
  } else {
    attachBareRelay(io);
  }
  // Time spent synchronously in the relay's `plan:sync` handler, per message: decode, checks,
  // apply and the broadcast to the room (the relay emits in the same tick; the COMMIT and the
  // sender's ack come later and are not counted). This listener runs after the relay's own
  // connection listener, so it can wrap the handler the relay just registered.
  const handler = createHistogram();
  const inbound = createHistogram();
  io.of(PLAN_NAMESPACE).on('connection', (socket) => {
    for (const relayHandler of socket.listeners('plan:sync')) {
      socket.off('plan:sync', relayHandler);
      socket.on('plan:sync', (...args: unknown[]) => {
        const entry = benchNow();
        const t = performance.now();
        (relayHandler as (...a: unknown[]) => void)(...args);
        handler.record(Math.max(1, Math.round((performance.now() - t) * 1000)));
        // Outside the timed part: the benchmark's send stamp, to split client → server time.
        const stamp = sendStamp(args[1]);
        if (stamp !== null) inbound.record(Math.max(1, Math.round((entry - stamp) * 1000)));
      });
    }
  });
  await new Promise<void>((r) => httpServer.listen(0, '127.0.0.1', () => r()));
  const loop = monitorEventLoopDelay({ resolution: 10 });
  loop.enable();
  let cpu = process.cpuUsage();
  let wall = performance.now();
  const lines = createInterface({ input: process.stdin });
  lines.on('line', (line) => {
    if (line === 'reset') {
      loop.reset();
      handler.reset();
      inbound.reset();
      cpu = process.cpuUsage();
      wall = performance.now();
    }
    const used = process.cpuUsage(cpu);
    const mem = process.memoryUsage();
    const stats = {
      cpuCores: (used.user + used.system) / 1000 / (performance.now() - wall),
      loopP50Ms: loop.percentile(50) / 1e6,
      loopP99Ms: loop.percentile(99) / 1e6,
      loopMaxMs: loop.max / 1e6,
      syncHandlerP50Ms: handler.count ? handler.percentile(50) / 1000 : 0,
      syncHandlerP99Ms: handler.count ? handler.percentile(99) / 1000 : 0,
      syncMessages: handler.count,
      inboundP50Ms: inbound.count ? inbound.percentile(50) / 1000 : 0,
      inboundP99Ms: inbound.count ? inbound.percentile(99) / 1000 : 0,
      rssMb: mem.rss / 1e6,
      heapMb: mem.heapUsed / 1e6,
      rooms: relay?.registry.size ?? 0,
    };
    process.stdout.write(`STATS ${JSON.stringify(stats)}\n`);
  });
  process.stdout.write(`READY ${(httpServer.address() as AddressInfo).port}\n`);
  process.once('SIGTERM', () => {
    void new Promise<void>((r) => io.close(() => r()))
      .then(() => relay?.close())
      .then(() => process.exit(0));
  });
}

main().catch((err: unknown) => {
  process.stderr.write(`bench server failed: ${String(err)}\n`);
  process.exit(1);
});
