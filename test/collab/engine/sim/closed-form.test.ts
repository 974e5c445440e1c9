/**
 * The simulator against closed-form circuit theory: first-order RC step and ramp responses,
 * the compensated capacitive/resistive divider and the underdamped series RLC. Formulas are the
 * standard ones of any first course in network analysis (e.g. Hayt & Kemmerly, "Engineering
 * Circuit Analysis", first- and second-order circuits), written here from memory.
 */
import type { Netlist, SampledWaveform } from '@rampart/collab/engine/netlist';
import { findCrossings } from '@rampart/collab/engine/sim/crossings';
import { simulate } from '@rampart/collab/engine/sim/simulate';
import { expectClose, valueAt } from '../../../utils/asserts';

function stepsOf(r: ReturnType<typeof simulate>, net: string): SampledWaveform {
  return { time: r.steps!.time, values: r.steps!.nets[net] };
}

function rcCircuit(wave: Netlist['elements'][number] & { kind: 'vsource' }): Netlist {
  return {
    elements: [
      wave,
      { kind: 'resistor', id: 'R1', a: 'v5', b: 'f', ohms: 4.7e3 },
      { kind: 'capacitor', id: 'C1', a: 'f', b: '0', farads: 220e-9 },
    ],
  };
}
const TAU = 4.7e3 * 220e-9;

describe('RC step response v = V·(1 − e^(−t/τ))', () => {
  const t0 = 1e-4;
  const r = simulate(
    rcCircuit({
      kind: 'vsource',
      id: 'V5',
      pos: 'v5',
      neg: '0',
      wave: { kind: 'step', t0, v0: 0, v1: 5 },
    }),
    { tStop: t0 + 8 * TAU },
  );
  const f = stepsOf(r, 'f');

  it('simulate(RC step) → 63.2 % of the step at t0 + τ', () => {
    // 1 − e^−1 = 0.6321 (closed form).
    expectClose(valueAt(f, t0 + TAU), 5 * (1 - Math.exp(-1)), { abs: 5 * 2e-4 }, 'v(f) at τ');
  });

  it('simulate(RC step) → 10–90 % rise time 2.197·τ', () => {
    // t90 − t10 = τ·ln(9) = 2.197·τ (closed form).
    const t10 = findCrossings(f, 0.5, 'rising')[0].t;
    const t90 = findCrossings(f, 4.5, 'rising')[0].t;
    expectClose(t90 - t10, Math.log(9) * TAU, { rel: 1e-3 }, '10–90 % rise');
    expectClose(t10 - t0, -Math.log(0.9) * TAU, { rel: 1e-3 }, '10 % crossing');
  });

  it('simulate(RC step) → every accepted point within 0.05 % of V·(1 − e^(−t/τ))', () => {
    for (let i = 0; i < f.time.length; i++) {
      const t = f.time[i];
      if (t <= t0) continue;
      expectClose(
        f.values[i],
        5 * (1 - Math.exp(-(t - t0) / TAU)),
        { abs: 5 * 5e-4 },
        `v(f) at ${t}`,
      );
    }
  });
});

// RC ramp: input k·t' for 0 ≤ t' ≤ T (t' = t − t0), then held at k·T. During the ramp
// v = k·(t' − τ·(1 − e^(−t'/τ))); afterwards v relaxes to k·T with time constant τ.
const RAMP = { t0: 2e-4, rise: 3 * TAU, v1: 3.3 };
const rampK = RAMP.v1 / RAMP.rise;
const rampDuring = (tp: number): number => rampK * (tp - TAU * (1 - Math.exp(-tp / TAU)));
function rampExact(t: number): number {
  const tp = t - RAMP.t0;
  if (tp <= 0) return 0;
  if (tp <= RAMP.rise) return rampDuring(tp);
  return RAMP.v1 - (RAMP.v1 - rampDuring(RAMP.rise)) * Math.exp(-(tp - RAMP.rise) / TAU);
}
const rampCircuit = rcCircuit({
  kind: 'vsource',
  id: 'V5',
  pos: 'v5',
  neg: '0',
  wave: { kind: 'ramp', t0: RAMP.t0, rise: RAMP.rise, v0: 0, v1: RAMP.v1 },
});
const rampOptions = { tStop: RAMP.t0 + RAMP.rise + 6 * TAU, outputPoints: 2000 };

describe('RC ramp response', () => {
  const { t0, rise } = RAMP;
  const k = rampK;
  const exact = rampExact;
  const r = simulate(rampCircuit, rampOptions);

  it('simulate(RC ramp) → output grid within 0.05 % of full scale of the closed form', () => {
    for (let i = 0; i < r.time.length; i++) {
      expectClose(r.nets.f[i], exact(r.time[i]), { abs: 3.3 * 5e-4 }, `v(f) at ${r.time[i]}`);
    }
  });

  it('simulate(RC ramp) → lag behind the input approaches k·τ', () => {
    // Steady lag of a first-order system following a ramp is k·τ (closed form).
    const tEnd = t0 + rise;
    expectClose(
      valueAt(r.steps ? stepsOf(r, 'v5') : { time: [], values: [] }, tEnd) -
        valueAt(stepsOf(r, 'f'), tEnd),
      k * TAU * (1 - Math.exp(-rise / TAU)),
      { rel: 2e-3 },
      'lag',
    );
  });
});

