import {
  capResDividerResponse,
  capResDividerStep,
  rcDelayToThreshold,
  rcRampResponse,
  rcRiseTime1090,
  rcStepResponse,
} from '@rampart/collab/engine/analysis/closed-form';

/** Independent check: RK4 integration of dv/dt = (vin(t) − v)/τ. */
function integrateRc(tau: number, vin: (t: number) => number, tEnd: number, steps: number): number {
  const h = tEnd / steps;
  let v = 0;
  const f = (t: number, x: number): number => (vin(t) - x) / tau;
  for (let i = 0; i < steps; i++) {
    const t = i * h;
    const k1 = f(t, v);
    const k2 = f(t + h / 2, v + (h / 2) * k1);
    const k3 = f(t + h / 2, v + (h / 2) * k2);
    const k4 = f(t + h, v + h * k3);
    v += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
  }
  return v;
}

describe('rcStepResponse', () => {
  it('t = τ → 63.2 % of the final value (1 − e^−1, circuit theory)', () => {
    expect(rcStepResponse(1e-3, 1e-3, 1)).toBeCloseTo(0.632121, 6);
  });

  it('t = 5τ → 99.3 % (1 − e^−5)', () => {
    expect(rcStepResponse(5, 1, 5)).toBeCloseTo(5 * (1 - Math.exp(-5)), 12);
  });

  it('tau = 0 → RangeError naming tau', () => {
    expect(() => rcStepResponse(1, 0, 1)).toThrow(/tau/);
  });
});

describe('rcRiseTime1090', () => {
  it('τ = 1 ms → 2.197 ms (ln 9 · τ, the textbook 10–90 % rise)', () => {
    expect(rcRiseTime1090(1e-3)).toBeCloseTo(2.1972e-3, 7);
  });
});

describe('rcDelayToThreshold', () => {
  it('τ = 11 ms, 1.2 V of 5 V → −τ·ln(1 − 1.2/5) = 3.0188 ms', () => {
    expect(rcDelayToThreshold(11e-3, 1.2, 5)).toBeCloseTo(-11e-3 * Math.log(1 - 1.2 / 5), 15);
    expect(rcDelayToThreshold(11e-3, 1.2, 5)).toBeCloseTo(3.0188e-3, 7);
  });

  it('threshold above the final value → null (never reached)', () => {
    expect(rcDelayToThreshold(1, 6, 5)).toBeNull();
  });

  it('matches rcStepResponse: v(delay) = threshold', () => {
    const t = rcDelayToThreshold(2e-3, 3.1, 3.3, 0.5) ?? Number.NaN;
    expect(rcStepResponse(t, 2e-3, 3.3, 0.5)).toBeCloseTo(3.1, 12);
  });
});

describe('rcRampResponse', () => {
  const tau = 1e-3;
  const rise = 2e-3;
  const vin = (t: number): number => Math.min(1, Math.max(0, t / rise)) * 5;

  it.each([0.5e-3, 2e-3, 3e-3, 8e-3])(
    't = %d s → matches RK4 of the RC equation to 1e-9 V',
    (t) => {
      expect(rcRampResponse(t, tau, 5, rise)).toBeCloseTo(integrateRc(tau, vin, t, 20000), 9);
    },
  );

  it('long after the ramp → the ramp amplitude', () => {
    expect(rcRampResponse(1, tau, 5, rise)).toBeCloseTo(5, 12);
  });
});

describe('capResDividerStep', () => {
  // Circuit theory: jump C1/(C1+C2), final R2/(R1+R2), τ = (R1‖R2)(C1+C2).
  it('R1 = 90k, C1 = 1n, R2 = 10k, C2 = 9n → initial 0.1 V, final 0.1 V per volt, τ = 90 µs', () => {
    const d = capResDividerStep(1, 90e3, 1e-9, 10e3, 9e-9);
    expect(d.initial).toBeCloseTo(0.1, 12);
    expect(d.final).toBeCloseTo(0.1, 12);
    expect(d.tau).toBeCloseTo(9e-5, 15);
  });

  it('under-compensated divider → starts at C1/(C1+C2)·v and relaxes to the resistive ratio', () => {
    const d = capResDividerStep(10, 100e3, 1e-9, 100e3, 3e-9);
    expect(capResDividerResponse(0, d)).toBeCloseTo(2.5, 12);
    expect(capResDividerResponse(1, d)).toBeCloseTo(5, 9);
    expect(capResDividerResponse(d.tau, d)).toBeCloseTo(5 + (2.5 - 5) * Math.exp(-1), 12);
  });

  it('negative r2 → RangeError naming r2', () => {
    expect(() => capResDividerStep(1, 1, 1, -1, 1)).toThrow(/r2/);
  });
});
