/**
 * Engine benchmark, side by side with ngspice on the same networks (`npm run bench:engine`).
 * Prints figures and ratios; it asserts nothing (speed targets are read, not enforced).
 *
 * 1. One transient of a 10-net plan with 2 000 output points (target ≤ 2 ms).
 * 2. Monte Carlo of a 10-part plan (target: 10 000 runs ≤ 2 s on one core, ≥ 10× ngspice).
 *    Rampart path measured: the `sim/` transient simulator through its compiled form (one
 *    compile, values swapped per run) plus requirement evaluation — no closed-form shortcut.
 *    ngspice runs fewer samples in one process (`.control` loop of `alter` + `tran`), and the
 *    per-run time is extrapolated; process start-up is measured separately and excluded.
 *
 * Env: BENCH_MC_RUNS (default 10000), BENCH_SPICE_RUNS (default 100).
 */
import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createEngineSimulator } from '@rampart/collab/engine/analysis/engine-simulator';
import { planMonteCarloChunk } from '@rampart/collab/engine/analysis/plan-monte-carlo';
import { preparePlan, valuesAt } from '@rampart/collab/engine/analysis/plan-runner';
import { drawRun } from '@rampart/collab/engine/analysis/seeded-draws';
import { buildNetlist } from '@rampart/collab/engine/plan/to-netlist';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import type { Plan } from '@rampart/collab/engine/plan/plan-schema';
import { compile } from '@rampart/collab/engine/sim/simulate';
import { toSpice } from '../utils/ngspice';

const MC_RUNS = Number(process.env['BENCH_MC_RUNS'] ?? 10000);
const SPICE_RUNS = Number(process.env['BENCH_SPICE_RUNS'] ?? 100);

/**
 * An RC ladder from the input ramp: `stages` R/C pairs, then either a Shockley clamp to 3.3 V
 * or a toleranced load resistor on the last node.
 */
function ladderPlan(stages: number, withClamp: boolean): Plan {
  const nets = [{ id: 'vin' }, ...Array.from({ length: stages }, (_, i) => ({ id: `n${i + 1}` }))];
  const parts: Array<Record<string, unknown>> = [
    { id: 'VIN', kind: 'vsource', role: 'input', pos: 'vin', neg: '0', value: 5 },
  ];
  for (let i = 1; i <= stages; i++) {
    parts.push({
      id: `R${i}`,
      kind: 'resistor',
      a: i === 1 ? 'vin' : `n${i - 1}`,
      b: `n${i}`,
      value: 1000 * i,
      tolerance: { percent: 1, distribution: { kind: 'normal' } },
    });
    parts.push({
      id: `C${i}`,
      kind: 'capacitor',
      a: `n${i}`,
      b: '0',
      value: 1e-7 / i,
      tolerance: { percent: 10 },
    });
  }
  if (withClamp) {
    nets.push({ id: 'clamp' });
    parts.push({ id: 'VCL', kind: 'vsource', pos: 'clamp', neg: '0', value: 3.3 });
    parts.push({
      id: 'D1',
      kind: 'diode',
      anode: `n${stages}`,
      cathode: 'clamp',
      model: { kind: 'shockley', is: 1e-14, n: 1 },
    });
  } else {
    parts.push({
      id: 'RL',
      kind: 'resistor',
      a: `n${stages}`,
      b: '0',
      value: 100e3,
      tolerance: { percent: 1 },
    });
  }
  const last = `n${stages}`;
  return parsePlan({
    schemaVersion: 1,
    name: `ladder ${stages}`,
    nets,
    parts,
    signals: [
      { id: 'vin', kind: 'rail', net: 'vin', nominal: 5, thresholds: { half: 2.5 } },
      { id: 'out', kind: 'enable', net: last, nominal: 5, thresholds: { half: 2.5 } },
    ],
    requirements: [
      {
        id: 'delay',
        kind: 'delay',
        from: { signal: 'vin', level: 'half' },
        to: { signal: 'out', level: 'half' },
        max: 10e-3,
      },
    ],
    scenarios: [{ id: 'up', kind: 'power-up', temperatures: [25] }],
    settings: { duration: 10e-3, outputPoints: 2000 },
  });
}

