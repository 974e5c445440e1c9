import type { Stats } from './bench-server-process';
import type { MachineCpu } from './collab-machine-cpu';

/** Percentiles of one set of latency samples (ms). */
export interface Summary {
  p50: number;
  p99: number;
  n: number;
}

/** CPU of the client workers over one scenario, in cores. */
export interface ClientCpu {
  sum: number;
  max: number;
}

interface EditorsFigures {
  latency: Summary;
  ack: Summary;
  editsPerSecond: number;
  stats: Stats;
  clients: ClientCpu;
  parent: number;
  machine: MachineCpu | null;
}

interface FanOutFigures {
  decoded: Summary;
  arrival: Summary;
  all: Summary;
  probes: number;
  decoders: number;
  incomplete: number;
  stats: Stats;
  clients: ClientCpu;
  parent: number;
  machine: MachineCpu | null;
}

/** Everything one `npm run bench:collab` run measured. */
export interface Report {
  header: {
    cores: number;
    workers: number;
    decodeEvery: number;
    loadAtStart: number[];
    clock: { skewMs: number; uncertaintyMs: number };
  };
  loadAtEnd: number[];
  sizes: {
    editors: number;
    rooms: number;
    observers: number;
    presence: number;
    openRooms: number;
    logUpdates: number;
  };
  commits: Summary;
  bareEditors: EditorsFigures;
  fullEditors: EditorsFigures;
  bareFan: FanOutFigures;
  fullFan: FanOutFigures;
  fullPresence: { stats: Stats; clients: ClientCpu };
  rooms: { before: Stats; after: Stats };
  log: { beforeMs: number; compactMs: number; afterMs: number; stateBytes: number; merged: number };
}

const ms = (v: number) => `${v.toFixed(2)} ms`;
const pp = (s: Summary) => `p50 ${ms(s.p50)}  p99 ${ms(s.p99)}`;
const load = (l: number[]) => l.map((v) => v.toFixed(2)).join(' ');
const cpu = (c: ClientCpu, parent?: number) =>
  `${c.sum.toFixed(2)} cores (busiest ${c.max.toFixed(2)})` +
  (parent === undefined ? '' : ` + bench ${parent.toFixed(2)}`);

const handler = (full: Stats, bare: Stats) =>
  `p50 ${ms(full.syncHandlerP50Ms)} p99 ${ms(full.syncHandlerP99Ms)} (${full.syncMessages}); ` +
  `p50 ${ms(bare.syncHandlerP50Ms)} p99 ${ms(bare.syncHandlerP99Ms)} (${bare.syncMessages})`;

const inbound = (full: Stats, bare: Stats) =>
  `p50 ${ms(full.inboundP50Ms)} p99 ${ms(full.inboundP99Ms)}; ` +
  `p50 ${ms(bare.inboundP50Ms)} p99 ${ms(bare.inboundP99Ms)}`;

const machine = (m: MachineCpu | null) =>
  m
    ? `${m.machineCores.toFixed(2)} cores busy, PostgreSQL ${m.postgresCores.toFixed(2)}`
    : 'n/a (no /proc)';

function line(label: string, value: string, target = ''): void {
  console.log(`${label.padEnd(58)} ${value.padEnd(40)} ${target}`);
}

