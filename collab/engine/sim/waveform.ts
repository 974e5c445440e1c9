/**
 * Evaluation of independent-source waveforms and the time points where they have corners.
 *
 * At a jump (only `step` has one) the value is right-continuous; the transient loop asks for the
 * left limit when a step lands exactly on the jump, then re-solves with the right limit.
 */
import type { SourceWaveform } from '../netlist';

/** Value of `w` at time `t`; `left` selects the left limit at a jump. */
export function sourceValue(w: SourceWaveform, t: number, left: boolean): number {
  switch (w.kind) {
    case 'dc':
      return w.value;
    case 'step':
      return t > w.t0 || (t === w.t0 && !left) ? w.v1 : w.v0;
    case 'ramp':
      if (t <= w.t0) return w.v0;
      if (t >= w.t0 + w.rise) return w.v1;
      return w.v0 + ((w.v1 - w.v0) * (t - w.t0)) / w.rise;
    case 'pwl':
      return pwlValue(w.points, t);
    case 'exp':
      return t <= w.t0 ? w.v0 : w.v1 + (w.v0 - w.v1) * Math.exp(-(t - w.t0) / w.tau);
  }
}

function pwlValue(points: ReadonlyArray<readonly [number, number]>, t: number): number {
  const n = points.length;
  if (t <= points[0][0]) return points[0][1];
  if (t >= points[n - 1][0]) return points[n - 1][1];
  // Binary search: pwl lists from captures can be long.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid][0] <= t) lo = mid;
    else hi = mid;
  }
  const [t0, v0] = points[lo];
  const [t1, v1] = points[hi];
  return v0 + ((v1 - v0) * (t - t0)) / (t1 - t0);
}

/** True when `w` jumps (value discontinuity) at exactly `t`. */
export function jumpsAt(w: SourceWaveform, t: number): boolean {
  return w.kind === 'step' && w.t0 === t && w.v0 !== w.v1;
}

/** Appends every corner time of `w` (derivative or value discontinuity) to `out`. */
export function collectCorners(w: SourceWaveform, out: number[]): void {
  switch (w.kind) {
    case 'dc':
      return;
    case 'step':
    case 'exp':
      out.push(w.t0);
      return;
    case 'ramp':
      out.push(w.t0, w.t0 + w.rise);
      return;
    case 'pwl':
      for (const p of w.points) out.push(p[0]);
      return;
  }
}
