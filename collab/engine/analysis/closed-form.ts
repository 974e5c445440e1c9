/**
 * Closed-form first-order responses from circuit theory, used beside the simulator so a user
 * sees both legs agree. All inputs SI; every function rejects non-physical arguments.
 */

function assertPositive(name: string, v: number): void {
  if (!(v > 0 && Number.isFinite(v)))
    throw new RangeError(`${name} must be a finite number > 0, got ${v}`);
}

/** v(t) of an RC node charging from v0 towards vFinal: vFinal + (v0 − vFinal)·e^(−t/τ). */
export function rcStepResponse(t: number, tau: number, vFinal: number, v0 = 0): number {
  assertPositive('tau', tau);
  return t <= 0 ? v0 : vFinal + (v0 - vFinal) * Math.exp(-t / tau);
}

/**
 * Time for an RC step response to reach `vth`: t = −τ·ln((vFinal − vth)/(vFinal − v0)),
 * i.e. −τ·ln(1 − vth/V) from 0 V. Undefined (null) when vth is not between v0 and vFinal.
 */
export function rcDelayToThreshold(
  tau: number,
  vth: number,
  vFinal: number,
  v0 = 0,
): number | null {
  assertPositive('tau', tau);
  const ratio = (vFinal - vth) / (vFinal - v0);
  if (!(ratio > 0 && ratio <= 1)) return null;
  return -tau * Math.log(ratio);
}

/** 10 %–90 % rise time of a first-order step response: τ·ln 9 ≈ 2.197 τ. */
export function rcRiseTime1090(tau: number): number {
  assertPositive('tau', tau);
  return tau * Math.log(9);
}

/**
 * RC low-pass driven by a ramp 0 → v over `rise` seconds starting at t = 0:
 * t ≤ rise: k(t − τ(1 − e^(−t/τ))); t > rise: v + kτ(e^(−t/τ) − e^(−(t−rise)/τ)), k = v/rise.
 */
export function rcRampResponse(t: number, tau: number, v: number, rise: number): number {
  assertPositive('tau', tau);
  assertPositive('rise', rise);
  if (t <= 0) return 0;
  const k = v / rise;
  if (t <= rise) return k * (t - tau * (1 - Math.exp(-t / tau)));
  return v + k * tau * (Math.exp(-t / tau) - Math.exp(-(t - rise) / tau));
}

export interface DividerStep {
  /** Output just after the step: v·C1/(C1 + C2). */
  initial: number;
  /** Settled output: v·R2/(R1 + R2). */
  final: number;
  /** (R1 ‖ R2)(C1 + C2). */
  tau: number;
}

/**
 * R1‖C1 from the input to the output and R2‖C2 from the output to ground, driven by a step of v
 * (C1 and R1 are the top elements).
 */
export function capResDividerStep(
  v: number,
  r1: number,
  c1: number,
  r2: number,
  c2: number,
): DividerStep {
  for (const [n, x] of [
    ['r1', r1],
    ['c1', c1],
    ['r2', r2],
    ['c2', c2],
  ] as const)
    assertPositive(n, x);
  return {
    initial: (v * c1) / (c1 + c2),
    final: (v * r2) / (r1 + r2),
    tau: ((r1 * r2) / (r1 + r2)) * (c1 + c2),
  };
}

/** Output of the capacitive-plus-resistive divider at time t after the step. */
export function capResDividerResponse(t: number, d: DividerStep): number {
  return t < 0 ? 0 : d.final + (d.initial - d.final) * Math.exp(-t / d.tau);
}
