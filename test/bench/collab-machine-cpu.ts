import { readdirSync, readFileSync } from 'node:fs';

/** Clock ticks per second of `/proc` CPU times (USER_HZ; 100 on Linux builds in practice). */
const TICKS_PER_SECOND = 100;

interface Sample {
  wallMs: number;
  /** Busy ticks of the whole machine (every core). */
  machineBusy: number;
  /** CPU ticks of each PostgreSQL process, by pid. */
  postgres: Map<string, number>;
}

function machineBusyTicks(): number {
  // First line of /proc/stat: cpu user nice system idle iowait irq softirq steal …
  const fields = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).slice(1);
  const [user, nice, system, , , irq, softirq, steal] = fields.map(Number);
  return user! + nice! + system! + irq! + softirq! + (steal ?? 0);
}

function postgresTicks(): Map<string, number> {
  const ticks = new Map<string, number>();
  for (const pid of readdirSync('/proc')) {
    if (!/^\d+$/.test(pid)) continue;
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const close = stat.lastIndexOf(')');
      if (!stat.slice(stat.indexOf('(') + 1, close).startsWith('postgres')) continue;
      // After "pid (comm) ": state is field 3; utime and stime are fields 14 and 15.
      const rest = stat.slice(close + 2).split(' ');
      ticks.set(pid, Number(rest[11]) + Number(rest[12]));
    } catch {
      // The process ended while we looked.
    }
  }
  return ticks;
}

/** Ticks PostgreSQL used between two samples: processes that ended in between are lost. */
function postgresDelta(start: Map<string, number>, end: Map<string, number>): number {
  let total = 0;
  for (const [pid, ticks] of end) total += ticks - (start.get(pid) ?? 0);
  return total;
}

function sample(): Sample | null {
  try {
    return {
      wallMs: performance.now(),
      machineBusy: machineBusyTicks(),
      postgres: postgresTicks(),
    };
  } catch {
    return null; // not Linux: figures unavailable
  }
}

/** CPU of the whole machine and of PostgreSQL over one scenario, in cores (null off Linux). */
export interface MachineCpu {
  machineCores: number;
  postgresCores: number;
}

/**
 * Starts measuring; the returned function gives the machine-wide and PostgreSQL CPU since then.
 * PostgreSQL means every process named postgres on the machine (other clusters included);
 * backends that ended during the interval are missed (their ticks vanish from /proc).
 */
export function machineCpuMeter(): () => MachineCpu | null {
  const start = sample();
  return () => {
    const end = sample();
    if (!start || !end) return null;
    const seconds = (end.wallMs - start.wallMs) / 1000;
    return {
      machineCores: (end.machineBusy - start.machineBusy) / TICKS_PER_SECOND / seconds,
      postgresCores: postgresDelta(start.postgres, end.postgres) / TICKS_PER_SECOND / seconds,
    };
  };
}
