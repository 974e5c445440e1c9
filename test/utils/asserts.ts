/**
 * Numeric assertions with explicit tolerances, shared by engine tests. A check passes when
 * |actual − expected| ≤ abs + rel·|expected| (both default 0, so give at least one).
 */
import type { SampledWaveform } from '@rampart/collab/engine/netlist';

export interface Tolerance {
  abs?: number;
  rel?: number;
}

function allowed(expected: number, tol: Tolerance): number {
  return (tol.abs ?? 0) + (tol.rel ?? 0) * Math.abs(expected);
}

/** Throws unless `actual` is within `tol` of `expected` (and finite). */
export function expectClose(
  actual: number,
  expected: number,
  tol: Tolerance,
  what = 'value',
): void {
  const diff = Math.abs(actual - expected);
  if (Number.isFinite(actual) && diff <= allowed(expected, tol)) return;
  throw new Error(
    `${what}: expected ${expected} ± ${allowed(expected, tol)} (abs ${tol.abs ?? 0}, rel ${tol.rel ?? 0}), ` +
      `got ${actual} (off by ${diff})`,
  );
}

/** Element-wise `expectClose`; lengths must match. */
export function expectArrayClose(
  actual: ArrayLike<number>,
  expected: ArrayLike<number>,
  tol: Tolerance,
  what = 'array',
): void {
  if (actual.length !== expected.length) {
    throw new Error(`${what}: length ${actual.length}, expected ${expected.length}`);
  }
  for (let i = 0; i < actual.length; i++) expectClose(actual[i], expected[i], tol, `${what}[${i}]`);
}

/** Value of a sampled waveform at t by linear interpolation (held at the ends). */
export function valueAt(w: SampledWaveform, t: number): number {
  const n = w.time.length;
  if (t <= w.time[0]) return w.values[0];
  if (t >= w.time[n - 1]) return w.values[n - 1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (w.time[mid] <= t) lo = mid;
    else hi = mid;
  }
  const t0 = w.time[lo];
  const t1 = w.time[hi];
  return t1 > t0
    ? w.values[lo] + ((w.values[hi] - w.values[lo]) * (t - t0)) / (t1 - t0)
    : w.values[hi];
}

/**
 * Largest |a − b| with both waveforms interpolated onto `points` evenly spaced times in
 * [t0, t1], skipping grid times within `guard` of a time listed in `skip` (instants where one
 * side jumps and interpolation is ambiguous).
 */
export function maxDifference(
  a: SampledWaveform,
  b: SampledWaveform,
  t0: number,
  t1: number,
  points: number,
  skip: readonly number[] = [],
  guard = 0,
): { max: number; at: number } {
  let max = 0;
  let at = t0;
  for (let k = 0; k < points; k++) {
    const t = t0 + ((t1 - t0) * k) / (points - 1);
    if (skip.some((s) => Math.abs(t - s) <= guard)) continue;
    const d = Math.abs(valueAt(a, t) - valueAt(b, t));
    if (d > max) {
      max = d;
      at = t;
    }
  }
  return { max, at };
}

/** Largest |v| over a waveform (full scale for relative comparisons). */
export function fullScale(w: SampledWaveform): number {
  let m = 0;
  for (let i = 0; i < w.values.length; i++) m = Math.max(m, Math.abs(w.values[i]));
  return m;
}
