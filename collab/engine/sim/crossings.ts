/**
 * Threshold crossings of any sampled waveform (simulation output, internal steps or a bench
 * capture), located by linear interpolation between samples.
 */
import type { SampledWaveform } from '../netlist';

export type CrossingDirection = 'rising' | 'falling' | 'either';

export interface Crossing {
  /** Interpolated crossing time. */
  t: number;
  direction: 'rising' | 'falling';
}

/**
 * All times where `w` crosses `level` in `direction`. A sample exactly at the level counts
 * once, when the waveform actually passes through it (touching and turning back is no
 * crossing). Repeated times (a jump) cross at that time. Non-finite samples are skipped.
 */
export function findCrossings(
  w: SampledWaveform,
  level: number,
  direction: CrossingDirection = 'either',
): Crossing[] {
  const out: Crossing[] = [];
  const n = Math.min(w.time.length, w.values.length);
  // Side (−1 below, +1 above) and the time the waveform left the other side.
  let side = 0;
  let prevT = NaN;
  let prevV = NaN;
  for (let i = 0; i < n; i++) {
    const t = w.time[i];
    const v = w.values[i];
    if (!Number.isFinite(t) || !Number.isFinite(v)) continue;
    const s = v > level ? 1 : v < level ? -1 : 0;
    if (s !== 0 && side !== 0 && s !== side) {
      const rising = s > 0;
      if (direction === 'either' || (direction === 'rising') === rising) {
        out.push({
          t: crossingTime(prevT, prevV, t, v, level),
          direction: rising ? 'rising' : 'falling',
        });
      }
    }
    if (s !== 0) {
      side = s;
      prevT = t;
      prevV = v;
    } else if (side !== 0) {
      // On the level: the crossing time is here if the waveform continues to the other side.
      prevT = t;
      prevV = v;
    }
  }
  return out;
}

function crossingTime(t0: number, v0: number, t1: number, v1: number, level: number): number {
  if (v0 === level || t1 === t0) return t0;
  return t0 + ((level - v0) * (t1 - t0)) / (v1 - v0);
}