describe('RC ramp response with the nominal peaks as tolerance scale (as Monte Carlo runs)', () => {
  const { t0, rise } = RAMP;
  const exact = rampExact;
  const plain = simulate(rampCircuit, rampOptions);
  const scaled = simulate(rampCircuit, { ...rampOptions, toleranceScale: plain.peaks });

  it('simulate(RC ramp) → peaks are the largest |v| of each net', () => {
    expect(plain.peaks.v5).toBe(3.3);
    expectClose(plain.peaks.f, Math.max(...plain.steps!.nets.f), { rel: 1e-12 }, 'peak of f');
  });

  it('simulate(RC ramp, toleranceScale = peaks) → fewer steps, still within 0.05 % of full scale', () => {
    expect(scaled.stats.acceptedSteps).toBeLessThan(plain.stats.acceptedSteps);
    for (let i = 0; i < scaled.time.length; i++) {
      expectClose(scaled.nets.f[i], exact(scaled.time[i]), { abs: 3.3 * 5e-4 }, `v(f) at ${i}`);
    }
    // The crossing of half scale, where a requirement would measure: within 0.1 % of the
    // closed form's, found by bisection on `exact`.
    let lo = t0;
    let hi = t0 + rise + 6 * TAU;
    for (let n = 0; n < 100; n++) {
      const mid = (lo + hi) / 2;
      if (exact(mid) < 1.65) lo = mid;
      else hi = mid;
    }
    const crossing = findCrossings(stepsOf(scaled, 'f'), 1.65, 'rising')[0].t;
    expectClose(crossing - t0, lo - t0, { rel: 1e-3 }, 'half-scale crossing');
  });
});

describe('capacitive and resistive divider', () => {
  const [r1, c1, r2, c2, v] = [100e3, 10e-9, 20e3, 47e-9, 24];
  const t0 = 1e-4;
  const tau = ((r1 * r2) / (r1 + r2)) * (c1 + c2);
  const r = simulate(
    {
      elements: [
        {
          kind: 'vsource',
          id: 'V24',
          pos: 'v24',
          neg: '0',
          wave: { kind: 'step', t0, v0: 0, v1: v },
        },
        { kind: 'resistor', id: 'R1', a: 'v24', b: 'mid', ohms: r1 },
        { kind: 'capacitor', id: 'C1', a: 'v24', b: 'mid', farads: c1 },
        { kind: 'resistor', id: 'R2', a: 'mid', b: '0', ohms: r2 },
        { kind: 'capacitor', id: 'C2', a: 'mid', b: '0', farads: c2 },
      ],
    },
    { tStop: t0 + 10 * tau },
  );
  const mid = stepsOf(r, 'mid');

  it('simulate(step into C/R divider) → jumps to V·C1/(C1+C2) at the step', () => {
    // Charge sharing at the instant of the step; the point after the repeated time is t0+.
    const after = r.steps!.time.findIndex((t, i) => t === t0 && r.steps!.time[i + 1] === t0) + 1;
    expect(after).toBeGreaterThan(0);
    expectClose(mid.values[after], (v * c1) / (c1 + c2), { rel: 1e-6 }, 'v(mid) at t0+');
    expectClose(mid.values[after - 1], 0, { abs: 1e-9 }, 'v(mid) at t0−');
  });

  it('simulate(step into C/R divider) → settles to V·R2/(R1+R2) with τ = (R1‖R2)(C1+C2)', () => {
    const v0 = (v * c1) / (c1 + c2);
    const vInf = (v * r2) / (r1 + r2);
    for (const n of [0.5, 1, 2, 5]) {
      const expected = vInf + (v0 - vInf) * Math.exp(-n);
      expectClose(valueAt(mid, t0 + n * tau), expected, { abs: v * 2e-4 }, `v(mid) at t0 + ${n}τ`);
    }
    expectClose(mid.values[mid.values.length - 1], vInf, { rel: 1e-3 }, 'final value');
  });
});

describe('underdamped series RLC', () => {
  // Step response of series R-L-C across C: ringing at ωd = √(1/LC − (R/2L)²), so successive
  // rising crossings of the final value are 2π/ωd apart (closed form).
  const [res, l, c] = [1, 10e-6, 1e-6];
  const wd = Math.sqrt(1 / (l * c) - (res / (2 * l)) ** 2);
  const r = simulate(
    {
      elements: [
        {
          kind: 'vsource',
          id: 'VIN',
          pos: 'in',
          neg: '0',
          rs: res,
          wave: { kind: 'step', t0: 0, v0: 0, v1: 1 },
        },
        { kind: 'inductor', id: 'L1', a: 'in', b: 'm', henries: l },
        { kind: 'capacitor', id: 'C1', a: 'm', b: '0', farads: c },
      ],
    },
    { tStop: 6e-5, reltol: 1e-5 },
  );

  it('simulate(series RLC step) → rising crossings of 1 V spaced by 2π/ωd', () => {
    const ups = findCrossings(stepsOf(r, 'm'), 1, 'rising');
    expect(ups.length).toBeGreaterThanOrEqual(2);
    expectClose(ups[1].t - ups[0].t, (2 * Math.PI) / wd, { rel: 1e-3 }, 'ringing period');
  });

  it('simulate(series RLC step) → first overshoot peak 1 + e^(−απ/ωd)', () => {
    // Peak at t = π/ωd with value 1 + e^(−α·π/ωd), α = R/2L (closed form).
    const alpha = res / (2 * l);
    const peak = Math.max(...Array.from(stepsOf(r, 'm').values));
    expectClose(peak, 1 + Math.exp((-alpha * Math.PI) / wd), { rel: 5e-4 }, 'overshoot peak');
  });
});