/** The fastest of `n` runs of `measure` (the least disturbed by other work on the machine). */
async function fastestOf(n: number, measure: () => Promise<number>): Promise<number> {
  let best = Infinity;
  for (let i = 0; i < n; i++) best = Math.min(best, await measure());
  return best;
}

function ngspiceBatch(deck: string): Promise<number> {
  return (async () => {
    const dir = await mkdtemp(join(tmpdir(), 'rampart-bench-'));
    const file = join(dir, 'bench.cir');
    await writeFile(file, deck);
    const t0 = performance.now();
    await new Promise<void>((resolve, reject) =>
      execFile(
        'ngspice',
        ['-b', file],
        { maxBuffer: 64 << 20, timeout: 600_000 },
        (err, stdout, stderr) => {
          // A rejected `alter` only prints an error; fail loudly so the figures stay honest.
          const bad = /^\s*error/im.exec(`${stdout}\n${stderr}`);
          if (err !== null) reject(new Error(`ngspice failed: ${err.message}\n${stderr}`));
          else if (bad !== null) reject(new Error(`ngspice reported: ${stdout}\n${stderr}`));
          else resolve();
        },
      ),
    );
    const ms = performance.now() - t0;
    await rm(dir, { recursive: true, force: true });
    return ms;
  })();
}

/** A deck whose `.control` block runs `tran` once per value set (after `alter`s). */
function controlDeck(base: string, runs: Array<Array<[string, number]>>, tran: string): string {
  const body = base.split('\n').filter((l) => !l.startsWith('.tran'));
  const ctl = ['.control', 'set noaskquit'];
  for (const alters of runs) {
    for (const [name, value] of alters) ctl.push(`alter ${name} = ${value}`);
    ctl.push(`tran ${tran} uic`, 'destroy all');
  }
  ctl.push('quit', '.endc', '.end');
  return [...body, ...ctl].join('\n');
}

const fmt = (ms: number): string => (ms < 10 ? ms.toFixed(3) : ms.toFixed(1));

