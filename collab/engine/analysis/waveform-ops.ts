/**
 * Measurements on any `SampledWaveform` (simulation output or a bench capture): interpolation,
 * threshold crossings, extremes of a difference over a window. Linear between samples.
 */
import type { SampledWaveform } from '../netlist';
import { findCrossings } from '../sim/crossings';

export type Edge = 'rise' | 'fall';

/** Value at time t, linearly interpolated, held at the ends. */
export function valueAt(w: SampledWaveform, t: number): number {
  const { time, values } = w;
  const n = time.length;
  if (n === 0) return 0;
  if (t <= time[0]) return values[0];
  if (t >= time[n - 1]) return values[n - 1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  const dt = time[hi] - time[lo];
  return dt > 0 ? values[lo] + ((values[hi] - values[lo]) * (t - time[lo])) / dt : values[hi];
}

/** First index with time ≥ t. */
function indexAtOrAfter(time: ArrayLike<number>, t: number): number {
  let lo = 0;
  let hi = time.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (time[mid] < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Times in [from, to] where the waveform crosses `level` in the given direction (the
 * simulator's crossing finder: linear between samples, a repeated time is a jump).
 */
export function crossingTimes(
  w: SampledWaveform,
  level: number,
  edge: Edge,
  from = -Infinity,
  to = Infinity,
): number[] {
  return findCrossings(w, level, edge === 'rise' ? 'rising' : 'falling')
    .map((c) => c.t)
    .filter((t) => t >= from && t <= to);
}

/** First crossing in [from, to], or undefined. */
export function firstCrossing(
  w: SampledWaveform,
  level: number,
  edge: Edge,
  from = -Infinity,
  to = Infinity,
): number | undefined {
  return crossingTimes(w, level, edge, from, to)[0];
}

export interface Extreme {
  value: number;
  time: number;
}

/**
 * Minimum (or maximum) over [from, to] of a(t) − b(t); b may be undefined (0 V). Samples of
 * `a` plus the window ends are used; `b` is interpolated onto them when its axis differs.
 */
export function differenceExtreme(
  a: SampledWaveform,
  b: SampledWaveform | undefined,
  which: 'min' | 'max',
  from: number,
  to: number,
): Extreme {
  const sameAxis = b !== undefined && b.time === a.time;
  const diff = (i: number): number =>
    a.values[i] - (b === undefined ? 0 : sameAxis ? b.values[i] : valueAt(b, a.time[i]));
  const atTime = (t: number): number => valueAt(a, t) - (b === undefined ? 0 : valueAt(b, t));
  let best: Extreme = { value: atTime(from), time: from };
  const consider = (value: number, time: number): void => {
    if (which === 'min' ? value < best.value : value > best.value) best = { value, time };
  };
  for (let i = indexAtOrAfter(a.time, from); i < a.time.length && a.time[i] <= to; i++)
    consider(diff(i), a.time[i]);
  consider(atTime(to), to);
  return best;
}

/** Largest fall below the running maximum over [from, to] (0 for a monotonic rise). */
export function largestDip(w: SampledWaveform, from: number, to: number): Extreme {
  let peak = valueAt(w, from);
  let worst: Extreme = { value: 0, time: from };
  for (let i = indexAtOrAfter(w.time, from); i < w.time.length && w.time[i] <= to; i++) {
    const v = w.values[i];
    if (v > peak) peak = v;
    else if (peak - v > worst.value) worst = { value: peak - v, time: w.time[i] };
  }
  return worst;
}

/** Steepest rising slope between consecutive samples in [from, to], V/s. */
export function peakSlope(w: SampledWaveform, from: number, to: number): Extreme {
  let best: Extreme = { value: 0, time: from };
  for (
    let i = Math.max(1, indexAtOrAfter(w.time, from));
    i < w.time.length && w.time[i] <= to;
    i++
  ) {
    const dt = w.time[i] - w.time[i - 1];
    if (dt <= 0) continue;
    const s = (w.values[i] - w.values[i - 1]) / dt;
    if (s > best.value) best = { value: s, time: w.time[i] };
  }
  return best;
}

/** Last time in [from, to] the waveform is outside target ± band, or `from` if never. */
export function lastOutsideBand(
  w: SampledWaveform,
  target: number,
  band: number,
  from: number,
  to: number,
): number {
  let last = from;
  for (let i = indexAtOrAfter(w.time, from); i < w.time.length && w.time[i] <= to; i++) {
    if (Math.abs(w.values[i] - target) > band) last = w.time[i];
  }
  return last;
}
