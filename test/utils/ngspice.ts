/**
 * Runs ngspice (Debian package `ngspice`) in batch mode for reference waveforms, and converts
 * Rampart netlists into SPICE decks for the parts SPICE can express. Node-only; tests and
 * benchmarks use it, never the product code.
 */
import { execFile } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Element, Netlist, NetName, SourceWaveform } from '@rampart/collab/engine/netlist';

export interface SpiceTrace {
  time: Float64Array;
  values: Float64Array;
}

/** Raised when the ngspice executable cannot be started. */
export class NgspiceMissingError extends Error {
  override readonly name = 'NgspiceMissingError';
}

/** Leak of open switch contacts: equal to the simulator's open-output leak (1 GΩ). */
const ROFF = 1e9;

function runBatch(file: string, cwd: string): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile(
      'ngspice',
      ['-b', file],
      { cwd, timeout: 120_000, maxBuffer: 64 << 20 },
      (err, stdout, stderr) => {
        if (err && (err as NodeJS.ErrnoException).code === 'ENOENT') {
          reject(
            new NgspiceMissingError('ngspice is not installed (Debian: apt-get install ngspice)'),
          );
        } else if (err) {
          reject(new Error(`ngspice failed: ${err.message}\n${stderr}\n${stdout}`));
        } else {
          resolve(stdout + stderr);
        }
      },
    );
  });
}

/**
 * Runs `deck` (title line, elements, .options and .tran; no .control or .end) and returns the
 * trace of each probe expression (e.g. `v(n1)`, `i(v1)`), keyed as given.
 */
