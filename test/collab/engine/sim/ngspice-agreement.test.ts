/**
 * The simulator against ngspice (Debian package, run in batch mode inside the test) on
 * networks SPICE can express: waveforms agree within 0.1 % of full scale on a common grid and
 * crossing times within 0.1 %. ngspice runs with reltol 1e-6 and maxstep tStop/20000, so its
 * own error is far below the tolerance.
 */
import type { Netlist } from '@rampart/collab/engine/netlist';
import { findCrossings } from '@rampart/collab/engine/sim/crossings';
import { simulate } from '@rampart/collab/engine/sim/simulate';
import { fullScale, maxDifference } from '../../../utils/asserts';
import { ngspiceVoltages } from '../../../utils/ngspice';
import { REFERENCE_NETWORKS } from './fixtures/reference-networks';

const GRID_POINTS = 4001;

function stepTimes(netlist: Netlist): number[] {
  return netlist.elements.flatMap((el) =>
    (el.kind === 'vsource' || el.kind === 'isource') && el.wave.kind === 'step' ? [el.wave.t0] : [],
  );
}
const figures: string[] = [];

afterAll(() => {
  // Agreement figures, quoted in the simulator README.
  console.log(`ngspice agreement:\n${figures.join('\n')}`);
});

describe('simulate vs ngspice', () => {
  it.each(REFERENCE_NETWORKS.map((n) => [n.name, n] as const))(
    'simulate(%s) → waveforms and crossings within 0.1 % of ngspice',
    async (_name, net) => {
      const ours = simulate(net.netlist, { tStop: net.tStop, outputPoints: 2000, ...net.options });
      const spiceStep = net.tStop * (net.spiceStepFraction ?? 1 / 20000);
      const ref = await ngspiceVoltages(net.netlist, net.tStop, spiceStep, net.nets);
      // At an ideal step our waveform jumps while ngspice ramps over a 1e-9·tStop edge: grid
      // points right at the jump are ambiguous and skipped.
      const jumps = stepTimes(net.netlist);
      for (const name of net.nets) {
        const mine = { time: ours.steps!.time, values: ours.steps!.nets[name] };
        const scale = fullScale(ref[name]);
        const { max, at } = maxDifference(
          mine,
          ref[name],
          0,
          net.tStop,
          GRID_POINTS,
          jumps,
          net.tStop * 1e-6,
        );
        figures.push(
          `  ${net.name} / ${name}: max |Δv| ${((100 * max) / scale).toFixed(4)} % of ${scale.toFixed(3)} V (at ${at.toExponential(3)} s)`,
        );
        expect(max / scale).toBeLessThanOrEqual(1e-3);
      }
      for (const c of net.crossings) {
        const until = c.until ?? Infinity;
        const mine = findCrossings(
          { time: ours.steps!.time, values: ours.steps!.nets[c.net] },
          c.level,
          c.direction,
        ).filter((x) => x.t <= until);
        const theirs = findCrossings(ref[c.net], c.level, c.direction).filter((x) => x.t <= until);
        expect(mine.length).toBeGreaterThan(0);
        expect(mine.length).toBe(theirs.length);
        mine.forEach((m, i) => {
          const rel = Math.abs(m.t - theirs[i].t) / theirs[i].t;
          figures.push(
            `  ${net.name} / ${c.net} ${c.direction} ${c.level} V #${i}: ${m.t.toExponential(6)} s vs ${theirs[i].t.toExponential(6)} s (${(rel * 100).toFixed(5)} %)`,
          );
          expect(rel).toBeLessThanOrEqual(1e-3);
        });
      }
    },
    60_000,
  );
});
