import {
  capResDividerResponse,
  capResDividerStep,
  rcDelayToThreshold,
  rcRampResponse,
  rcStepResponse,
} from '@rampart/collab/engine/analysis/closed-form';
import { crossingTimes } from '@rampart/collab/engine/analysis/waveform-ops';
import type { Netlist, SourceWaveform } from '@rampart/collab/engine/netlist';
import { simulate } from '@rampart/collab/engine/sim/simulate';

/** Largest |sim − closed form| over the output points, as a fraction of full scale. */
function worstError(
  time: Float64Array,
  values: Float64Array,
  f: (t: number) => number,
  fullScale: number,
): number {
  let worst = 0;
  for (let i = 0; i < time.length; i++) worst = Math.max(worst, Math.abs(values[i] - f(time[i])));
  return worst / fullScale;
}

/** Source `wave` on net `in`, then R1 to `out` and C1 from `out` to ground. */
function rcNetlist(wave: SourceWaveform, ohms: number, farads: number): Netlist {
  return {
    elements: [
      { kind: 'vsource', id: 'V1', pos: 'in', neg: '0', wave },
      { kind: 'resistor', id: 'R1', a: 'in', b: 'out', ohms },
      { kind: 'capacitor', id: 'C1', a: 'out', b: '0', farads },
    ],
  };
}

describe('closed forms beside the simulator', () => {
  it('RC step 5 V, τ = 1 ms → sim within 0.1 % FS of 5(1 − e^(−t/τ)); 63.2 % at τ; 1.2 V at −τ·ln(1 − 1.2/5)', () => {
    const nl = rcNetlist({ kind: 'step', t0: 0, v0: 0, v1: 5 }, 1e3, 1e-6);
    const r = simulate(nl, { tStop: 5e-3, outputPoints: 2001 });
    const out = r.nets['out'];
    expect(worstError(r.time, out, (t) => rcStepResponse(t, 1e-3, 5), 5)).toBeLessThan(1e-3);
    expect(out[400] / 5).toBeCloseTo(0.632, 3); // t = τ (circuit theory: 1 − e^−1)
    const steps = r.steps ?? { time: r.time, nets: r.nets };
    const t12 = crossingTimes({ time: steps.time, values: steps.nets['out'] }, 1.2, 'rise')[0];
    expect(Math.abs(t12 / (rcDelayToThreshold(1e-3, 1.2, 5) ?? 1) - 1)).toBeLessThan(1e-3);
  });

  it('RC driven by a 2 ms ramp to 3.3 V, τ = 0.47 ms → sim within 0.1 % FS of the ramp response', () => {
    const nl = rcNetlist({ kind: 'ramp', t0: 0, rise: 2e-3, v0: 0, v1: 3.3 }, 4.7e3, 1e-7);
    const r = simulate(nl, { tStop: 6e-3, outputPoints: 2001 });
    expect(
      worstError(r.time, r.nets['out'], (t) => rcRampResponse(t, 0.47e-3, 3.3, 2e-3), 3.3),
    ).toBeLessThan(1e-3);
  });

  it('capacitive + resistive divider, 10 V step → jump C1/(C1+C2), final R2/(R1+R2), τ = (R1‖R2)(C1+C2) within 0.1 % FS', () => {
    // R1 100 k ‖ C1 1 nF on top, R2 100 k ‖ C2 3 nF below: jump 2.5 V, final 5 V, τ = 200 µs.
    const nl: Netlist = {
      elements: [
        {
          kind: 'vsource',
          id: 'V1',
          pos: 'in',
          neg: '0',
          wave: { kind: 'step', t0: 0, v0: 0, v1: 10 },
        },
        { kind: 'resistor', id: 'R1', a: 'in', b: 'mid', ohms: 100e3 },
        { kind: 'capacitor', id: 'C1', a: 'in', b: 'mid', farads: 1e-9 },
        { kind: 'resistor', id: 'R2', a: 'mid', b: '0', ohms: 100e3 },
        { kind: 'capacitor', id: 'C2', a: 'mid', b: '0', farads: 3e-9 },
      ],
    };
    const d = capResDividerStep(10, 100e3, 1e-9, 100e3, 3e-9);
    const r = simulate(nl, { tStop: 1.5e-3, outputPoints: 1501 });
    // Skip t = 0 itself: the step is there and the closed form describes t = 0+.
    const time = r.time.subarray(1);
    const values = r.nets['mid'].subarray(1);
    expect(worstError(time, values, (t) => capResDividerResponse(t, d), 10)).toBeLessThan(1e-3);
  });
});