export async function runNgspice(
  deck: string,
  probes: string[],
): Promise<Record<string, SpiceTrace>> {
  const dir = await mkdtemp(join(tmpdir(), 'rampart-ngspice-'));
  try {
    const body = deck.replace(/^\s*\.end\s*$/im, '');
    const control = [
      '.control',
      'set wr_singlescale',
      'set wr_vecnames',
      'run',
      `wrdata out.txt ${probes.join(' ')}`,
      // Without an explicit quit, batch mode exits 1 ("no simulations run" for the deck part).
      'quit 0',
      '.endc',
      '.end',
      '',
    ].join('\n');
    await writeFile(join(dir, 'deck.cir'), `${body.trimEnd()}\n${control}`);
    const log = await runBatch('deck.cir', dir);
    const text = await readFile(join(dir, 'out.txt'), 'utf8').catch(() => {
      throw new Error(`ngspice wrote no output; log:\n${log}`);
    });
    return parseWrdata(text, probes);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

function parseWrdata(text: string, probes: string[]): Record<string, SpiceTrace> {
  const lines = text.split('\n').filter((l) => l.trim() !== '');
  const rows = lines.slice(1).map((l) => l.trim().split(/\s+/).map(Number));
  const time = Float64Array.from(rows, (r) => r[0]);
  const out: Record<string, SpiceTrace> = {};
  probes.forEach((p, i) => {
    out[p] = { time, values: Float64Array.from(rows, (r) => r[i + 1]) };
  });
  return out;
}

/** A deck plus the SPICE node name of every Rampart net. */
export interface SpiceDeck {
  deck: string;
  node: Record<NetName, string>;
}

function waveText(w: SourceWaveform, tStop: number): string {
  switch (w.kind) {
    case 'dc':
      return `DC ${w.value}`;
    case 'step': {
      // SPICE has no ideal step: a 1e-9·tStop edge stands in for it.
      const edge = tStop * 1e-9;
      return w.t0 > 0
        ? `PWL(0 ${w.v0} ${w.t0} ${w.v0} ${w.t0 + edge} ${w.v1})`
        : `PWL(0 ${w.v0} ${edge} ${w.v1})`;
    }
    case 'ramp':
      return w.t0 > 0
        ? `PWL(0 ${w.v0} ${w.t0} ${w.v0} ${w.t0 + w.rise} ${w.v1})`
        : `PWL(0 ${w.v0} ${w.rise} ${w.v1})`;
    case 'pwl':
      return `PWL(${w.points.map(([t, v]) => `${t} ${v}`).join(' ')})`;
    case 'exp':
      return `EXP(${w.v0} ${w.v1} ${w.t0} ${w.tau} ${tStop * 10} ${w.tau})`;
  }
}

function elementLines(
  el: Element,
  i: number,
  n: (net: NetName) => string,
  tStop: number,
): string[] {
  const name = `${i}_${el.id.replace(/[^A-Za-z0-9_]/g, '_')}`;
  switch (el.kind) {
    case 'resistor':
      return [`R${name} ${n(el.a)} ${n(el.b)} ${el.ohms}`];
    case 'capacitor':
      return [`C${name} ${n(el.a)} ${n(el.b)} ${el.farads} ic=${el.v0 ?? 0}`];
    case 'inductor':
      return [`L${name} ${n(el.a)} ${n(el.b)} ${el.henries} ic=${el.i0 ?? 0}`];
    case 'isource':
      return [`I${name} ${n(el.from)} ${n(el.to)} ${waveText(el.wave, tStop)}`];
    case 'vsource':
      if (el.rs !== undefined && el.rs > 0) {
        const inner = `x${name}`;
        return [
          `V${name} ${inner} ${n(el.neg)} ${waveText(el.wave, tStop)}`,
          `RS${name} ${n(el.pos)} ${inner} ${el.rs}`,
        ];
      }
      return [`V${name} ${n(el.pos)} ${n(el.neg)} ${waveText(el.wave, tStop)}`];
    case 'diode':
      if (el.model.kind !== 'shockley')
        throw new Error(`diode '${el.id}': only the shockley model maps to SPICE`);
      return [
        `D${name} ${n(el.anode)} ${n(el.cathode)} DM${name}`,
        `.model DM${name} D(IS=${el.model.is} N=${el.model.n})`,
      ];
    case 'comparator':
      return comparatorLines(el, name, n);
    default:
      throw new Error(`${el.kind} '${el.id}' has no SPICE equivalent here`);
  }
}

/**
 * A comparator without delay or power-on region as voltage-controlled switches (ngspice SW:
 * on above vt + vh, off below vt − vh, ngspice manual "Switches"): low side on while the
 * decision is low, high side (push-pull) on while it is high.
 */
function comparatorLines(
  el: Extract<Element, { kind: 'comparator' }>,
  name: string,
  n: (net: NetName) => string,
): string[] {
  if (el.delay !== 0 || el.vmin > 0) {
    throw new Error(`comparator '${el.id}': only delay 0 and vmin ≤ 0 map to SPICE switches`);
  }
  const vh = el.hysteresis / 2;
  const lines = [
    `SL${name} ${n(el.out)} ${n(el.gnd)} ${n(el.inN)} ${n(el.inP)} SWL${name}`,
    `.model SWL${name} SW(VT=${-el.threshold} VH=${vh} RON=${el.rout} ROFF=${ROFF})`,
  ];
  if (el.output === 'push-pull') {
    lines.push(
      `SH${name} ${n(el.supply)} ${n(el.out)} ${n(el.inP)} ${n(el.inN)} SWH${name}`,
      `.model SWH${name} SW(VT=${el.threshold} VH=${vh} RON=${el.rout} ROFF=1e15)`,
    );
  }
  return lines;
}

/**
 * Converts `netlist` to an ngspice deck for `.tran step tStop` with UIC (initial conditions
 * from capacitor v0 / inductor i0, like the Rampart simulator) and tight tolerances so the
 * reference is far more accurate than the 0.1 % comparisons made against it.
 */
export function toSpice(netlist: Netlist, tStop: number, step: number): SpiceDeck {
  const node: Record<NetName, string> = { '0': '0' };
  const n = (net: NetName): string => {
    if (!(net in node)) node[net] = `n${Object.keys(node).length}`;
    return node[net];
  };
  const temp = netlist.temperature ?? 25;
  const lines = ['* rampart reference deck'];
  netlist.elements.forEach((el, i) => lines.push(...elementLines(el, i, n, tStop)));
  lines.push(
    `.options reltol=1e-6 abstol=1e-13 vntol=1e-9 chgtol=1e-16 temp=${temp} tnom=${temp}`,
    `.tran ${step} ${tStop} 0 ${step} uic`,
  );
  return { deck: lines.join('\n'), node };
}

/** Convenience: simulates `netlist` in ngspice and returns the voltage traces of `nets`. */
export async function ngspiceVoltages(
  netlist: Netlist,
  tStop: number,
  step: number,
  nets: NetName[],
): Promise<Record<NetName, SpiceTrace>> {
  const { deck, node } = toSpice(netlist, tStop, step);
  const probes = nets.map((net) => `v(${node[net] ?? net})`);
  const traces = await runNgspice(deck, probes);
  const out: Record<NetName, SpiceTrace> = {};
  nets.forEach((net, i) => {
    out[net] = traces[probes[i]];
  });
  return out;
}