/** Prints the figures of one run, the bare relay beside the full one. */
export function printReport(r: Report): void {
  const { header: h, sizes: n } = r;
  console.log(
    `collab bench: ${h.cores} cores, Node ${process.version}; each server, PostgreSQL and ` +
      `${h.workers} client workers in their own processes; load average ${load(h.loadAtStart)} ` +
      `at start, ${load(r.loadAtEnd)} at end`,
  );
  console.log(
    `clocks: workers agree with this process within ${ms(h.clock.skewMs)} ` +
      `(± ${ms(h.clock.uncertaintyMs)}, best IPC round trip)`,
  );
  console.log('');
  line('PostgreSQL alone: append + COMMIT of one update', pp(r.commits));
  const fe = r.fullEditors;
  const be = r.bareEditors;
  line(
    `${n.editors} editors / ${n.rooms} rooms, edit → remote apply (full)`,
    pp(fe.latency),
    'target p99 ≤ 15 ms',
  );
  line('  same, bare relay', pp(be.latency));
  line(
    '  overhead ratio full / bare (p50, p99)',
    `${(fe.latency.p50 / be.latency.p50).toFixed(2)}×  ${(fe.latency.p99 / be.latency.p99).toFixed(2)}×`,
  );
  line('  edit → durable ack (full)', pp(fe.ack));
  line(
    '  edits stored per second (full)',
    `${fe.editsPerSecond.toFixed(0)} /s (${fe.latency.n} applies)`,
  );
  line(
    '  server CPU / event-loop delay p99 (full, bare)',
    `${fe.stats.cpuCores.toFixed(2)} / ${ms(fe.stats.loopP99Ms)}; ` +
      `${be.stats.cpuCores.toFixed(2)} / ${ms(be.stats.loopP99Ms)}`,
  );
  line('  client send → server handler start (full, bare)', inbound(fe.stats, be.stats));
  line('  server plan:sync handler per message (full, bare)', handler(fe.stats, be.stats));
  line('  client workers CPU (full; all editors decode)', cpu(fe.clients, fe.parent));
  line('  whole machine (full; bare)', `${machine(fe.machine)}; ${machine(be.machine)}`);
  const ff = r.fullFan;
  const bf = r.bareFan;
  const who = `${ff.decoders} of ${n.observers} decode`;
  line(`1 writer → ${n.observers} read-only observers (full)`, pp(ff.all), 'target p99 ≤ 50 ms');
  line(`  decoding observers (${ff.decoders}; stamp in the update)`, pp(ff.decoded));
  line(`  arrival-only observers (${n.observers - ff.decoders}; k-th frame)`, pp(ff.arrival));
  line('  same, bare relay (all observers)', pp(bf.all));
  line(
    '  overhead ratio full / bare (p50, p99)',
    `${(ff.all.p50 / bf.all.p50).toFixed(2)}×  ${(ff.all.p99 / bf.all.p99).toFixed(2)}×`,
  );
  line(
    '  probes sent; observers missing a probe (full, bare)',
    `${ff.probes}; ${ff.incomplete}, ${bf.incomplete}`,
  );
  line(
    '  server CPU / event-loop delay p99 (full, bare)',
    `${ff.stats.cpuCores.toFixed(2)} / ${ms(ff.stats.loopP99Ms)}; ` +
      `${bf.stats.cpuCores.toFixed(2)} / ${ms(bf.stats.loopP99Ms)}`,
  );
  line('  writer send → server handler start (full, bare)', inbound(ff.stats, bf.stats));
  line('  server plan:sync handler per message (full, bare)', handler(ff.stats, bf.stats));
  line(`  client workers CPU (full; ${who})`, cpu(ff.clients, ff.parent));
  line('  whole machine (full; bare)', `${machine(ff.machine)}; ${machine(bf.machine)}`);
  const ps = r.fullPresence;
  line(
    `${n.presence} clients sending presence at 1 Hz: server CPU`,
    `${ps.stats.cpuCores.toFixed(2)} cores (loop p99 ${ms(ps.stats.loopP99Ms)})`,
    'target < 0.5 core',
  );
  line('  client workers CPU (all decode presence)', cpu(ps.clients));
  const { before, after } = r.rooms;
  line(
    `${n.openRooms} open rooms (demo plan each): server RSS`,
    `${after.rssMb.toFixed(0)} MB (${after.rooms} rooms; ${(((after.rssMb - before.rssMb) * 1000) / n.openRooms).toFixed(0)} kB/room)`,
    'target < 500 MB',
  );
  line(`plan with ${n.logUpdates} logged updates: load before compaction`, ms(r.log.beforeMs));
  line('  compaction', `${ms(r.log.compactMs)} (${r.log.merged} rows → ${r.log.stateBytes} bytes)`);
  line('  load after compaction (median of 5)', ms(r.log.afterMs), 'target ≤ 200 ms');
}