async function benchTransient(): Promise<void> {
  const plan = ladderPlan(8, true); // vin, n1…n8, clamp = 10 nets
  const prep = preparePlan(plan);
  const c = prep.cases[0];
  const zeros = new Float64Array(prep.parameters.length);
  const netlist = buildNetlist(plan, c, valuesAt(prep, c, zeros, zeros));
  const options = { tStop: c.tStop, outputPoints: 2000, keepSteps: false };
  const compiled = compile(netlist);
  for (let i = 0; i < 20; i++) compiled.run(options);
  const times: number[] = [];
  let steps = 0;
  for (let i = 0; i < 50; i++) {
    const t0 = performance.now();
    steps = compiled.run(options).stats.acceptedSteps;
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const ours = times[times.length >> 1];
  const t0 = performance.now();
  compile(netlist).run(options);
  const cold = performance.now() - t0;
  const { deck } = toSpice(netlist, c.tStop, c.tStop / 1999);
  const tran = `${c.tStop / 1999} ${c.tStop} 0 ${c.tStop / 1999}`;
  const manyTrans = (n: number): string =>
    controlDeck(
      deck,
      Array.from({ length: n }, () => []),
      tran,
    );
  const spiceOne = await fastestOf(3, () => ngspiceBatch(controlDeck(deck, [[]], tran)));
  // Per-tran cost from the difference of two batch sizes, so ngspice's start-up (noisy on a
  // shared machine) cancels out instead of being subtracted as a separate measurement.
  const spiceTen = await fastestOf(3, () => ngspiceBatch(manyTrans(10)));
  const spiceFifty = await fastestOf(3, () => ngspiceBatch(manyTrans(50)));
  const spicePerRun = (spiceFifty - spiceTen) / 40;
  const empty = spiceTen - 10 * spicePerRun;
  console.log(
    '1. transient, 10-net plan (8-stage RC ladder + Shockley clamp), 2 000 output points',
  );
  console.log(
    `   rampart: ${fmt(ours)} ms median of 50 warm runs (${steps} accepted steps); first run incl. compile ${fmt(cold)} ms (target ≤ 2 ms)`,
  );
  console.log(
    `   ngspice: ${fmt(spicePerRun)} ms per tran ((50 − 10 trans in one process) / 40, fastest of 3 each; start-up ≈ ${fmt(empty)} ms); one whole invocation ${fmt(spiceOne)} ms`,
  );
  console.log(`   ratio ngspice / rampart: ${(spicePerRun / ours).toFixed(2)}×`);
}

async function benchMonteCarlo(): Promise<void> {
  const ten = ladderPlan(4, false); // VIN, R1…R4, C1…C4, RL: 10 parts, 9 toleranced
  const prep = preparePlan(ten);
  const c = prep.cases[0];
  const simulate = createEngineSimulator();
  planMonteCarloChunk(prep, simulate, { runs: 50, seed: 1 });
  const t0 = performance.now();
  const chunk = planMonteCarloChunk(prep, simulate, { runs: MC_RUNS, seed: 7 });
  const ours = performance.now() - t0;
  let finite = 0;
  for (let i = 0; i < chunk.end; i++) if (Number.isFinite(chunk.samples[i * chunk.slots])) finite++;
  const alterSets: Array<Array<[string, number]>> = [];
  for (let run = 0; run < SPICE_RUNS; run++) {
    const { x, y } = drawRun(prep.parameters, 7, run);
    const values = valuesAt(prep, c, x, y);
    const netlist = buildNetlist(ten, c, values);
    const { deck } = toSpice(netlist, c.tStop, c.tStop / 1999);
    const names = new Map(
      deck
        .split('\n')
        .map((l) => [l.split(' ')[0].replace(/^[RC]\d+_/, ''), l.split(' ')[0]] as const),
    );
    alterSets.push(
      prep.parameters.map(
        (p) => [names.get(p.id) ?? p.id, values.get(p.id) ?? p.nominal] as [string, number],
      ),
    );
  }
  const zeros = new Float64Array(prep.parameters.length);
  const { deck } = toSpice(
    buildNetlist(ten, c, valuesAt(prep, c, zeros, zeros)),
    c.tStop,
    c.tStop / 1999,
  );
  const empty = await fastestOf(3, () =>
    ngspiceBatch(['* empty', 'R1 1 0 1', '.control', 'quit', '.endc', '.end'].join('\n')),
  );
  const spice = await ngspiceBatch(
    controlDeck(deck, alterSets, `${c.tStop / 1999} ${c.tStop} 0 ${c.tStop / 1999}`),
  );
  const spicePerRun = (spice - empty) / SPICE_RUNS;
  const oursPerRun = ours / MC_RUNS;
  // Steps of one run as Monte Carlo takes it: the nominal run's peaks as tolerance scale.
  const nominalNetlist = buildNetlist(ten, c, valuesAt(prep, c, zeros, zeros));
  const compiledTen = compile(nominalNetlist);
  const runOptions = { tStop: c.tStop, outputPoints: 2 };
  const nominal = compiledTen.run(runOptions);
  const scaled = compiledTen.run({ ...runOptions, toleranceScale: nominal.peaks });
  console.log(
    `2. Monte Carlo, ${ten.parts.length}-part plan (${prep.parameters.length} toleranced; 4-stage RC ladder + load), one core`,
  );
  console.log(
    `   rampart: ${MC_RUNS} runs in ${fmt(ours)} ms (${(oursPerRun * 1000).toFixed(1)} µs/run, ${finite} measured; target 10 000 runs ≤ 2 000 ms → ${fmt(oursPerRun * 10000)} ms per 10 000)`,
  );
  console.log(
    `   steps per run: ${scaled.stats.acceptedSteps} accepted (${nominal.stats.acceptedSteps} without the nominal peaks as tolerance scale)`,
  );
  console.log(
    `   ngspice: ${SPICE_RUNS} runs in ${fmt(spice)} ms (one process, alter + tran; start-up ${fmt(empty)} ms excluded) → ${fmt(spicePerRun * 10000)} ms per 10 000 (extrapolated)`,
  );
  console.log(
    `   ratio ngspice / rampart: ${(spicePerRun / oursPerRun).toFixed(2)}× (target ≥ 10×)`,
  );
}

async function mainBench(): Promise<void> {
  console.log(`engine benchmark — node ${process.version}, ${new Date().toISOString()}`);
  await benchTransient();
  await benchMonteCarlo();
}

mainBench().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
