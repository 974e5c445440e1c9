/**
 * The last accepted solutions since the most recent discontinuity, and the local truncation
 * error estimate built from their divided differences (the usual SPICE-style estimate).
 */
import type { IntegrationMethod } from './integration/integration-method';

/** Interpolation error allowed between accepted points, in units of the step tolerance. */
const INTERPOLATION_TOL_FACTOR = 4;

/** Points kept: the order-2 estimate needs 3 earlier points plus the candidate. */
const DEPTH = 3;

export class SolutionHistory {
  private readonly times = new Float64Array(DEPTH);
  private readonly values: Float64Array;
  /** Points stored (≤ DEPTH), newest at slot (head − 1). */
  count = 0;
  private head = 0;
  /** Unknown with the largest error in the last estimate. */
  worst = -1;
  /**
   * Largest |v| each node has reached in the run: the relative tolerance refers to it, so a
   * rail that is still near 0 V is not held to microvolts (a per-signal reference, as
   * common practice, no source).
   */
  private readonly scale: Float64Array;

  /** @param width Unknowns checked (node voltages only). */
  constructor(private readonly width: number) {
    this.values = new Float64Array(DEPTH * width);
    this.scale = new Float64Array(width);
  }

  private reltol = 1e-4;
  private vntol = 1e-6;

  /**
   * Starts a run: takes the run's tolerances (kept here rather than passed on every step, where
   * each number argument would be boxed) and resets the per-node scales to `scale` (else 0).
   */
  startRun(reltol: number, vntol: number, scale?: Float64Array): void {
    if (scale === undefined) this.scale.fill(0);
    else this.scale.set(scale.subarray(0, this.width));
    this.reltol = reltol;
    this.vntol = vntol;
  }

  /** Largest |v| node `i` reached in the run (or its starting scale, if larger). */
  peak(i: number): number {
    return this.scale[i];
  }

  clear(): void {
    this.count = 0;
    this.head = 0;
  }

  push(t: number, x: Float64Array): void {
    const w = this.width;
    const base = this.head * w;
    const values = this.values;
    const scale = this.scale;
    // One loop, no `subarray` view: this runs on every accepted step.
    for (let i = 0; i < w; i++) {
      const xi = x[i];
      const a = Math.abs(xi);
      if (a > scale[i]) scale[i] = a;
      values[base + i] = xi;
    }
    this.times[this.head] = t;
    this.head = (this.head + 1) % DEPTH;
    if (this.count < DEPTH) this.count++;
  }

  /** Slot of the k-th newest point (0 = newest). */
  private slot(k: number): number {
    return (this.head - 1 - k + 2 * DEPTH) % DEPTH;
  }

  /**
   * Largest ratio error/tolerance over the node voltages for candidate x at time t, for a step
   * taken with `method`; 0 when too few points are stored for an estimate.
   */
  errorRatio(x: Float64Array, t: number, method: IntegrationMethod): number {
    const { reltol, vntol } = this;
    const need = method.order + 1;
    if (this.count < need) return 0;
    const w = this.width;
    const s0 = this.slot(0) * w;
    const s1 = this.slot(1) * w;
    const t0 = this.times[this.slot(0)];
    const t1 = this.times[this.slot(1)];
    const t2 = need > 2 ? this.times[this.slot(2)] : 0;
    const s2 = need > 2 ? this.slot(2) * w : 0;
    const h = t - t0;
    const v = this.values;
    // Both formulas' error is linear in |divided difference|: one call gives the factor, and
    // factor·|dd| is bit-for-bit what the call would return for each node.
    const factor = method.truncationError(h, 1);
    let worst = 0;
    this.worst = -1;
    for (let i = 0; i < w; i++) {
      const xn = x[i];
      const d0 = (xn - v[s0 + i]) / h;
      const d1 = (v[s0 + i] - v[s1 + i]) / (t0 - t1);
      const dd2 = (d0 - d1) / (t - t1);
      let dd = dd2;
      if (need > 2) {
        const d2 = (v[s1 + i] - v[s2 + i]) / (t1 - t2);
        dd = (dd2 - (d1 - d2) / (t0 - t2)) / (t - t2);
      }
      const tol = reltol * Math.max(Math.abs(xn), this.scale[i]) + vntol;
      const r = (factor * Math.abs(dd)) / tol;
      if (r > worst) {
        worst = r;
        this.worst = i;
      }
    }
    return worst;
  }

  /**
   * Longest next step for which straight-line interpolation between accepted points stays
   * within INTERPOLATION_TOL_FACTOR tolerances: the chord error of a parabola is h²/8·|x''|
   * (standard numerical analysis), with x'' = 2·(second divided difference) over the last three
   * points. Output and crossings are interpolated linearly, so this, not the integration error,
   * limits steps on strongly curved waveforms. Infinity with fewer than three points.
   */
  interpolationLimit(): number {
    if (this.count < 3) return Infinity;
    const { reltol, vntol } = this;
    const w = this.width;
    const s0 = this.slot(0);
    const s1 = this.slot(1);
    const s2 = this.slot(2);
    const t0 = this.times[s0];
    const t1 = this.times[s1];
    const t2 = this.times[s2];
    const v = this.values;
    let limit = Infinity;
    for (let i = 0; i < w; i++) {
      const x0 = v[s0 * w + i];
      const x1 = v[s1 * w + i];
      const x2 = v[s2 * w + i];
      const dd2 = ((x0 - x1) / (t0 - t1) - (x1 - x2) / (t1 - t2)) / (t0 - t2);
      const curvature = 2 * Math.abs(dd2);
      if (curvature === 0) continue;
      const tol =
        INTERPOLATION_TOL_FACTOR * (reltol * Math.max(Math.abs(x0), this.scale[i]) + vntol);
      // The square root is monotonic, so it is taken once, of the smallest h².
      const h2 = (8 * tol) / curvature;
      if (h2 < limit) limit = h2;
    }
    return Math.sqrt(limit);
  }
}
