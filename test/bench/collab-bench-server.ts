/**
 * The server side of `npm run bench:collab`, in its own process so its CPU, memory and event
 * loop are measured apart from the thousands of benchmark clients. `full` = the real relay
 * (PostgreSQL, roles, limits); `bare` = the comparison relay. Prints `READY <port>`; answers
 * `stats` / `reset` lines on stdin with `STATS {json}`.
 * Environment: MODE (full|bare), DATABASE_URL (full).
 */
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { createInterface } from 'node:readline';

import { Server as SocketServer } from 'socket.io';

import { MAX_PACKET_BYTES } from '@rampart/collab/sync/limits';

import { attachCollab, type CollabRelay } from '../../server/collab/attach-collab';
import { openDatabase } from '../../server/data-access/data-source';
import { silentLogger } from '../../server/logger';
import { attachBareRelay } from './bare-relay';

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
  await new Promise<void>((r) => httpServer.listen(0, '127.0.0.1', () => r()));
  const loop = monitorEventLoopDelay({ resolution: 10 });
  loop.enable();
  let cpu = process.cpuUsage();
  let wall = performance.now();
  const lines = createInterface({ input: process.stdin });
  lines.on('line', (line) => {
    if (line === 'reset') {
      loop.reset();
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
