/**
 * Quick speed figures of the transient simulator (not a test; prints numbers only):
 *   npx tsx --tsconfig tsconfig.server.json test/bench/sim-quick.ts
 * 1. the motor-drive board plan, one transient with 2 000 output points (simulate: validate,
 *    compile, run);
 * 2. the same plan compiled once and re-run with perturbed values (the Monte Carlo path),
 *    keepSteps off and three probes, as the analysis layer would call it.
 */
import type { Element, Netlist } from '@rampart/collab/engine/netlist';
import { compile, simulate } from '@rampart/collab/engine/sim/simulate';
import { randomLcg, randomNormal } from 'd3-random';
import {
  MOTOR_DRIVE_BOARD,
  MOTOR_DRIVE_T_STOP,
} from '../collab/engine/sim/fixtures/motor-drive-board';

/** Runs fn `runs` times and prints min and median per run (the machine is shared). */
function timeIt(label: string, runs: number, fn: (i: number) => void): void {
  for (let i = 0; i < Math.min(50, runs); i++) fn(i); // warm-up for the JIT
  const each: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn(i);
    each.push(performance.now() - t0);
  }
  each.sort((a, b) => a - b);
  const median = each[Math.floor(runs / 2)];
  console.log(
    `${label}: min ${each[0].toFixed(3)} ms, median ${median.toFixed(3)} ms (${runs} runs)`,
  );
}

/** A copy of the board with resistors and capacitors drawn ±5 % (σ = 1/3 of that, seed 42). */
function perturbed(draw: () => number): Netlist {
  const elements = MOTOR_DRIVE_BOARD.elements.map((el): Element => {
    if (el.kind === 'resistor') return { ...el, ohms: el.ohms * (1 + 0.05 * draw()) };
    if (el.kind === 'capacitor') return { ...el, farads: el.farads * (1 + 0.05 * draw()) };
    return el;
  });
  return { ...MOTOR_DRIVE_BOARD, elements };
}

const nets = compile(MOTOR_DRIVE_BOARD).nets.length - 1;
const one = simulate(MOTOR_DRIVE_BOARD, { tStop: MOTOR_DRIVE_T_STOP, outputPoints: 2000 });
console.log(`motor-drive board: ${nets} nets, ${MOTOR_DRIVE_BOARD.elements.length} elements`);
console.log('stats of one run:', one.stats);
timeIt('simulate, 2000 output points, steps kept', 300, () => {
  simulate(MOTOR_DRIVE_BOARD, { tStop: MOTOR_DRIVE_T_STOP, outputPoints: 2000 });
});

const compiled = compile(MOTOR_DRIVE_BOARD);
const draw = randomNormal.source(randomLcg(42))(0, 1 / 3);
const samples = Array.from({ length: 200 }, () => perturbed(draw));
for (const reltol of [1e-4, 1e-3]) {
  timeIt(`compiled.run, perturbed values, 3 probes, 200 points, reltol ${reltol}`, 1000, (i) => {
    compiled.run(
      {
        tStop: MOTOR_DRIVE_T_STOP,
        outputPoints: 200,
        keepSteps: false,
        probes: ['v33', 'v12', 'rst'],
        reltol,
      },
      samples[i % samples.length],
    );
  });
}
